import type { Key } from 'ink';
import { describe, expect, it } from 'vitest';
import { activeScope, findBinding, KEYMAP, keyName, type KeyContext, whyDisabled } from '../../src/ui/keymap';
import { appReducer, initialState } from '../../src/ui/state/app-reducer';
import { demoDesign } from '../helpers/ui';

const noKey: Key = {
  upArrow: false, downArrow: false, leftArrow: false, rightArrow: false, pageDown: false, pageUp: false, home: false, end: false,
  return: false, escape: false, ctrl: false, shift: false, tab: false, backspace: false, delete: false, meta: false,
  super: false, hyper: false, capsLock: false, numLock: false,
};
const ctx = (over: Partial<KeyContext> = {}): KeyContext => ({ state: initialState(demoDesign(), null, 'demo'), hasPlanner: true, hasSpread: true, hasExport: false, ...over });

describe('key table', () => {
  it('binds no key twice within one scope', () => {
    const seen = new Set<string>();
    for (const b of KEYMAP) {
      for (const k of b.keys) {
        const id = `${b.scope}:${JSON.stringify(k)}`;
        if (seen.has(id) && b.action !== 'interrupt') throw new Error(`duplicate ${id}`);
        seen.add(id);
      }
    }
  });

  it('describes every binding', () => {
    for (const b of KEYMAP) expect(b.description.length, b.action).toBeGreaterThan(5);
  });

  it('routes Tab and Shift+Tab to our own pane switching', () => {
    expect(findBinding('main', '', { ...noKey, tab: true })?.action).toBe('pane-next');
    expect(findBinding('main', '', { ...noKey, tab: true, shift: true })?.action).toBe('pane-prev');
  });

  it('sends keys to the export question while it is asked, r choosing the report', () => {
    const state = appReducer(initialState(demoDesign(), null, 'demo'), { type: 'ask', question: { kind: 'export' } });
    expect(activeScope(state)).toBe('export');
    expect(findBinding('export', 'r', noKey)?.action).toBe('export-report');
  });

  it('treats the Backspace byte (reported by Ink as delete) as erase in a prompt', () => {
    expect(findBinding('prompt', '', { ...noKey, delete: true })?.action).toBe('prompt-erase');
  });

  it('binds Ctrl+C to quitting through the unsaved-changes question', () => {
    expect(findBinding('main', 'c', { ...noKey, ctrl: true })?.action).toBe('interrupt');
    expect(findBinding('quit', 'c', { ...noKey, ctrl: true })?.action).toBe('interrupt');
  });

  it('types letters in a prompt instead of running main-screen actions', () => {
    expect(findBinding('prompt', 'q', noKey)).toBeUndefined();
  });

  it('says why export is off when the build has no export', () => {
    const b = KEYMAP.find((k) => k.action === 'export')!;
    expect(whyDisabled(b, ctx())).toMatch(/not part of this build/);
  });

  it('says why stepping is off on a voltage', () => {
    const s = initialState(demoDesign(), null, 'demo');
    const b = KEYMAP.find((k) => k.action === 'step-up')!;
    expect(whyDisabled(b, ctx({ state: { ...s, selected: { ...s.selected, string: 2 } } }))).toMatch(/reference voltage is not a resistor/);
  });

  it('says why undo is off before any edit and on after one', () => {
    const s = initialState(demoDesign(), null, 'demo');
    const b = KEYMAP.find((k) => k.action === 'undo')!;
    expect(whyDisabled(b, ctx({ state: s }))).toBe('no edits to undo');
    expect(whyDisabled(b, ctx({ state: appReducer(s, { type: 'step', delta: 1 }) }))).toBeNull();
  });

  it('gives the topmost layer the keys', () => {
    const s = initialState(demoDesign(), null, 'demo');
    expect(activeScope(s)).toBe('main');
    expect(activeScope({ ...s, overlay: 'help' })).toBe('help');
    expect(activeScope(appReducer({ ...s, overlay: 'help' }, { type: 'edit-start' }))).toBe('prompt');
    expect(activeScope({ ...s, question: { kind: 'quit' } })).toBe('quit');
  });

  it('names keys without arrows in ASCII mode', () => {
    expect(keyName({ name: 'up' }, true)).toBe('Up');
    expect(keyName({ name: 'up' }, false)).toBe('↑');
  });
});
