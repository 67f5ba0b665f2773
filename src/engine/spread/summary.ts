/**
 * Turns the raw Monte Carlo trials into the spread report: statistics and histograms per trip
 * point, yield against the allowed error, and the chance of swapped steps, inverted windows and
 * hysteresis under the noise.
 */
import { type SpreadModel, sweepTrips } from './model';
import type { TrialBlock } from './monte-carlo';
import { histogram, type Histogram, type SampleStats, sampleStats } from './statistics';
import type { WorstCase, Bound } from './worst-case';

/** Options of the summary. */
export interface SummaryOptions {
  /** Histogram bins per trip point; default 20. */
  bins?: number;
  /** Allowed error of each trip point about its nominal value (unit of x); default targets.allowance. */
  allowance?: number;
}

/** Spread of one quantity (trip point or hysteresis), all in the unit of x. */
export interface QuantitySpread {
  /** Value with every part at nominal; null when the channel never flips. */
  nominal: number | null;
  /** Monte Carlo statistics over the trials where the quantity exists; null if none. */
  stats: SampleStats | null;
  /** Trials where the quantity did not exist (the channel never flipped that way). */
  missing: number;
  histogram: Histogram;
  /** Worst-case bound, when worst case was run. */
  bound: Bound | null;
  /** Fraction of trials within the allowance of nominal; null without an allowance. */
  yield: number | null;
}

/** Spread of one channel. */
export interface ChannelSpread {
  id: string;
  label: string;
  rising: QuantitySpread;
  falling: QuantitySpread;
  hysteresis: QuantitySpread & {
    /** Fraction of trials whose hysteresis is below the stated noise on x (or missing). */
    belowNoise: number;
  };
}

/** Two trip channels expected in a fixed order, and how often that order breaks. */
export interface OrderRisk {
  /** Channel with the lower nominal trip point, and the one above it. */
  lower: string;
  upper: string;
  /** Fraction of trials where the upper channel's rising or falling trip is at or below the lower's. */
  probability: number;
}

/** The whole spread report. */
export interface SpreadReport {
  trials: number;
  seed: number;
  /** Peak-to-peak noise on x the hysteresis is compared with (unit of x). */
  noise: number;
  allowance: number | null;
  channels: ChannelSpread[];
  /** Neighbouring steps in nominal order (wired-OR window pairs excluded). */
  order: OrderRisk[];
  /** Wired-OR window pairs: probability that the window inverts. */
  windows: OrderRisk[];
  /** Fraction of trials where every trip point is within the allowance; null without one. */
  yield: number | null;
  /** Fraction of trials with a band where the circuit has no stable state. */
  chatter: number;
  worstCase: WorstCase | null;
}

/** Summarises `block` (all trials, in order) for `model`; `worst` adds the worst-case bounds. */
export function summarize(model: SpreadModel, block: TrialBlock, seed: number, worst: WorstCase | null, options: SummaryOptions = {}): SpreadReport {
  const n = model.channels.length;
  const trials = block.to - block.from;
  const design = model.design;
  const nomRise = new Float64Array(n);
  const nomFall = new Float64Array(n);
  sweepTrips(design, model.net, nomRise, nomFall);
  const allowance = options.allowance ?? design.targets?.allowance ?? null;
  const bins = options.bins ?? 20;
  const allOk = new Uint8Array(trials).fill(1);
  const channels: ChannelSpread[] = model.channels.map((id, k) => {
    const rise = column(block.rising, n, k, trials);
    const fall = column(block.falling, n, k, trials);
    const hyst = new Float64Array(trials);
    let below = 0;
    for (let t = 0; t < trials; t++) {
      const h = rise[t] - fall[t];
      hyst[t] = h;
      if (Number.isNaN(h) || h < design.quantity.noise) below++;
    }
    const wc = worst?.channels[k] ?? null;
    return {
      id,
      label: design.channels.find((c) => c.id === id)?.label ?? id,
      rising: quantitySpread(rise, nomRise[k], wc?.rising ?? null, allowance, bins, allOk),
      falling: quantitySpread(fall, nomFall[k], wc?.falling ?? null, allowance, bins, allOk),
      hysteresis: { ...quantitySpread(hyst, nomRise[k] - nomFall[k], wc?.hysteresis ?? null, allowance, bins, null), belowNoise: trials ? below / trials : 0 },
    };
  });
  const risk = ([lo, hi]: [number, number]) => orderRisk(block, model.channels, lo, hi);
  const { order, windows } = pairs(model, nomRise);
  let chatter = 0;
  block.chatter.forEach((c) => (chatter += c));
  return {
    trials,
    seed,
    noise: design.quantity.noise,
    allowance,
    channels,
    order: order.map(risk),
    windows: windows.map(risk),
    yield: allowance === null || trials === 0 ? null : allOk.reduce((a, v) => a + v, 0) / trials,
    chatter: trials ? chatter / trials : 0,
    worstCase: worst,
  };
}

/** Channel k of the channel-major trial array `source` (n channels per trial). */
function column(source: Float64Array, n: number, k: number, trials: number): Float64Array {
  const out = new Float64Array(trials);
  for (let t = 0; t < trials; t++) out[t] = source[t * n + k];
  return out;
}

/**
 * Spread of one quantity over the trials. Trials outside the allowance (or missing) are cleared in
 * `allOk`, unless it is null (hysteresis does not count towards the yield).
 */
function quantitySpread(values: Float64Array, nominal: number, bound: Bound | null, allowance: number | null, bins: number, allOk: Uint8Array | null): QuantitySpread {
  const trials = values.length;
  const present = new Float64Array(trials);
  let count = 0;
  let within = 0;
  const judged = allowance !== null && !Number.isNaN(nominal);
  for (let t = 0; t < trials; t++) {
    const v = values[t];
    if (!Number.isNaN(v)) present[count++] = v;
    const ok = judged && !Number.isNaN(v) && Math.abs(v - nominal) <= allowance;
    if (ok) within++;
    else if (allOk !== null) allOk[t] = 0;
  }
  const sample = present.subarray(0, count);
  return {
    nominal: Number.isNaN(nominal) ? null : nominal,
    stats: sampleStats(sample),
    missing: trials - count,
    histogram: histogram(sample, bins),
    bound,
    yield: allowance === null || trials === 0 ? null : within / trials,
  };
}

/** How often channel `hi`'s rising or falling trip is at or below channel `lo`'s. */
function orderRisk(block: TrialBlock, ids: string[], lo: number, hi: number): OrderRisk {
  const n = ids.length;
  const trials = block.to - block.from;
  let bad = 0;
  for (let t = 0; t < trials; t++) {
    const r = block.rising[t * n + hi] <= block.rising[t * n + lo];
    const f = block.falling[t * n + hi] <= block.falling[t * n + lo];
    if (r || f) bad++;
  }
  return { lower: ids[lo], upper: ids[hi], probability: trials ? bad / trials : 0 };
}

/** Neighbouring channels by nominal rising trip, and wired-OR pairs, as [lower, upper] indices. */
function pairs(model: SpreadModel, nomRise: Float64Array): { order: [number, number][]; windows: [number, number][] } {
  const idx = new Map(model.channels.map((id, k) => [id, k]));
  const windows: [number, number][] = [];
  const paired = new Set<string>();
  for (const ch of model.design.channels) {
    const other = ch.wiredTo ? idx.get(ch.wiredTo) : undefined;
    const self = idx.get(ch.id);
    if (other === undefined || self === undefined) continue;
    const [lo, hi] = nomRise[self] <= nomRise[other] ? [self, other] : [other, self];
    windows.push([lo, hi]);
    paired.add(`${lo}:${hi}`);
  }
  const ranked = model.channels.map((_, k) => k).filter((k) => !Number.isNaN(nomRise[k]));
  ranked.sort((a, b) => nomRise[a] - nomRise[b]);
  const order: [number, number][] = [];
  for (let i = 1; i < ranked.length; i++) {
    const pair: [number, number] = [ranked[i - 1], ranked[i]];
    if (!paired.has(`${pair[0]}:${pair[1]}`)) order.push(pair);
  }
  return { order, windows };
}
