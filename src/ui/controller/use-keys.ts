import { type Key, useInput } from 'ink';
import { useRef } from 'react';
import { activeScope, findBinding, type KeyContext, keyName, whyDisabled } from '../keymap';
import type { Controller } from './use-controller';

/** Options of useKeys. */
export interface KeysOptions {
  ctx: KeyContext;
  controller: Controller;
  /** Appends typed text to the open prompt. */
  onType: (text: string) => void;
  /** Shows why a key did nothing. */
  onRefused: (text: string) => void;
  /** False while the screen is too small to act on (only quitting works then). */
  isActive: boolean;
  /** Name keys without arrow characters. */
  ascii: boolean;
}

/** Printable text (no control characters), as typed or pasted into a prompt. */
function printable(input: string): string {
  return [...input].filter((c) => c >= ' ' && c !== '\u007f').join('');
}

/**
 * Maps keys to key-table actions for the topmost scope. A disabled action says why instead of
 * acting; in a prompt, keys that are not bound are typed text.
 */
export function useKeys(options: KeysOptions): void {
  // Keys are read against the latest render's state through a ref, not a closure: the listener
  // Ink re-subscribes after each render runs in a passive effect, which can lag behind fast typing.
  const latest = useRef(options);
  latest.current = options;
  const handle = (input: string, key: Key) => {
    const { ctx, controller, onType, onRefused, isActive, ascii } = latest.current;
    const scope = activeScope(ctx.state);
    const binding = findBinding(scope, input, key);
    if (!isActive && binding?.action !== 'quit' && binding?.action !== 'interrupt') return;
    if (!binding) {
      if (scope === 'prompt' && !key.ctrl && !key.meta) {
        const text = printable(input);
        if (text) onType(text);
      }
      return;
    }
    const why = scope === 'main' ? whyDisabled(binding, ctx) : null;
    if (why) {
      onRefused(`${keyName(binding.keys[0], ascii)}: ${why}`);
      return;
    }
    controller.run(binding.action);
  };
  useInput((input, key) => {
    // Keys typed faster than a frame (or sent by a script) arrive as one chunk of text: outside a
    // prompt each character is its own key.
    if (activeScope(latest.current.ctx.state) !== 'prompt' && input.length > 1 && !key.ctrl && !key.meta && [...input].length > 1) {
      for (const c of input) handle(c, { ...key, shift: /[A-Z]/.test(c) });
      return;
    }
    handle(input, key);
  });
}
