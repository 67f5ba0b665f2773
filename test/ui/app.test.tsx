import { describe, expect, it } from 'vitest';
import { initialState } from '../../src/ui/state/app-reducer';
import { demoDesign, KEYS, memoryServices, renderApp, settle } from '../helpers/ui';

/** Rising trip of channel `id` as printed in the channels table (x column 'rise'). */
function riseOf(frame: string, id: string): string {
  const row = frame.split('\n').find((l) => new RegExp(`^.${id} `).test(l));
  return row?.trim().split(/\s+/)[5] ?? '';
}

describe('App', () => {
  it('draws every pane of the demo at 80x24 within the terminal size', () => {
    const app = renderApp();
    const lines = app.frame().split('\n');
    expect(lines.length).toBeLessThanOrEqual(24);
    expect(lines.every((l) => [...l].length <= 80)).toBe(true);
    for (const title of ['Channels', 'String', 'Sweep', 'Probe', 'Findings']) expect(app.frame()).toContain(title);
    expect(app.frame()).toContain('? keys');
    app.unmount();
  });

  it('steps the selected resistor with + and shows the new trip points; u undoes it', async () => {
    const app = renderApp();
    const before = riseOf(app.frame(), 'S4');
    await app.press('+');
    expect(app.frame()).toContain('RS1 3k09 -> 3k16 (E96)');
    expect(app.frame()).toContain('[modified]');
    // Raising the top string resistor lowers every tap, so S4 trips lower (demo wiring: signal on IN-).
    expect(Number(riseOf(app.frame(), 'S4'))).toBeLessThan(Number(before));
    await app.press('u');
    expect(riseOf(app.frame(), 'S4')).toBe(before);
    expect(app.frame()).not.toContain('[modified]');
    app.unmount();
  });

  it('moves the probe with the arrow keys and lights the next LED', async () => {
    const app = renderApp({ noColor: true });
    expect(app.frame()).toContain('12.50 V');
    await app.press(KEYS.end);
    expect(app.frame()).toContain('15.00 V');
    expect(app.frame()).toMatch(/●S1 ●S2 ●S3 ●S4/);
    await app.press(KEYS.home);
    expect(app.frame()).toMatch(/○S1 ○S2 ○S3 ○S4/);
    app.unmount();
  });

  it('types a value in a prompt and shows a refused one inline', async () => {
    const app = renderApp();
    await app.press(KEYS.enter, '\u0015', '4', 'x', '7', KEYS.enter);
    // Text the quick readers refuse goes to the unit reader, which is loaded at that moment.
    await app.waitFor('RS1: "4x7"');
    expect(app.frame()).toContain('RS1: "4x7" is not a value in ohms');
    await app.press(KEYS.backspace, KEYS.backspace, 'k', '7', KEYS.enter);
    expect(app.frame()).toContain('RS1 3k09 -> 4k7');
    app.unmount();
  });

  it('says why a disabled key does nothing', async () => {
    const app = renderApp();
    await app.press('x');
    expect(app.frame()).toContain('x: export is not part of this build yet');
    app.unmount();
  });

  it('saves the demo under a name asked for, then writes to it directly', async () => {
    const services = memoryServices();
    const app = renderApp({ services });
    await app.press('+', 's');
    expect(app.frame()).toContain('save as demo.tapline.json');
    await app.press(KEYS.enter);
    await settle();
    expect(services.files.get('/work/demo.tapline.json')?.string[0]).toBeCloseTo(3160, 6);
    expect(app.frame()).toContain('saved /work/demo.tapline.json');
    expect(services.settings.get().recent[0]).toBe('/work/demo.tapline.json');
    app.unmount();
  });

  it('asks before quitting with unsaved changes and stays on n', async () => {
    const app = renderApp();
    await app.press('+', 'q');
    expect(app.frame()).toContain('Unsaved changes. Save before quitting?');
    await app.press('n');
    expect(app.exits).toEqual([]);
    await app.press(KEYS.ctrlC);
    expect(app.frame()).toContain('Save before quitting?');
    await app.press(KEYS.ctrlC);
    expect(app.exits).toEqual([130]);
    app.unmount();
  });

  it('quits at once without unsaved changes', async () => {
    const app = renderApp();
    await app.press('q');
    expect(app.exits).toEqual([0]);
    app.unmount();
  });

  it('writes a draft shortly after an edit', async () => {
    const services = memoryServices();
    const drafts = services.drafts as ReturnType<typeof memoryServices>['drafts'] & { saved: unknown[] };
    const app = renderApp({ services });
    await app.press('+');
    await settle(400);
    expect(drafts.load(null)?.design.string[0]).toBeCloseTo(3160, 6);
    app.unmount();
  });

  it('offers a draft and restores it with y', async () => {
    const d = demoDesign();
    const state = initialState(d, '/work/g.tapline.json', 'g.tapline.json');
    state.question = { kind: 'draft', draft: { file: '/work/g.tapline.json', savedAt: 1_000_000 - 30_000, design: { ...d, string: [3160, ...d.string.slice(1)] } } };
    const app = renderApp({ state });
    expect(app.frame()).toContain('Found unsaved edits from 30 s ago');
    await app.press('y');
    expect(app.frame()).toContain('draft restored');
    expect(app.frame()).toContain('RS1 3k16');
    app.unmount();
  });

  it('shows the help overlay with every key and closes it with Esc', async () => {
    const app = renderApp({ rows: 60 });
    await app.press('?');
    expect(app.frame()).toContain('Keys');
    expect(app.frame()).toContain('step the selected resistor to the next value of the series');
    await app.press(KEYS.escape);
    await settle(50);
    expect(app.frame()).toContain('Channels');
    app.unmount();
  });

  it('scrolls the help a page at a time with PgDn and PgUp', async () => {
    const app = renderApp();
    await app.press('?');
    const first = /Keys (\d+)-(\d+)\/(\d+)/.exec(app.frame());
    expect(first?.[1]).toBe('1');
    await app.press(KEYS.pageDown);
    const paged = /Keys (\d+)-(\d+)\/(\d+)/.exec(app.frame());
    // A page down starts where the first page ended, or a line before it.
    expect(Number(paged?.[1])).toBeGreaterThanOrEqual(Number(first?.[2]) - 1);
    await app.press(KEYS.pageUp);
    expect(/Keys (\d+)-/.exec(app.frame())?.[1]).toBe('1');
    app.unmount();
  });

  it('asks for a larger window below 60x20', () => {
    const app = renderApp({ columns: 59, rows: 20 });
    expect(app.frame()).toContain('Enlarge the window');
    app.unmount();
  });

  it('moves between panes with Tab and edits a target there', async () => {
    const app = renderApp();
    await app.press(KEYS.tab, KEYS.tab);
    expect(app.frame()).toContain('Targets');
    await app.press(KEYS.enter, '\u0015', '1', '1', '.', '9', KEYS.enter);
    expect(app.frame()).toContain('charge step 1 11.80 V -> 11.90 V');
    app.unmount();
  });

  it('handles several keys arriving in one chunk', async () => {
    const app = renderApp();
    await app.press('++');
    expect(app.frame()).toContain('RS1 3k16 -> 3k24');
    app.unmount();
  });

  it('control keys in one chunk (two Tabs, three Tabs) each count, as typed alone', async () => {
    const app = renderApp();
    await app.press('\t\t');
    await app.waitFor('▸ Targets', 2000);
    expect(app.frame()).toContain('▸ Targets');
    await app.press('\t\t\t');
    await app.waitFor('▸ Channels', 2000);
    expect(app.frame()).toContain('▸ Channels');
    app.unmount();
  });

  it('a value and its Enter in one chunk are typed and accepted (a slow link batches keys)', async () => {
    const app = renderApp();
    await app.press(KEYS.enter, '\u0015');
    await app.press('4k7\r');
    await app.waitFor('RS1 3k09 -> 4k7', 2000);
    expect(app.frame()).toContain('RS1 3k09 -> 4k7');
    app.unmount();
  });

  it('a key that opens a prompt, the text and Enter in one chunk go to that prompt', async () => {
    const app = renderApp();
    // g opens the probe prompt, which starts empty; 13.1 V is inside the demo's 10 to 15 V range.
    await app.press('g13.1\r');
    await app.waitFor('Probe 13.10 V', 2000);
    expect(app.frame()).toContain('Probe 13.10 V');
    expect(app.frame()).not.toContain('probe battery voltage =');
    app.unmount();
  });
});
