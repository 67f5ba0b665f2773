/**
 * Standard values for a closed model (ENGINE.md §3.4): the string snapped jointly inside its
 * budget, feedback re-closed on the snapped string then snapped by a neighbour search against the
 * exact sweep, and two-resistor pairs where one value misses by more than the allowance.
 */
import type { Channel } from '../design/types';
import { nearestInSeries, stepInSeries } from '../series';
import { close, measure, worstError } from './close';
import { bestPair, candidatesFor, snapScales, snapString, stringCost, tapFractions } from './snap';
import type { Model } from './synthesize';
import type { PairOffer, PlanProblem } from './types';

/** Snaps every planned value in place. Returns the pairs used, or a problem. */
export function standardise(model: Model): { pairs: PairOffer[]; problem: PlanProblem | null } {
  const { design, targets, sense } = model;
  const pairs: PairOffer[] = [];
  const ideal = design.string.slice();
  const minTotal = model.vref / targets.stringBudget;
  const snapped = snapString(ideal, design.series, minTotal);
  if (!snapped) {
    return { pairs, problem: { target: 'design', message: 'no standard string fits the string budget.', fix: 'Raise targets.stringBudget.' } };
  }
  design.string = snapped.values;
  const toX = model.vref / sense.a1;
  const scaled = ideal.map((v) => v * snapped.scale);
  const goal = tapFractions(ideal);
  // Pairs for string resistors while a tap misses by more than the allowance (x units).
  for (let round = 0; round < design.string.length && stringCost(design.string, goal) * toX > targets.allowance; round++) {
    let best: { k: number; pair: PairOffer; cost: number } | null = null;
    design.string.forEach((_, k) => {
      if (pairs.some((p) => p.resistor === `RS${k + 1}`)) return;
      const pair = bestPair(`RS${k + 1}`, scaled[k], design.series);
      const trial = design.string.slice();
      trial[k] = pair.realised;
      const cost = stringCost(trial, goal);
      if (!best || cost < best.cost) best = { k, pair, cost };
    });
    const b = best as { k: number; pair: PairOffer; cost: number } | null;
    if (!b || b.cost >= stringCost(design.string, goal)) break;
    design.string[b.k] = b.pair.realised;
    pairs.push(b.pair);
  }
  close(model, { fixString: true, maxIter: 30 });
  if (resnapDivider(model)) close(model, { fixString: true, maxIter: 30 });
  snapFeedback(model, pairs);
  return { pairs, problem: null };
}

function snapFeedback(model: Model, pairs: PairOffer[]): void {
  const { design, targets } = model;
  const fed = design.channels.filter((c): c is Channel & { feedback: NonNullable<Channel['feedback']> } => !!c.feedback);
  const ideal = new Map(fed.map((c) => [c.id, c.feedback.ohms]));
  for (const c of fed) c.feedback.ohms = nearestInSeries(c.feedback.ohms, design.series);
  let err = worstError(model, measure(design));
  // One pass of neighbour search per feedback resistor against the exact sweep.
  for (const c of fed) {
    const here = c.feedback.ohms;
    for (const v of [stepInSeries(here, design.series, -1), stepInSeries(here, design.series, 1)]) {
      const keep = c.feedback.ohms;
      c.feedback.ohms = v;
      const e = worstError(model, measure(design));
      if (e < err) err = e;
      else c.feedback.ohms = keep;
    }
  }
  if (err <= targets.allowance) return;
  for (const c of fed) {
    const pair = bestPair(`RF:${c.id}`, ideal.get(c.id) as number, design.series);
    const keep = c.feedback.ohms;
    c.feedback.ohms = pair.realised;
    const e = worstError(model, measure(design));
    if (e < err) {
      err = e;
      pairs.push(pair);
    } else c.feedback.ohms = keep;
  }
}

/**
 * The divider ratio scales every threshold at once, so a common error left by the string's
 * standard values can be taken out by re-choosing the divider among its series neighbours
 * (inside the input budget). Trips move as sig(x') = sig(x)·ρ/ρ'. Returns whether it changed.
 */
function resnapDivider(model: Model): boolean {
  const { design, targets } = model;
  const div = design.input.divider;
  if (!div || design.input.signal !== 'voltage') return false;
  const { offset, gain } = design.input;
  const rho = div.bottom / (div.top + div.bottom);
  const trips = measure(design);
  const pairs = model.units.flatMap((u) => {
    const t = trips.get(u.id);
    return t && t.rising !== null && t.falling !== null ? [[t.rising, u.rising], [t.falling, u.falling]] : [];
  });
  const cost = (r: number) => Math.max(...pairs.map(([x, want]) => Math.abs(((offset + gain * x) * rho) / r / gain - offset / gain - want)));
  const minTotal = (offset + gain * design.quantity.max) / targets.inputBudget;
  let best = { top: div.top, bottom: div.bottom, cost: cost(rho) };
  for (const scale of snapScales(design.series)) {
    for (const top of candidatesFor(div.top * scale, design.series)) {
      for (const bottom of candidatesFor(div.bottom * scale, design.series)) {
        if (top + bottom < minTotal) continue;
        const c = cost(bottom / (top + bottom));
        if (c < best.cost) best = { top, bottom, cost: c };
      }
    }
  }
  if (best.top === div.top && best.bottom === div.bottom) return false;
  design.input.divider = { top: best.top, bottom: best.bottom };
  const r = best.bottom / (best.top + best.bottom);
  model.sense = { a0: r * offset, a1: r * gain, rth: (best.top * best.bottom) / (best.top + best.bottom) };
  return true;
}
