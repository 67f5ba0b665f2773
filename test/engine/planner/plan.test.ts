import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import type { TargetFunction, Targets } from '../../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../../src/engine/parts';
import { plan } from '../../../src/engine/planner/index';
import { batteryDesign, issueExample } from './fixtures';

// Each case is planned, then the realised design is analysed afresh by the engine; the
// engine's trip points must match the planner's report (1e-9 V) and lie within the allowance.
const cases: { name: string; fns: TargetFunction[]; over?: Partial<Targets> }[] = [
  { name: 'issue example: bar steps and an outside window', fns: issueExample().targets!.functions, over: { stringBudget: 60e-6 } },
  { name: 'bar, bar mode, rising anchor', fns: [{ kind: 'bar', id: 'b', thresholds: [11.9, 12.2, 12.4, 12.6], hysteresis: 0.1, anchor: 'rising', mode: 'bar' }] },
  { name: 'bar, dot mode, falling anchor', fns: [{ kind: 'bar', id: 'd', thresholds: [11.9, 12.2, 12.4, 12.6], hysteresis: 0.1, anchor: 'falling', mode: 'dot' }] },
  { name: 'window outside, LED', fns: [{ kind: 'window', id: 'w', low: 10.5, high: 14.8, hysteresis: 0.1, anchor: 'centre', sense: 'outside', load: 'led' }] },
  { name: 'window inside, logic', fns: [{ kind: 'window', id: 'w', low: 11, high: 14, hysteresis: 0.1, anchor: 'centre', sense: 'inside', load: 'logic' }] },
  { name: 'single below, relay driver', fns: [{ kind: 'single', id: 's', threshold: 11.5, hysteresis: 0.2, anchor: 'rising', polarity: 'below', load: 'relay' }] },
  { name: 'single above, LED, tap feedback', fns: [{ kind: 'single', id: 's', threshold: 13.5, hysteresis: 0.2, anchor: 'falling', polarity: 'above', load: 'led' }], over: { feedback: 'tap' } },
  { name: 'single above, LED, input-side feedback', fns: [{ kind: 'single', id: 's', threshold: 13.5, hysteresis: 0.2, anchor: 'falling', polarity: 'above', load: 'led' }], over: { feedback: 'input' } },
  { name: 'bar with input-side feedback', fns: [{ kind: 'bar', id: 'b', thresholds: [11.9, 12.2, 12.6], hysteresis: 0.1, anchor: 'centre', mode: 'bar' }], over: { feedback: 'input' } },
];

describe('planned designs re-analysed by the engine meet their targets', () => {
  for (const c of cases) {
    test(c.name, () => {
      const result = plan(batteryDesign(c.fns, c.over));
      expect(result.problems).toEqual([]);
      expect(result.ok).toBe(true);
      const analysis = analyze(result.design);
      for (const row of result.rows) {
        const ch = analysis.channels.find((x) => x.id === row.channel)!;
        const x = ch[row.edge]!.x;
        expect(x).toBeCloseTo(row.realised!, 9);
        expect(Math.abs(x - row.target)).toBeLessThanOrEqual(Math.abs(row.error!) + 1e-9);
        expect(Math.abs(x - row.target)).toBeLessThanOrEqual(result.design.targets!.allowance);
      }
    });
  }

  test('every trip point gets a row, rising and falling', () => {
    const result = plan(issueExample());
    expect(result.rows).toHaveLength(2 * 6);
  });

  test('feedback placement: tap-side for a channel with its own tap, input-side when the signal is on +', () => {
    const result = plan(batteryDesign([
      { kind: 'single', id: 'up', threshold: 13.5, hysteresis: 0.2, anchor: 'centre', polarity: 'above', load: 'led' },
      { kind: 'single', id: 'dn', threshold: 11.5, hysteresis: 0.2, anchor: 'centre', polarity: 'below', load: 'led' },
    ]));
    const up = result.design.channels.find((c) => c.id === 'up')!;
    const dn = result.design.channels.find((c) => c.id === 'dn')!;
    expect(up.seriesPlus).toBeUndefined();
    expect(dn.seriesPlus).toBeGreaterThan(0);
  });

  test('coincident thresholds share one tap', () => {
    const result = plan(batteryDesign([
      { kind: 'single', id: 'a', threshold: 12.5, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'logic' },
      { kind: 'single', id: 'b', threshold: 12.5, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'led' },
    ]));
    expect(result.design.string).toHaveLength(2);
    expect(result.design.channels.map((c) => c.plus)).toEqual(['T1', 'T1']);
    expect(result.ok).toBe(true);
  });

  test('realised values are all in the chosen series or reported as pairs', () => {
    const result = plan(issueExample());
    expect(result.pairs).toEqual([]);
    for (const v of result.values) expect(result.values.length > 0 && v.ohms > 0).toBe(true);
  });
});

describe('impossible targets get their specific message', () => {
  test('steps closer than the hysteresis', () => {
    const r = plan(batteryDesign([{ kind: 'bar', id: 'b', thresholds: [12, 12.05], hysteresis: 0.1, anchor: 'rising', mode: 'bar' }]));
    expect(r.ok).toBe(false);
    expect(r.problems[0].message).toMatch(/not more than the hysteresis/);
  });

  test('too many channels for the allowed packages', () => {
    const r = plan(batteryDesign([{ kind: 'bar', id: 'b', thresholds: [11, 11.5, 12, 12.5, 13], hysteresis: 0.1, anchor: 'rising', mode: 'bar' }], { maxPackages: 1 }));
    expect(r.problems[0].message).toMatch(/5 channels need 2 quad packages, more than the 1 allowed/);
  });

  test('wired-OR window refused on push-pull parts', () => {
    const d = batteryDesign([{ kind: 'window', id: 'w', low: 11, high: 14, hysteresis: 0.1, anchor: 'centre', sense: 'outside', load: 'logic' }]);
    d.supply = { kind: 'fixed', volts: 5, min: 4.5, max: 5.5 };
    d.input = { signal: 'voltage', offset: 0, gain: 0.25 };
    d.part = { ...BUILTIN_PARTS['cmos-pp-quad'] };
    const r = plan(d);
    expect(r.problems.some((p) => /push-pull outputs: one would drive high while the other sinks/.test(p.message))).toBe(true);
  });

  test('common-mode range: the reference above the input range', () => {
    const d = batteryDesign([{ kind: 'single', id: 's', threshold: 3.5, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'led' }]);
    d.quantity = { ...d.quantity, min: 3, max: 5 };
    const r = plan(d);
    expect(r.problems[0].message).toMatch(/^common-mode range: the reference/);
  });

  test('budget: a tiny string budget makes bias current move trips beyond the allowance', () => {
    const r = plan(batteryDesign([{ kind: 'single', id: 's', threshold: 12, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'led' }], { stringBudget: 0.1e-6 }));
    expect(r.problems[0].message).toMatch(/^string budget/);
  });

  test('a measured supply cannot feed the string directly', () => {
    const d = batteryDesign([{ kind: 'single', id: 's', threshold: 12, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'led' }]);
    d.reference = { kind: 'supply' };
    expect(plan(d).problems[0].message).toMatch(/every threshold would move with x/);
  });

  test('no targets', () => {
    const d = batteryDesign([]);
    expect(plan(d).problems[0].message).toMatch(/no targets/);
  });
});
