/**
 * Worst-case bounds of every trip point and hysteresis over the box of uncertain parameters:
 * every corner when there are few parameters, sensitivity-signed corners otherwise.
 */
import { evaluateAt, type SpreadModel, type TripSample } from './model';

/** Lowest and highest value of one quantity over the corners tried (unit of x; null when absent). */
export interface Bound {
  min: number | null;
  max: number | null;
  /** True when some corner lost this trip point (the channel never flipped there). */
  lost: boolean;
}

/** Worst-case bounds of one channel. */
export interface ChannelBounds {
  id: string;
  rising: Bound;
  falling: Bound;
  /** rising − falling (unit of x). */
  hysteresis: Bound;
}

/** Result of the worst-case search. */
export interface WorstCase {
  /** `corners`: every corner was evaluated; `sensitivity`: one signed corner per bound. */
  method: 'corners' | 'sensitivity';
  /** Number of sweeps run. */
  evaluations: number;
  channels: ChannelBounds[];
}

/** Options of the worst-case search. */
export interface WorstCaseOptions {
  /** Most parameters for exhaustive corner enumeration (2^n sweeps); default 10. */
  maxCornerParameters?: number;
}

type Metric = (s: TripSample, k: number) => number;
const METRICS: Record<'rising' | 'falling' | 'hysteresis', Metric> = {
  rising: (s, k) => s.rising[k],
  falling: (s, k) => s.falling[k],
  hysteresis: (s, k) => s.rising[k] - s.falling[k],
};

/**
 * Worst-case bounds of `model`. Exhaustive corners are exact for trip points that move
 * monotonically with each parameter (true of resistive dividers); the signed-corner search takes
 * each parameter's sign from its own effect (both limits, the others at centre) and so assumes the
 * same monotonicity. The centre point and every probe also count towards the bounds.
 */
export function worstCase(model: SpreadModel, options: WorstCaseOptions = {}): WorstCase {
  const n = model.params.length;
  const limit = options.maxCornerParameters ?? 10;
  const acc = new Accumulator(model.channels);
  const centre = new Float64Array(n);
  acc.add(evaluateAt(model, centre));
  let evaluations = 1;
  if (n <= limit) {
    const units = new Float64Array(n);
    for (let mask = 0; mask < 2 ** n; mask++) {
      for (let i = 0; i < n; i++) units[i] = mask & (1 << i) ? 1 : -1;
      acc.add(evaluateAt(model, units));
      evaluations++;
    }
    return { method: 'corners', evaluations, channels: acc.result() };
  }
  // Effect of each parameter alone at both limits.
  const lows: TripSample[] = [];
  const highs: TripSample[] = [];
  const units = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    units[i] = -1;
    lows.push(evaluateAt(model, units));
    units[i] = 1;
    highs.push(evaluateAt(model, units));
    units[i] = 0;
    acc.add(lows[i]);
    acc.add(highs[i]);
    evaluations += 2;
  }
  for (let k = 0; k < model.channels.length; k++) {
    for (const metric of Object.values(METRICS)) {
      for (const sense of [1, -1]) {
        for (let i = 0; i < n; i++) {
          const d = metric(highs[i], k) - metric(lows[i], k);
          units[i] = Number.isFinite(d) && d !== 0 ? sense * Math.sign(d) : 0;
        }
        acc.add(evaluateAt(model, units));
        evaluations++;
      }
    }
  }
  return { method: 'sensitivity', evaluations, channels: acc.result() };
}

class Accumulator {
  private readonly bounds: ChannelBounds[];
  constructor(channels: string[]) {
    const empty = (): Bound => ({ min: null, max: null, lost: false });
    this.bounds = channels.map((id) => ({ id, rising: empty(), falling: empty(), hysteresis: empty() }));
  }
  add(s: TripSample): void {
    this.bounds.forEach((b, k) => {
      for (const [name, metric] of Object.entries(METRICS) as [keyof typeof METRICS, Metric][]) {
        const v = metric(s, k);
        const bound = b[name];
        if (Number.isNaN(v)) {
          bound.lost = true;
          continue;
        }
        bound.min = bound.min === null ? v : Math.min(bound.min, v);
        bound.max = bound.max === null ? v : Math.max(bound.max, v);
      }
    });
  }
  result(): ChannelBounds[] {
    return this.bounds;
  }
}
