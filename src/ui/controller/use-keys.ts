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
    if (activeScope(latest.current.ctx.state) !== 'prompt') {
      handle(...charKey(chars[0]));
      return later(chars.slice(1).join(''));
    }
    const end = input.search(/[\r\n]/);
    if (end < 0) return handle(input, key);
    if (end > 0) {
      handle(input.slice(0, end), key);
      return later(input.slice(end));
    }
    handle(...charKey('\r'));
    later(input.slice(input.startsWith('\r\n') ? 2 : 1));
  };
  useEffect(() => {
    const text = rest.current;
    if (!text) return;
    rest.current = '';
    // The rest of a chunk carries no key flags: a last lone character is read as it would be alone.
    if ([...text].length === 1) handle(...charKey(text));
    else feed(text, { ...NO_KEY });
  });
  useInput(feed);
}

/**
 * One character of a chunk as Ink reports it when it arrives alone: Tab, Enter (CR or LF),
 * Backspace, Delete, Esc and Ctrl+letter set their flags (a Ctrl+letter's input is the letter),
 * anything else is text.
 * A chunk of several keys reaches `useInput` as plain text with no flags: "\t\t" is not a Tab.
 */
function charKey(c: string): [string, Key] {
  const key = { ...NO_KEY };
  if (c === '\r' || c === '\n') key.return = true;
  else if (c === '\t') key.tab = true;
  else if (c === '\b') key.backspace = true;
  else if (c === '\u007f') key.delete = true;
  else if (c === '\u001b') key.escape = key.meta = true;
  else if (c >= '\u0001' && c <= '\u001a') {
    key.ctrl = true;
    return [String.fromCharCode(c.charCodeAt(0) + 96), key];
  } else {
    key.shift = /[A-Z]/.test(c);
    return [c, key];
  }
  return ['', key];
}

/** An Ink key record with no special key or modifier set (plain characters). */
const NO_KEY: Key = {
  upArrow: false, downArrow: false, leftArrow: false, rightArrow: false, pageDown: false, pageUp: false, home: false, end: false,
  return: false, escape: false, ctrl: false, shift: false, tab: false, backspace: false, delete: false, meta: false,
  super: false, hyper: false, capsLock: false, numLock: false,
};
