/**
 * Reads the planner targets of a design file, filling the defaults in `defaults.ts` and checking
 * that thresholds are ordered and sit inside the x range.
 */
import { TARGET_DEFAULTS as D } from './defaults';
import type { FunctionFile, TargetsFile } from './file-types';
import { pathOf } from './problems';
import { fraction, nonNegative, positive, type Reader } from './reader';
import type { Design, TargetFunction, Targets } from './types';

function inRange(design: Design, x: number, path: string, r: Reader): void {
  const { min, max, unit } = design.quantity;
  if (x < min || x > max) r.warn(path, `${x} ${unit} lies outside the x range ${min}..${max} ${unit}; the sweep will not reach it`);
}

function readFunction(f: FunctionFile, at: string, design: Design, r: Reader): TargetFunction {
  const hysteresis = r.x(f.hysteresis, pathOf(at, 'hysteresis'), nonNegative('hysteresis'));
  const anchor = f.anchor ?? D.anchor;
  if (f.kind === 'bar') {
    const thresholds = f.thresholds.map((t, i) => r.x(t, pathOf(at, 'thresholds', i)));
    thresholds.forEach((t, i) => {
      if (i > 0 && !(t > thresholds[i - 1])) r.problem(pathOf(at, 'thresholds', i), f.thresholds[i], 'thresholds must rise from first to last; sort them');
      else inRange(design, t, pathOf(at, 'thresholds', i), r);
    });
    return { kind: 'bar', id: f.id, thresholds, hysteresis, anchor, mode: f.mode ?? D.mode };
  }
  if (f.kind === 'window') {
    const low = r.x(f.low, pathOf(at, 'low'));
    const high = r.x(f.high, pathOf(at, 'high'));
    if (low >= high) r.problem(pathOf(at, 'high'), f.high, 'must be above low');
    inRange(design, low, pathOf(at, 'low'), r);
    inRange(design, high, pathOf(at, 'high'), r);
    return { kind: 'window', id: f.id, low, high, hysteresis, anchor, sense: f.sense ?? D.sense, load: f.load ?? D.load };
  }
  const threshold = r.x(f.threshold, pathOf(at, 'threshold'));
  inRange(design, threshold, pathOf(at, 'threshold'), r);
  return { kind: 'single', id: f.id, threshold, hysteresis, anchor, polarity: f.polarity, load: f.load ?? D.load };
}

/** The resolved targets of a design whose other sections are already read into `design`. */
export function resolveTargets(t: TargetsFile, design: Design, r: Reader): Targets {
  const ids = new Set<string>();
  const functions = t.functions.map((f, i) => {
    const at = pathOf('targets', 'functions', i);
    if (ids.has(f.id)) r.problem(pathOf(at, 'id'), f.id, 'target ids must be unique; rename this one');
    ids.add(f.id);
    return readFunction(f, at, design, r);
  });
  const led = t.led ?? {};
  const span = design.quantity.max - design.quantity.min;
  return {
    functions,
    series: t.series ?? design.series,
    tolerance: r.optional(t.tolerance, design.resistorTolerance, 'targets.tolerance', 'ratio', fraction('a tolerance')),
    stringBudget: r.optional(t.stringBudget, D.stringBudget, 'targets.stringBudget', 'A', positive('a current budget')),
    inputBudget: r.optional(t.inputBudget, D.inputBudget, 'targets.inputBudget', 'A', positive('a current budget')),
    led: {
      knee: r.optional(led.knee, D.led.knee, 'targets.led.knee', 'V', positive('a knee voltage')),
      rdyn: r.optional(led.rdyn, D.led.rdyn, 'targets.led.rdyn', 'ohm'),
      current: r.optional(led.current, D.led.current, 'targets.led.current', 'A', positive('an LED current')),
    },
    pullup: r.optional(t.pullup, D.pullup, 'targets.pullup', 'ohm'),
    maxPackages: t.maxPackages ?? D.maxPackages,
    feedback: t.feedback ?? D.feedback,
    allowance: t.allowance === undefined ? D.allowanceOfRange * span : r.x(t.allowance, 'targets.allowance', positive('an allowance')),
  };
}
