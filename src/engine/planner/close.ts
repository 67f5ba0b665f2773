/**
 * Closure against the exact sweep (ENGINE.md §3.3): sweep, compare realised trip points with the
 * targets, correct the unknowns, repeat. Fixed-point updates: each tap's unloaded voltage moves by
 * the centre error times the sense slope; each feedback resistor follows the hysteresis law
 * h ∝ S / (S + RF) of its source resistance S, which is exact for an isolated channel, so the
 * iteration contracts by the (small) coupling between channels; steps shorten when it overshoots.
 */
import type { Channel, Design } from '../design/types';
import { prepare } from '../prepare';
import { feedbackSource, type Model, stringFromTaps } from './synthesize';

/** Realised trip points of one channel (unit of x); null where the channel never switches. */
export interface Trips {
  rising: number | null;
  falling: number | null;
}

/** Realised trips of every channel of `design` by id, from the exact sweep. */
export function measure(design: Design): Map<string, Trips> {
  const p = prepare(design);
  const out = new Map<string, Trips>();
  p.net.comparators.forEach((c, k) => {
    // Flips at x = min are the initial settle, not a trip.
    const up = p.sweep.flips.find((f) => f.element === k && f.direction === 'up' && f.x > design.quantity.min);
    const down = p.sweep.flips.find((f) => f.element === k && f.direction === 'down');
    out.set(c.id, { rising: up ? up.x : null, falling: down ? down.x : null });
  });
  return out;
}

/** Largest |realised − target| over every trip of the model (unit of x); Infinity when one never trips. */
export function worstError(model: Model, trips: Map<string, Trips>): number {
  let worst = 0;
  for (const u of model.units) {
    const t = trips.get(u.id);
    if (!t || t.rising === null || t.falling === null) return Infinity;
    worst = Math.max(worst, Math.abs(t.rising - u.rising), Math.abs(t.falling - u.falling));
  }
  return worst;
}

/** Outcome of a closure run. */
export interface Closure {
  /** Largest trip error left (unit of x). */
  error: number;
  iterations: number;
  /** Channels that never switched (closure could not steer them). */
  stuck: string[];
}

/**
 * Iterates in place on `model` until every trip is within `tol` (unit of x) or `maxIter` sweeps.
 * With `fixString`, the string stays as it is and only feedback resistors move.
 */
export function close(model: Model, options: { fixString?: boolean; maxIter?: number; tol?: number } = {}): Closure {
  const { design, units, sense } = model;
  const range = design.quantity.max - design.quantity.min;
  const tol = options.tol ?? 1e-7 * range;
  const maxIter = options.maxIter ?? 60;
  const channel = new Map<string, Channel>(design.channels.map((c) => [c.id, c]));
  let trips = measure(design);
  let error = worstError(model, trips);
  let iterations = 0;
  // Relaxation: full steps while the error falls, shorter ones when coupled channels overshoot.
  let step = 1;
  let previous = Infinity;
  while (error > tol && iterations < maxIter) {
    step = error > previous ? Math.max(1 / 16, step / 2) : Math.min(1, step * 1.5);
    previous = error;
    const stuck = units.filter((u) => trips.get(u.id)?.rising == null || trips.get(u.id)?.falling == null);
    if (stuck.length) return { error, iterations, stuck: stuck.map((u) => u.id) };
    if (!options.fixString) {
      model.taps.forEach((tap, j) => {
        const u = tap.units[0];
        const t = trips.get(u.id) as { rising: number; falling: number };
        model.tapVolts[j] += step * sense.a1 * ((u.rising + u.falling) / 2 - (t.rising + t.falling) / 2);
      });
      if (!ordered(model.tapVolts, model.vref)) return { error, iterations, stuck: [] };
      design.string = stringFromTaps(model.vref, model.total, model.tapVolts);
    }
    for (const u of units) {
      const ch = channel.get(u.id) as Channel;
      if (!ch.feedback) continue;
      const t = trips.get(u.id) as { rising: number; falling: number };
      const h = t.rising - t.falling;
      const want = u.rising - u.falling;
      const s = feedbackSource(model, ch, u);
      const rf = ch.feedback.ohms;
      const next = h > 0 ? Math.max(0.01 * (rf + s), ((rf + s) * h) / want - s) : rf / 2;
      ch.feedback.ohms = rf * (next / rf) ** step;
    }
    trips = measure(design);
    error = worstError(model, trips);
    iterations += 1;
  }
  return { error, iterations, stuck: [] };
}

/** Whether unloaded tap voltages stay strictly descending inside (0, vref). */
export function ordered(u: readonly number[], vref: number): boolean {
  let above = vref;
  for (const v of u) {
    if (!(v < above) || v <= 0) return false;
    above = v;
  }
  return true;
}
