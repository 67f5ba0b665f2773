/**
 * How x reaches the sense node and what the string hangs from: the input scaling divider (sized
 * inside the input budget and the part's common-mode range), the reference voltage and, for a
 * shunt reference, its bias resistor (regulating over the whole supply range).
 */
import type { Design, Targets } from '../design/types';
import { stepInSeries } from '../series';
import { snapString } from './snap';
import type { PlanProblem } from './types';

/** Top tap kept at most this fraction of the reference: room for the top string resistor (common practice, no source). */
export const TOP_TAP_FRACTION = 0.8;
/** Margin kept below the common-mode limit (V): common practice, no source. */
export const CM_MARGIN = 0.1;

/** Comparator supply at x (V): x itself for a measured supply, the nominal rail otherwise. */
export function supplyAt(design: Design, x: number): number {
  return design.supply.kind === 'measured' ? x : design.supply.volts;
}

/** Lowest and highest supply the design must work over (V). */
export function supplyRange(design: Design): { min: number; max: number } {
  const s = design.supply;
  return s.kind === 'measured' ? { min: design.quantity.min, max: design.quantity.max } : { min: s.min, max: s.max };
}

/** The sense node as an affine map of x, unloaded: V(in) = a0 + a1·x (V), and its source resistance (ohms). */
export interface Sense {
  a0: number;
  a1: number;
  rth: number;
}

/** Voltage the string hangs from (V), or a problem. */
export function referenceVolts(design: Design): number | PlanProblem {
  const ref = design.reference;
  if (ref.kind === 'supply') {
    if (design.supply.kind === 'measured') {
      return {
        target: 'design',
        message: 'the string would hang from the supply, and the supply is x itself: every threshold would move with x.',
        fix: 'Use a shunt or external reference (reference.kind).',
      };
    }
    return design.supply.volts;
  }
  return ref.volts;
}

/**
 * Sizes the input path in place (design.input.divider) so the highest trip sits at most at
 * TOP_TAP_FRACTION of the reference and the sense node stays inside the common-mode range over
 * the whole x range; the divider draws at most targets.inputBudget. Returns the sense map.
 */
export function planInput(design: Design, t: Targets, vref: number, xTop: number, xBottom: number): Sense | PlanProblem {
  const input = design.input;
  const { min, max } = design.quantity;
  const part = design.part;
  const unit = design.quantity.unit;
  if (input.gain <= 0) {
    return { target: 'design', message: `input.gain = ${input.gain}: the planner needs the sense signal to rise with x.`, fix: 'Give a positive gain (swap the sensor leads or the quantity sign).' };
  }
  const cmTop = (x: number) => supplyAt(design, x) - part.cmHeadroom - CM_MARGIN;
  if (vref > Math.min(cmTop(min), cmTop(max))) {
    return {
      target: 'design',
      message: `common-mode range: the reference (${vref} V) is above the part's input range, which ends ${part.cmHeadroom} V below the supply (${supplyAt(design, min)} V at x = ${min} ${unit}).`,
      fix: 'Use a lower reference, raise the lowest supply, or pick a part class with a wider input range.',
    };
  }
  if (input.signal === 'current') {
    const shunt = input.shunt ?? 250;
    const sense = { a0: shunt * input.offset, a1: shunt * input.gain, rth: shunt };
    if (sense.a0 + sense.a1 * xTop > TOP_TAP_FRACTION * vref) {
      return { target: 'design', message: `the loop shunt (${shunt} Ω) puts the highest trip at ${(sense.a0 + sense.a1 * xTop).toPrecision(3)} V, above ${TOP_TAP_FRACTION} of the ${vref} V reference.`, fix: 'Use a smaller shunt or a higher reference.' };
    }
    return sense;
  }
  const sig = (x: number) => input.offset + input.gain * x;
  if (sig(xBottom) <= 0) {
    return { target: 'design', message: `the lowest trip (${xBottom} ${unit}) gives a sensor signal of ${sig(xBottom)} V: nothing to compare.`, fix: 'Raise the lowest threshold or fix input.offset.' };
  }
  let rho = Math.min(1, (TOP_TAP_FRACTION * vref) / sig(xTop));
  for (const x of [min, max]) {
    if (sig(x) <= 0) continue;
    const room = cmTop(x);
    if (room <= 0) {
      return {
        target: 'design',
        message: `common-mode range: at x = ${x} ${unit} the supply is ${supplyAt(design, x)} V, leaving no input range (the part needs ${part.cmHeadroom} V of headroom).`,
        fix: 'Raise quantity.min to where the part works, or pick a part class with rail-to-rail inputs.',
      };
    }
    rho = Math.min(rho, room / sig(x));
  }
  if (rho >= 1) {
    delete input.divider;
    return { a0: input.offset, a1: input.gain, rth: 0 };
  }
  rho *= 0.97;
  const minTotal = sig(max) / t.inputBudget;
  const snapped = snapString([minTotal * (1 - rho), minTotal * rho], design.series, minTotal);
  if (!snapped) return { target: 'design', message: 'no standard divider fits the input budget.', fix: 'Raise targets.inputBudget.' };
  const [top, bottom] = snapped.values;
  input.divider = { top, bottom };
  const r = bottom / (top + bottom);
  return { a0: r * input.offset, a1: r * input.gain, rth: (top * bottom) / (top + bottom) };
}

/**
 * Sizes the shunt reference bias resistor in place so the reference keeps at least its least
 * current (with 25 % margin, common practice, no source) at the lowest supply while feeding
 * `load` (A), snapped down to the series. Problems: no headroom, or too much current at the top.
 */
export function planBias(design: Design, load: number): PlanProblem | null {
  const ref = design.reference;
  if (ref.kind !== 'shunt') return null;
  const { min, max } = supplyRange(design);
  if (min <= ref.volts) {
    return {
      target: 'design',
      message: `the shunt reference (${ref.volts} V) cannot regulate: the supply falls to ${min} V.`,
      fix: 'Raise the lowest supply (quantity.min for a measured supply) or use a lower reference.',
    };
  }
  const ideal = (min - ref.volts) / (1.25 * (ref.minCurrent + load));
  const bias = stepInSeries(ideal, design.series, 0) > ideal ? stepInSeries(ideal, design.series, -1) : stepInSeries(ideal, design.series, 0);
  ref.bias = bias;
  const top = (max - ref.volts) / bias;
  if (top > ref.maxCurrent) {
    return {
      target: 'design',
      message: `the shunt reference would carry up to ${(top * 1e3).toPrecision(3)} mA at the ${max} V supply, over its ${(ref.maxCurrent * 1e3).toPrecision(3)} mA rating, once the bias resistor holds regulation at ${min} V.`,
      fix: 'Narrow the supply range, or feed the reference from a pre-regulated rail.',
    };
  }
  return null;
}
