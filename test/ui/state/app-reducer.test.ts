import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitReader } from '../../../src/engine/values';
import { appReducer, initialState, isModified, selectedField } from '../../../src/ui/state/app-reducer';
import type { AppAction, AppState } from '../../../src/ui/state/app-state';
import { demoDesign } from '../../helpers/ui';

const start = () => initialState(demoDesign(), null, 'demo');
const run = (s: AppState, ...actions: AppAction[]) => actions.reduce(appReducer, s);

// Wrong-unit messages ("is a current") come from the unit reader.
beforeAll(() => loadUnitReader());

describe('app reducer', () => {
  it('starts on the first string resistor with the probe mid-range', () => {
    const s = start();
    expect(selectedField(s)?.label).toBe('RS1');
    // Demo range 10 V..15 V (presets/lead-acid-12v-gauge.tapline.json): middle 12.5 V, exact.
    expect(s.probe.x).toBe(12.5);
  });

  it('steps a string resistor to the next E96 value', () => {
    // IEC 60063 E96: 3.01, 3.09, 3.16 (consecutive values), so 3k09 steps up to 3k16; exact to 1e-9.
    const s = run(start(), { type: 'step', delta: 1 });
    expect(s.design.string[0]).toBeCloseTo(3160, 6);
    expect(s.undo).toHaveLength(1);
    expect(isModified(s)).toBe(true);
  });

  it('steps a resistor down to the previous E96 value', () => {
    // IEC 60063 E96: 3.01 precedes 3.09.
    const s = run(start(), { type: 'step', delta: -1 });
    expect(s.design.string[0]).toBeCloseTo(3010, 6);
  });

  it('undoes and redoes any number of edits in order', () => {
    const s0 = start();
    const edits: AppAction[] = Array.from({ length: 40 }, () => ({ type: 'step', delta: 1 }));
    const s1 = run(s0, ...edits);
    const back = run(s1, ...Array.from({ length: 40 }, () => ({ type: 'undo' }) as AppAction));
    expect(back.design).toBe(s0.design);
    expect(isModified(back)).toBe(false);
    const again = run(back, ...Array.from({ length: 40 }, () => ({ type: 'redo' }) as AppAction));
    expect(again.design.string[0]).toBe(s1.design.string[0]);
  });

  it('drops the redo stack after a new edit', () => {
    const s = run(start(), { type: 'step', delta: 1 }, { type: 'undo' }, { type: 'step', delta: -1 });
    expect(s.redo).toHaveLength(0);
  });

  it('accepts a typed RKM value for the selected resistor', () => {
    const s = run(start(), { type: 'edit-start' }, { type: 'prompt-clear' }, { type: 'prompt-type', text: '3k3' }, { type: 'prompt-submit' });
    // IEC 60062 RKM: 3k3 = 3300 ohms.
    expect(s.design.string[0]).toBe(3300);
    expect(s.prompt).toBeNull();
  });

  it('typing replaces the offered current value; Backspace edits it instead', () => {
    const offered = run(start(), { type: 'edit-start' });
    expect(offered.prompt).toMatchObject({ text: '3k09', offered: true });
    // IEC 60062 RKM: 3k3 = 3300 ohms.
    const typed = run(offered, { type: 'prompt-type', text: '3' }, { type: 'prompt-type', text: 'k3' }, { type: 'prompt-submit' });
    expect(typed.design.string[0]).toBe(3300);
    const edited = run(offered, { type: 'prompt-erase' }, { type: 'prompt-type', text: '1' });
    expect(edited.prompt).toMatchObject({ text: '3k01', offered: false });
  });

  it('accepts a value with units', () => {
    const s = run(start(), { type: 'edit-start' }, { type: 'prompt-clear' }, { type: 'prompt-type', text: '3.3 kohm' }, { type: 'prompt-submit' });
    expect(s.design.string[0]).toBe(3300);
  });

  it('keeps the prompt open with an error naming the field, the value and the fix', () => {
    const s = run(start(), { type: 'edit-start' }, { type: 'prompt-clear' }, { type: 'prompt-type', text: '5 mA' }, { type: 'prompt-submit' });
    expect(s.prompt?.error).toMatch(/^RS1: "5 mA" is a current, not a value in ohms: write 4k7/);
    expect(s.design.string[0]).toBe(start().design.string[0]);
  });

  it('refuses to step a value that is not a resistor and says why', () => {
    const s0 = start();
    const refIdx = ['series', 'ref.bias', 'ref.volts'].indexOf('ref.volts');
    const s = run({ ...s0, selected: { ...s0.selected, string: refIdx } }, { type: 'step', delta: 1 });
    expect(s.design).toBe(s0.design);
    expect(s.message?.text).toContain('not a resistor');
  });

  it('cycles the series with the step keys', () => {
    const s0 = start();
    const s = run({ ...s0, selected: { ...s0.selected, string: 0 } }, { type: 'step', delta: 1 });
    // IEC 60063 lists E3 … E192; after E96 comes E192.
    expect(s.design.series).toBe('E192');
  });

  it('keeps the probe inside the quantity range', () => {
    const s = run(start(), { type: 'probe-move', dx: 100 });
    expect(s.probe.x).toBe(15);
    const t = run(s, { type: 'probe-move', dx: -100 });
    expect(t.probe.x).toBe(10);
  });

  it('reads a typed probe value with units and refuses one outside the range', () => {
    const s = run(start(), { type: 'prompt-open', kind: 'probe', label: 'probe' }, { type: 'prompt-type', text: '12.2 V' }, { type: 'prompt-submit' });
    expect(s.probe.x).toBe(12.2);
    const t = run(start(), { type: 'prompt-open', kind: 'probe', label: 'probe' }, { type: 'prompt-type', text: '20' }, { type: 'prompt-submit' });
    expect(t.prompt?.error).toMatch(/outside the battery voltage range/);
  });

  it('moving the probe or the selection is not an edit', () => {
    const s = run(start(), { type: 'probe-move', dx: 1 }, { type: 'select', delta: 1 }, { type: 'pane', delta: 1 }, { type: 'probe-direction' });
    expect(s.undo).toHaveLength(0);
    expect(isModified(s)).toBe(false);
  });

  it('marks the design saved', () => {
    const s = run(start(), { type: 'step', delta: 1 });
    const t = run(s, { type: 'saved', design: s.design, file: '/x/a.tapline.json', name: 'a.tapline.json' });
    expect(isModified(t)).toBe(false);
    expect(t.file).toBe('/x/a.tapline.json');
  });

  it('restores a draft as an undoable edit', () => {
    const s0 = start();
    const draft = { ...s0.design, string: [1000, ...s0.design.string.slice(1)] };
    const s = run(s0, { type: 'restore-draft', design: draft });
    expect(s.design.string[0]).toBe(1000);
    expect(run(s, { type: 'undo' }).design).toBe(s0.design);
  });

  it('edits a target threshold on the targets pane', () => {
    const s0 = run(start(), { type: 'pane', delta: 2 });
    expect(s0.pane).toBe('targets');
    const s = run(s0, { type: 'edit-start' }, { type: 'prompt-clear' }, { type: 'prompt-type', text: '11.9' }, { type: 'prompt-submit' });
    const f = s.design.targets?.functions[0];
    expect(f?.kind === 'bar' ? f.thresholds[0] : null).toBe(11.9);
  });
});
