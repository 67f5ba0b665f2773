import { type Key, useInput } from 'ink';
import { useEffect, useReducer, useRef } from 'react';
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
  // Keys typed faster than a frame, batched by a slow link or sent by a script arrive as one chunk.
  // Its first key (in a prompt: its text up to a line end) is handled now and the rest after the
  // next render, against the state that key made: "g13<Enter>" opens the probe prompt, types 13
  // into it and accepts it.
  const rest = useRef('');
  const [, nextRender] = useReducer((n: number) => n + 1, 0);
  const later = (text: string) => {
    rest.current = text;
    if (text) nextRender();
  };
  const feed = (input: string, key: Key) => {
    const chars = [...input];
    if (chars.length <= 1 || key.ctrl || key.meta) return handle(input, key);
    const plain = (c: string): Key => ({ ...key, shift: /[A-Z]/.test(c) });
    if (activeScope(latest.current.ctx.state) !== 'prompt') {
      handle(chars[0], plain(chars[0]));
      return later(chars.slice(1).join(''));
    }
    const end = input.search(/[\r\n]/);
    if (end < 0) return handle(input, key);
    if (end > 0) {
      handle(input.slice(0, end), key);
      return later(input.slice(end));
    }
    handle('\r', plain('\r'));
    later(input.slice(input.startsWith('\r\n') ? 2 : 1));
  };
  useEffect(() => {
    const text = rest.current;
    if (!text) return;
    rest.current = '';
    feed(text, { ...NO_KEY });
  });
  useInput(feed);
}

/** An Ink key record with no special key or modifier set (plain characters). */
const NO_KEY: Key = {
  upArrow: false, downArrow: false, leftArrow: false, rightArrow: false, pageDown: false, pageUp: false, home: false, end: false,
  return: false, escape: false, ctrl: false, shift: false, tab: false, backspace: false, delete: false, meta: false,
  super: false, hyper: false, capsLock: false, numLock: false,
};
