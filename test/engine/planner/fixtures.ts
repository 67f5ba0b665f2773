import type { Design, Targets, TargetFunction } from '../../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../../src/engine/parts';
import { makeDesign } from '../../helpers/designs';

/** Planner targets with the project defaults; override any field. */
export function targets(functions: TargetFunction[], over: Partial<Targets> = {}): Targets {
  return {
    functions,
    series: 'E96',
    tolerance: 0.01,
    stringBudget: 100e-6,
    inputBudget: 50e-6,
    led: { knee: 1.9, rdyn: 20, current: 5e-3 },
    pullup: 10e3,
    maxPackages: 4,
    feedback: 'auto',
    allowance: 0.05,
    ...over,
  };
}

/**
 * A 12 V lead-acid gauge skeleton: the bipolar open-collector class powered by the battery it
 * measures (10–15 V), a 2.5 V shunt reference, no channels yet; the planner fills them in.
 */
export function batteryDesign(functions: TargetFunction[], over: Partial<Targets> = {}): Design {
  return makeDesign({
    quantity: { name: 'battery voltage', unit: 'V', min: 10, max: 15, noise: 0 },
    supply: { kind: 'measured' },
    reference: { kind: 'shunt', volts: 2.5, bias: 4.7e3, rdyn: 0.2, minCurrent: 1e-3, maxCurrent: 100e-3, tolerance: 0.005 },
    part: { ...BUILTIN_PARTS['bipolar-oc-quad'] },
    string: [],
    channels: [],
    targets: targets(functions, over),
  });
}

/** The issue's example: LED steps at 11.9, 12.2, 12.4, 12.6 V, a 10.5/14.8 V window, E96, 60 µA string. */
export function issueExample(): Design {
  return batteryDesign(
    [
      { kind: 'bar', id: 'bar', thresholds: [11.9, 12.2, 12.4, 12.6], hysteresis: 0.1, anchor: 'rising', mode: 'bar' },
      { kind: 'window', id: 'win', low: 10.5, high: 14.8, hysteresis: 0.1, anchor: 'centre', sense: 'outside', load: 'led' },
    ],
    { stringBudget: 60e-6 },
  );
}
