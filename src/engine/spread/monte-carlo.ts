/**
 * The single-threaded Monte Carlo core: runs a contiguous range of trials. Trial t draws its
 * parameters from its own generator seeded by (seed, t), so any split of the trials over threads
 * gives the same numbers.
 */
import { drawUnit, SeededRng } from './distributions';
import { type SpreadModel, sweepAt } from './model';

/** Raw results of trials `from` .. `to` − 1, channel-major within each trial. */
export interface TrialBlock {
  from: number;
  to: number;
  /** Rising trip of channel k in trial t at (t − from)·channels + k (unit of x; NaN when absent). */
  rising: Float64Array;
  /** Falling trip, same layout. */
  falling: Float64Array;
  /** 1 where the trial's sweep found a band with no stable state. */
  chatter: Uint8Array;
}

/**
 * Draws the unit point of trial `trial` for seed `seed`: one value in [-1, 1] per parameter. A
 * caller drawing many trials passes one `rng` to be reseeded for each (same numbers, no garbage).
 */
export function trialUnits(model: SpreadModel, seed: number, trial: number, out = new Float64Array(model.params.length), rng?: SeededRng): Float64Array {
  if (rng) rng.reseed(seed, trial);
  else rng = new SeededRng(seed, trial);
  const params = model.params;
  for (let k = 0; k < params.length; k++) out[k] = drawUnit(rng, params[k].distribution);
  return out;
}

/**
 * Runs trials `from` (inclusive) to `to` (exclusive) of the Monte Carlo with `seed`, each one the
 * full exact sweep of a perturbed network. `onTrial` is called after each trial (for progress).
 */
export function runTrials(model: SpreadModel, seed: number, from: number, to: number, onTrial?: (done: number) => void): TrialBlock {
  const n = model.channels.length;
  const count = Math.max(0, to - from);
  const block: TrialBlock = {
    from,
    to,
    rising: new Float64Array(count * n),
    falling: new Float64Array(count * n),
    chatter: new Uint8Array(count),
  };
  const units = new Float64Array(model.params.length);
  // Reseeded for each trial by trialUnits.
  const rng = new SeededRng(seed, from);
  for (let i = 0; i < count; i++) {
    trialUnits(model, seed, from + i, units, rng);
    block.chatter[i] = sweepAt(model, units, block.rising, block.falling, i * n) ? 1 : 0;
    onTrial?.(i + 1);
  }
  return block;
}

/** Joins blocks covering consecutive ranges into one block, in trial order. */
export function joinBlocks(blocks: TrialBlock[], channels: number): TrialBlock {
  const sorted = [...blocks].sort((a, b) => a.from - b.from);
  const from = sorted.length ? sorted[0].from : 0;
  const to = sorted.length ? sorted[sorted.length - 1].to : 0;
  const out: TrialBlock = {
    from,
    to,
    rising: new Float64Array((to - from) * channels),
    falling: new Float64Array((to - from) * channels),
    chatter: new Uint8Array(to - from),
  };
  for (const b of sorted) {
    out.rising.set(b.rising, (b.from - from) * channels);
    out.falling.set(b.falling, (b.from - from) * channels);
    out.chatter.set(b.chatter, b.from - from);
  }
  return out;
}
