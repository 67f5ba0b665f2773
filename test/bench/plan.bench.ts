import type { Design } from '../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../src/engine/parts';
import { plan } from '../../src/engine/planner/index';
import { makeDesign } from '../helpers/designs';
import { median } from './measure';

/**
 * An 8-step E96 bar with hysteresis on every step: a 12 V lead-acid gauge (bipolar open-collector
 * quads, 2.5 V shunt reference, powered by the battery it measures) on two packages.
 */
function eightSteps(): Design {
  return makeDesign({
    name: 'bench: 8-step bar',
    quantity: { name: 'battery voltage', unit: 'V', min: 10, max: 15, noise: 0 },
    supply: { kind: 'measured' },
    reference: { kind: 'shunt', volts: 2.5, bias: 4.7e3, rdyn: 0.2, minCurrent: 1e-3, maxCurrent: 100e-3, tolerance: 0.005 },
    part: { ...BUILTIN_PARTS['bipolar-oc-quad'] },
    string: [],
    channels: [],
    targets: {
      functions: [{ kind: 'bar', id: 'bar', thresholds: [11, 11.5, 12, 12.5, 13, 13.5, 14, 14.5], hysteresis: 0.1, anchor: 'rising', mode: 'bar' }],
      series: 'E96',
      tolerance: 0.01,
      stringBudget: 100e-6,
      inputBudget: 100e-6,
      led: { knee: 1.9, rdyn: 20, current: 5e-3 },
      pullup: 10e3,
      maxPackages: 2,
      feedback: 'auto',
      allowance: 0.05,
    },
  });
}

/** Median wall time of planning the 8-step E96 bar (closure and snapping included); limit 50 ms. */
export async function benchPlan(): Promise<{ name: string; medianMs: number; limitMs: number }> {
  const design = eightSteps();
  for (let k = 0; k < 3; k++) plan(design);
  const times: number[] = [];
  for (let k = 0; k < 15; k++) {
    const t0 = performance.now();
    const result = plan(design);
    times.push(performance.now() - t0);
    if (!result.ok) throw new Error(`bench design did not plan: ${result.problems.map((p) => p.message).join('; ')}`);
  }
  return { name: 'plan 8-step E96 bar with hysteresis', medianMs: median(times), limitMs: 50 };
}
