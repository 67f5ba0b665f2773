/**
 * The uncertain parameters of a design and how a point in their box becomes a perturbed network.
 * Each parameter spans [lo, hi] around its nominal value; a unit value u in [-1, 1] maps linearly
 * from lo (u = −1) through nominal (u = 0) to hi (u = +1), so the corners of the box are u = ±1 and
 * the same mapping serves Monte Carlo draws and worst-case corners. A nominal off centre (a typical
 * bias current well under its maximum, a nominal supply inside its range) keeps most draws near it.
 */
import type { Design } from '../design/types';
import type { Network } from '../network/types';
import type { DistributionKind } from './distributions';

/** Kinds of uncertainty; each can have its own distribution. */
export type ParameterGroup = 'resistor' | 'reference' | 'offset' | 'bias' | 'knee' | 'supply';

/** Settings of a spread run; every field is optional and falls back to the design or a default. */
export interface SpreadOptions {
  /** Relative tolerance of every resistor (e.g. 0.01); default the design's `resistorTolerance`. */
  resistorTolerance?: number;
  /** Relative tolerance per resistor designator ("RS1", "RF:A", "RL:A", ...), overriding the above. */
  partTolerance?: Record<string, number>;
  /** Relative tolerance of the reference voltage; default the design's reference tolerance. */
  referenceTolerance?: number;
  /** Which part-class figure bounds the offset voltage and the bias current; default `max`. */
  partLimit?: 'typical' | 'max';
  /** LED knee voltage spread either side of nominal (V); default 0.1 V. */
  ledKneeSpread?: number;
  /** Whether a fixed supply wanders over its stated min..max; default true. */
  supplyRange?: boolean;
  /** Distribution per group; defaults in `DEFAULT_DISTRIBUTIONS`. */
  distributions?: Partial<Record<ParameterGroup, DistributionKind>>;
}

/**
 * Default distributions: manufactured values (resistors, reference, offset, bias, knee) are normal
 * with the limit at 3 sigma, so most parts sit near nominal or typical; the supply may sit anywhere
 * in its range and is uniform. Common practice, no source.
 */
export const DEFAULT_DISTRIBUTIONS: Readonly<Record<ParameterGroup, DistributionKind>> = Object.freeze({
  resistor: 'normal',
  reference: 'normal',
  offset: 'normal',
  bias: 'normal',
  knee: 'normal',
  supply: 'uniform',
});

/** Default LED knee spread either side of nominal (V). Common practice, no source. */
export const DEFAULT_KNEE_SPREAD = 0.1;

/** Which network field a parameter drives. */
export type Target =
  | { kind: 'resistor'; index: number }
  | { kind: 'led-series'; index: number }
  | { kind: 'knee'; index: number }
  | { kind: 'vsource'; index: number }
  | { kind: 'vos'; index: number }
  | { kind: 'ib-plus'; index: number }
  | { kind: 'ib-minus'; index: number };

/** One uncertain parameter: its limits (SI units of the field it drives) and distribution. */
export interface Parameter {
  /** Readable name, e.g. "RS2", "Vos A", "Ib+ A", "knee A", "reference", "supply". */
  id: string;
  group: ParameterGroup;
  target: Target;
  /** Lower limit, nominal and upper limit of the field (ohms, volts or amperes). */
  lo: number;
  nominal: number;
  hi: number;
  distribution: DistributionKind;
}

/**
 * Lists the uncertain parameters of `design` as built into `net` (the nominal network). Parameters
 * with zero width (an ideal part, a tolerance of 0) are left out, so corner counts stay honest.
 */
export function spreadParameters(design: Design, net: Network, options: SpreadOptions = {}): Parameter[] {
  const dist = { ...DEFAULT_DISTRIBUTIONS, ...options.distributions };
  const out: Parameter[] = [];
  const push = (id: string, group: ParameterGroup, target: Target, lo: number, hi: number, nominal = 0.5 * (lo + hi)) => {
    if (hi > lo) out.push({ id, group, target, lo, nominal: Math.min(hi, Math.max(lo, nominal)), hi, distribution: dist[group] });
  };
  const tolOf = (id: string) => options.partTolerance?.[id] ?? options.resistorTolerance ?? design.resistorTolerance;
  net.resistors.forEach((r, index) => {
    const t = tolOf(r.id);
    push(r.id, 'resistor', { kind: 'resistor', index }, r.ohms * (1 - t), r.ohms * (1 + t));
  });
  const kneeSpread = options.ledKneeSpread ?? DEFAULT_KNEE_SPREAD;
  const refTol = options.referenceTolerance ?? ('tolerance' in design.reference ? design.reference.tolerance : 0);
  net.diodes.forEach((d, index) => {
    if (d.kind === 'shunt') {
      push('reference', 'reference', { kind: 'knee', index }, d.knee * (1 - refTol), d.knee * (1 + refTol));
      return;
    }
    if (d.seriesId) {
      const t = tolOf(d.seriesId);
      push(d.seriesId, 'resistor', { kind: 'led-series', index }, d.rSeries * (1 - t), d.rSeries * (1 + t));
    }
    push(`knee ${d.channel ?? d.id}`, 'knee', { kind: 'knee', index }, d.knee - kneeSpread, d.knee + kneeSpread);
  });
  net.vsources.forEach((s, index) => {
    if (s.id === 'VREF') push('reference', 'reference', { kind: 'vsource', index }, s.c0 * (1 - refTol), s.c0 * (1 + refTol));
    if (index === net.supplySource && design.supply.kind === 'fixed' && options.supplyRange !== false) {
      push('supply', 'supply', { kind: 'vsource', index }, design.supply.min, design.supply.max, design.supply.volts);
    }
  });
  const part = design.part;
  const typical = options.partLimit === 'typical';
  const vos = typical ? part.vosTyp : part.vosMax;
  const ib = typical ? part.ibTyp : part.ibMax;
  // Bias current runs from 0 through typical to its limit in the class direction (+1 = out of the pin).
  const sign = part.biasDirection === 'out' ? 1 : -1;
  const [ibLo, ibHi] = [Math.min(0, sign * ib), Math.max(0, sign * ib)];
  net.comparators.forEach((c, index) => {
    push(`Vos ${c.id}`, 'offset', { kind: 'vos', index }, -vos, vos);
    push(`Ib+ ${c.id}`, 'bias', { kind: 'ib-plus', index }, ibLo, ibHi, c.ibPlus);
    push(`Ib- ${c.id}`, 'bias', { kind: 'ib-minus', index }, ibLo, ibHi, c.ibMinus);
  });
  return out;
}

/** Value of a parameter at the unit point u in [-1, 1]: lo, nominal, hi at −1, 0, +1 (SI units). */
export function parameterValue(p: Parameter, u: number): number {
  return u < 0 ? p.nominal + u * (p.nominal - p.lo) : p.nominal + u * (p.hi - p.nominal);
}

/**
 * A copy of `net` whose values `perturbInto` may change: the element lists whose values carry
 * parameters are copied element by element; wiring and names are shared with `net`.
 */
export function valueCopy(net: Network): Network {
  return {
    ...net,
    resistors: net.resistors.map((r) => ({ ...r })),
    diodes: net.diodes.map((d) => ({ ...d })),
    vsources: net.vsources.map((s) => ({ ...s })),
    comparators: net.comparators.map((c) => ({ ...c })),
  };
}

/**
 * Sets every parameter's field in `net` (a `valueCopy` of the network the parameters were listed
 * for) from `units`, in place. Every field a parameter drives is written, so one copy serves any
 * number of points without carrying values over from the last.
 */
export function perturbInto(net: Network, params: readonly Parameter[], units: ArrayLike<number>): void {
  const { resistors, diodes, vsources, comparators } = net;
  for (let k = 0; k < params.length; k++) {
    const p = params[k];
    const v = parameterValue(p, units[k]);
    const t = p.target;
    if (t.kind === 'resistor') resistors[t.index].ohms = v;
    else if (t.kind === 'led-series') diodes[t.index].rSeries = v;
    else if (t.kind === 'knee') diodes[t.index].knee = v;
    else if (t.kind === 'vsource') vsources[t.index].c0 = v;
    else if (t.kind === 'vos') comparators[t.index].vos = v;
    else if (t.kind === 'ib-plus') comparators[t.index].ibPlus = v;
    else comparators[t.index].ibMinus = v;
  }
}

/**
 * A copy of `net` with every parameter set from `units` (one unit value per parameter, same order).
 * Only the element lists that change are copied; `net` itself is never modified.
 */
export function perturbNetwork(net: Network, params: readonly Parameter[], units: ArrayLike<number>): Network {
  const copy = valueCopy(net);
  perturbInto(copy, params, units);
  return copy;
}
