/**
 * The spread model of a design (its nominal network and uncertain parameters) and the lean
 * evaluation shared by Monte Carlo and worst case: perturb, sweep, read each channel's first rising
 * and first falling transition. No checks, no report: only what spread needs.
 */
import type { Design } from '../design/types';
import { buildNetwork } from '../network/build';
import { Solver } from '../network/solve';
import type { Network } from '../network/types';
import { type Direction, sweep } from '../sweep';
import { type Parameter, perturbInto, spreadParameters, type SpreadOptions, valueCopy } from './perturb';

/** A design ready for spread evaluation. Plain data: it can be rebuilt in a worker from the design. */
export interface SpreadModel {
  design: Design;
  /** Nominal network (nominal part values, nominal supply). */
  net: Network;
  params: Parameter[];
  /** Channel ids in network order; trip arrays use this order. */
  channels: string[];
  /** One solver re-valued for every perturbed copy (they share the nominal wiring). */
  solver: Solver;
  /** The nominal circuit's consistent state at the bottom of the range: each trial starts from it. */
  start: Uint8Array;
  /** A value copy of `net` that each evaluation re-values in place (`perturbInto`) instead of copying `net`. */
  scratch: Network;
}

/** Trip points of one evaluation, per channel in model order (unit of x; NaN when absent). */
export interface TripSample {
  rising: Float64Array;
  falling: Float64Array;
  /** True when the sweep found a band with no stable state. */
  chatter: boolean;
}

/** Builds the spread model of `design` with `options` (SpreadOptions). Pure. */
export function buildSpreadModel(design: Design, options: SpreadOptions = {}): SpreadModel {
  const net = buildNetwork(design);
  const solver = new Solver(net);
  const start = sweep(solver, design.quantity.min, design.quantity.max).initial;
  return { design, net, params: spreadParameters(design, net, options), channels: net.comparators.map((c) => c.id), solver, start, scratch: valueCopy(net) };
}

/**
 * Sweeps `net` over the design's range and writes each comparator's first rising and first falling
 * transition into `rising`/`falling` at `offset + k` (unit of x; NaN when the channel never flips).
 * With `model`, its solver is re-valued for `net` (same wiring) and settling starts from the nominal
 * starting state. Returns true when a band with no stable state was found.
 */
export function sweepTrips(design: Design, net: Network, rising: Float64Array, falling: Float64Array, offset = 0, model?: SpreadModel): boolean {
  const nc = net.comparators.length;
  if (model) model.solver.load(net);
  for (let k = 0; k < nc; k++) {
    rising[offset + k] = NaN;
    falling[offset + k] = NaN;
  }
  // Each comparator's first flip each way, taken as the sweep goes (no Flip records are kept).
  const onFlip = (element: number, _to: boolean, x: number, direction: Direction) => {
    if (element >= nc) return;
    const arr = direction === 'up' ? rising : falling;
    if (Number.isNaN(arr[offset + element])) arr[offset + element] = x;
  };
  const result = sweep(model?.solver ?? new Solver(net), design.quantity.min, design.quantity.max, model?.start, { segments: false, onFlip });
  return result.bands.length > 0;
}

/**
 * Sweeps the model at the unit point `units` (one value in [-1, 1] per parameter) and writes its
 * trips at `offset` as `sweepTrips` does; returns true on a band with no stable state.
 */
export function sweepAt(model: SpreadModel, units: ArrayLike<number>, rising: Float64Array, falling: Float64Array, offset = 0): boolean {
  perturbInto(model.scratch, model.params, units);
  return sweepTrips(model.design, model.scratch, rising, falling, offset, model);
}

/** Evaluates the model at the unit point `units` (one value in [-1, 1] per parameter). */
export function evaluateAt(model: SpreadModel, units: ArrayLike<number>): TripSample {
  const n = model.channels.length;
  const rising = new Float64Array(n);
  const falling = new Float64Array(n);
  const chatter = sweepAt(model, units, rising, falling);
  return { rising, falling, chatter };
}
