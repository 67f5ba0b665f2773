import type { Design } from './design/types';
import { buildNetwork, type BuildOptions } from './network/build';
import { type Solution, Solver, type State } from './network/solve';
import { GND, type Network } from './network/types';
import { type Direction, sweep, type SweepResult } from './sweep';

/** A design with its network built and both sweeps done: the input to every report. */
export interface Prepared {
  design: Design;
  net: Network;
  solver: Solver;
  sweep: SweepResult;
}

/** Builds the network of `design` and sweeps it over the quantity range. Pure. */
export function prepare(design: Design, options: BuildOptions = {}): Prepared {
  const net = buildNetwork(design, options);
  return prepareNetwork(design, net);
}

/** Sweeps an already built (possibly perturbed) network of `design`. */
export function prepareNetwork(design: Design, net: Network): Prepared {
  const solver = new Solver(net);
  return { design, net, solver, sweep: sweep(solver, design.quantity.min, design.quantity.max) };
}

/** Voltage of `node` at x in a solution (V). */
export function voltAt(sol: Solution, node: number, x: number): number {
  return node === GND ? 0 : sol.v0[node] + sol.v1[node] * x;
}

/** Current the supply source delivers at x, plus part quiescent current (A). */
export function supplyCurrentAt(p: Prepared, sol: Solution, x: number): number {
  const [i0, i1] = p.solver.sourceCurrent(sol, p.net.supplySource);
  return i0 + i1 * x + p.net.quiescent;
}

/** The state the circuit is in at x on the given sweep direction. */
export function stateAt(p: Prepared, x: number, dir: Direction): State {
  const segs = p.sweep.segments.filter((s) => s.direction === dir);
  let best = segs[0];
  let bestGap = Infinity;
  for (const s of segs) {
    const gap = x < s.from ? s.from - x : x > s.to ? x - s.to : 0;
    if (gap < bestGap) {
      bestGap = gap;
      best = s;
    }
  }
  return best ? best.state : p.sweep.initial;
}

/** Node name of an element index for messages: comparator id or diode id. */
export function elementName(net: Network, k: number): string {
  const nc = net.comparators.length;
  return k < nc ? net.comparators[k].id : net.diodes[k - nc].id;
}
