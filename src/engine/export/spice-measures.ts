/**
 * What the SPICE netlist measures, and how closely a simulator must agree with the engine: one
 * measurement per channel transition, named after the channel's comparator unit.
 */
import type { Prepared } from '../prepare';
import type { Designators } from './designators';

/** Time the stimulus takes to ramp from quantity.min to quantity.max, and again back down (s). */
export const RAMP_SECONDS = 1;

/** One `.meas` statement: the x at which a channel's output changes on one sweep. */
export interface SpiceMeasure {
  /** Measurement name as ngspice prints it (lower case), e.g. "xr_u1a". */
  name: string;
  /** Channel id in the design. */
  channel: string;
  /** Conventional comparator unit, e.g. "U1A". */
  unit: string;
  /** Which sweep: x rising or falling. */
  edge: 'rising' | 'falling';
  /** New output state: `low` = sinking. */
  to: 'low' | 'high';
  /** The engine's trip point (unit of x). */
  x: number;
}

/**
 * Largest acceptable disagreement between a simulated and an engine trip point, in units of x.
 * When x is in volts it is 1 mV of x. For any other unit it is the change of x that moves the
 * sense node `in` by 1 mV (1 mV-equivalent through the input path, from the engine's own gain
 * dV(in)/dx in its starting state); 0.1 % of the range if that gain is zero.
 */
export function tripTolerance(p: Prepared): number {
  const { design, net } = p;
  if (design.quantity.unit === 'V') return 1e-3;
  const sol = p.solver.solve(p.sweep.initial);
  const node = senseNode(net.nodes, net.supply);
  const gain = node >= 0 ? Math.abs(sol.v1[node]) : 0;
  return gain > 0 ? 1e-3 / gain : 1e-3 * (design.quantity.max - design.quantity.min);
}

/** Index of the sense node: `in`, or the signal node or supply rail it is an alias of. */
export function senseNode(nodes: string[], supply: number): number {
  const named = ['in', 'sig'].map((n) => nodes.indexOf(n)).find((k) => k >= 0);
  return named ?? supply;
}

/** The measurements the netlist states: the first transition of each channel on each sweep. */
export function spiceMeasures(p: Prepared, ds: Designators): SpiceMeasure[] {
  const out: SpiceMeasure[] = [];
  p.net.comparators.forEach((c, k) => {
    const unit = ds.unitOf(c.id);
    for (const dir of ['up', 'down'] as const) {
      // Up flips at x = min are the initial settle (the starting state the switches are given), not trips.
      const flip = p.sweep.flips.find((f) => f.element === k && f.direction === dir && (dir === 'down' || f.x > p.design.quantity.min));
      if (!flip) continue;
      const edge = dir === 'up' ? 'rising' : 'falling';
      out.push({ name: `x${edge[0]}_${unit.toLowerCase()}`, channel: c.id, unit, edge, to: flip.to ? 'low' : 'high', x: flip.x });
    }
  });
  return out;
}
