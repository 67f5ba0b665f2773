import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { exportNeedsSpread, exportText } from '../../../src/engine/export/export-text';
import { runSpread } from '../../../src/engine/spread';
import { demoDesign } from '../../helpers/ui';

describe('exportText', () => {
  const design = demoDesign();

  it('writes a SPICE netlist that ends with .end', () => {
    // SPICE input decks end with a .end line (SPICE3 user's manual, "input format").
    expect(exportText({ design, format: 'spice' }).trimEnd().split('\n').at(-1)?.toLowerCase()).toBe('.end');
  });

  it('writes a bill of materials that an RFC 4180 parser reads as rows of equal length', () => {
    // csv-parse is an independent RFC 4180 reader; strict column counts are its default.
    const rows = parse(exportText({ design, format: 'bom' })) as string[][];
    expect(rows.length).toBeGreaterThan(1);
  });

  it('uses a spread it is given instead of running its own', () => {
    const spread = runSpread(design, { trials: 50, seed: 7 });
    const json = JSON.parse(exportText({ design, format: 'json', spread }));
    expect(json.spread.trials).toBe(50);
    expect(json.spread.seed).toBe(7);
  });

  it('runs 2000 trials with seed 1 when no spread is given, as the command line does', () => {
    const json = JSON.parse(exportText({ design, format: 'json', analysis: analyze(design) }));
    expect(json.spread.trials).toBe(2000);
    expect(json.spread.seed).toBe(1);
  });

  it('leaves the spread out when told to', () => {
    expect(exportText({ design, format: 'report', spread: null })).not.toContain('trials');
  });

  it('needs the spread for the report and JSON only', () => {
    expect(['spice', 'bom', 'report', 'json'].map((f) => exportNeedsSpread(f as 'spice'))).toEqual([false, false, true, true]);
  });
});
