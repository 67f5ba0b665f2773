import { describe, expect, it } from 'vitest';
import type { Design } from '../../src/engine/design/types';
import type { ExportFormat } from '../../src/engine/export/export-text';
import type { SpreadReport } from '../../src/engine/spread';
import type { SpreadSummary } from '../../src/ui/state/app-state';
import { KEYS, memoryServices, renderApp, settle } from '../helpers/ui';

type Call = { path: string; design: Design; format: ExportFormat; spread: SpreadReport | undefined };

/** Services whose export records its calls; `existing` paths count as files already there. */
function exportingServices(existing: string[] = [], fail = false) {
  const calls: Call[] = [];
  const services = memoryServices({
    exportDesign: async (path, design, format, spread) => {
      if (fail) throw Object.assign(new Error('no such folder'), { code: 'ENOENT' });
      calls.push({ path, design, format, spread });
    },
    fileExists: (path) => existing.includes(path),
  });
  return { services, calls };
}

describe('App export', () => {
  it('asks for the format, then a path beside the design, and names the file when done', async () => {
    const { services, calls } = exportingServices();
    const app = renderApp({ services });
    await app.press('x');
    expect(app.frame()).toContain('Export as which format?');
    await app.press('r');
    expect(app.frame()).toContain('export report to demo.report.md');
    await app.press(KEYS.enter);
    await settle();
    expect(calls.map((c) => [c.path, c.format])).toEqual([['/work/demo.report.md', 'report']]);
    expect(app.frame()).toContain('exported report to demo.report.md');
    app.unmount();
  });

  it('suggests the ending of each format', async () => {
    const app = renderApp({ services: exportingServices().services });
    for (const [key, name] of [['s', 'demo.cir'], ['b', 'demo.bom.csv'], ['j', 'demo.json']]) {
      await app.press('x', key);
      expect(app.frame()).toContain(name);
      await app.press(KEYS.escape);
    }
    app.unmount();
  });

  it('asks before replacing a file and writes on a second Enter', async () => {
    const { services, calls } = exportingServices(['/work/demo.cir']);
    const app = renderApp({ services });
    await app.press('x', 's', KEYS.enter);
    expect(app.frame()).toContain('exists: press Enter again to replace it');
    expect(calls).toEqual([]);
    await app.press(KEYS.enter);
    await settle();
    expect(calls.map((c) => c.path)).toEqual(['/work/demo.cir']);
    app.unmount();
  });

  it('cancels the format question with Esc without writing', async () => {
    const { services, calls } = exportingServices();
    const app = renderApp({ services });
    await app.press('x', KEYS.escape);
    expect(app.frame()).not.toContain('Export as which format?');
    expect(calls).toEqual([]);
    app.unmount();
  });

  it('says why a write failed, naming the file', async () => {
    const app = renderApp({ services: exportingServices([], true).services });
    await app.press('x', 'b', KEYS.enter);
    await settle();
    expect(app.frame()).toContain('export: cannot write demo.bom.csv: ENOENT');
    app.unmount();
  });

  it('hands the spread run on screen to the report', async () => {
    const { services, calls } = exportingServices();
    const report = { trials: 2000, seed: 1 } as SpreadReport;
    const summary: SpreadSummary = { trials: 2000, report, channels: [] };
    services.spread = () => ({ result: Promise.resolve(summary), cancel: () => undefined });
    const app = renderApp({ services });
    await app.press('m');
    await settle();
    await app.press('x', 'r', KEYS.enter);
    await settle();
    expect(calls[0].spread).toBe(report);
    app.unmount();
  });

  it('lets the report run its own spread when the design changed after the spread', async () => {
    const { services, calls } = exportingServices();
    const summary: SpreadSummary = { trials: 2000, report: { trials: 2000 } as SpreadReport, channels: [] };
    services.spread = () => ({ result: Promise.resolve(summary), cancel: () => undefined });
    const app = renderApp({ services });
    await app.press('m');
    await settle();
    await app.press('+', 'x', 'r', KEYS.enter);
    await settle();
    expect(calls[0].spread).toBeUndefined();
    app.unmount();
  });
});
