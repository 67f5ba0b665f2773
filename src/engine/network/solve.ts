import { GND, type Network } from './types';

/** Conductance from every node to ground that keeps floating nodes defined (S). */
export const GMIN = 1e-15;

/**
 * The state of every switching element: one flag per comparator (true = output sinking, "low")
 * followed by one flag per diode (true = conducting).
 */
export type State = Uint8Array;

/**
 * Node voltages of one state, affine in x: V(node) = v0[node] + x·v1[node]. Entries past the node
 * count are the currents delivered by the voltage sources (A), in `vsources` order.
 */
export interface Solution {
  v0: Float64Array;
  v1: Float64Array;
  /** False when the matrix was singular for this state (a loop of ideal sources). */
  ok: boolean;
}

/**
 * A network prepared for repeated solves: the state-independent stamps are assembled once, and
 * solutions are cached per state so a sweep that revisits a state pays nothing.
 */
export class Solver {
  readonly net: Network;
  /** Unknowns: node voltages then source currents. */
  readonly size: number;
  private readonly base: Float64Array;
  private readonly rhs0: Float64Array;
  private readonly rhs1: Float64Array;
  private readonly work: Float64Array;
  private readonly cache = new Map<string, Solution>();

  constructor(net: Network) {
    this.net = net;
    const n = net.nodes.length;
    const size = n + net.vsources.length;
    this.size = size;
    this.base = new Float64Array(size * size);
    this.rhs0 = new Float64Array(size);
    this.rhs1 = new Float64Array(size);
    this.work = new Float64Array(size * size);
    for (let k = 0; k < n; k++) this.base[k * size + k] += GMIN;
    for (const r of net.resistors) this.conductance(this.base, r.a, r.b, 1 / r.ohms);
    net.vsources.forEach((s, j) => {
      const row = n + j;
      this.base[row * size + s.node] = 1;
      this.base[s.node * size + row] = 1;
      this.rhs0[row] = s.c0;
      this.rhs1[row] = s.c1;
    });
    for (const s of net.isources) {
      if (s.from !== GND) {
        this.rhs0[s.from] -= s.c0;
        this.rhs1[s.from] -= s.c1;
      }
      if (s.to !== GND) {
        this.rhs0[s.to] += s.c0;
        this.rhs1[s.to] += s.c1;
      }
    }
    for (const c of net.comparators) {
      this.rhs0[c.plus] += c.ibPlus;
      this.rhs0[c.minus] += c.ibMinus;
    }
  }

  /** Solves the network in `state`, from the cache when it has been solved before. */
  solve(state: State): Solution {
    const key = stateKey(state);
    const hit = this.cache.get(key);
    if (hit) return hit;
    const sol = this.factorAndSolve(state);
    this.cache.set(key, sol);
    return sol;
  }

  private conductance(m: Float64Array, a: number, b: number, g: number): void {
    const size = this.size;
    if (a !== GND) m[a * size + a] += g;
    if (b !== GND) m[b * size + b] += g;
    if (a !== GND && b !== GND) {
      m[a * size + b] -= g;
      m[b * size + a] -= g;
    }
  }

  private factorAndSolve(state: State): Solution {
    const { net, size } = this;
    const m = this.work;
    m.set(this.base);
    const v0 = Float64Array.from(this.rhs0);
    const v1 = Float64Array.from(this.rhs1);
    const nc = net.comparators.length;
    for (let k = 0; k < nc; k++) {
      const c = net.comparators[k];
      if (state[k]) {
        this.conductance(m, c.out, GND, 1 / c.rsat);
        v0[c.out] += c.vsat0 / c.rsat;
      } else if (c.pushPull) {
        const g = 1 / c.rout;
        this.conductance(m, c.out, net.supply, g);
        v0[c.out] -= c.vohDrop * g;
        v0[net.supply] += c.vohDrop * g;
      }
    }
    net.diodes.forEach((d, k) => {
      if (!state[nc + k]) return;
      const g = 1 / (d.rSeries + d.rdyn);
      this.conductance(m, d.anode, d.cathode, g);
      if (d.anode !== GND) v0[d.anode] += g * d.knee;
      if (d.cathode !== GND) v0[d.cathode] -= g * d.knee;
    });
    const ok = luSolve2(m, size, v0, v1);
    return { v0, v1, ok };
  }
}

/** Text key of a state, for caches and cycle detection. */
export function stateKey(state: State): string {
  let key = '';
  for (let k = 0; k < state.length; k++) key += state[k] ? '1' : '0';
  return key;
}

/**
 * Dense LU with partial pivoting on the row-major `m` (size×size), solving for two right-hand sides
 * in place. Returns false (leaving zeros) when a pivot vanishes.
 */
export function luSolve2(m: Float64Array, size: number, b0: Float64Array, b1: Float64Array): boolean {
  for (let col = 0; col < size; col++) {
    let pivot = col;
    let best = Math.abs(m[col * size + col]);
    for (let r = col + 1; r < size; r++) {
      const v = Math.abs(m[r * size + col]);
      if (v > best) {
        best = v;
        pivot = r;
      }
    }
    if (!(best > 1e-300)) {
      b0.fill(0);
      b1.fill(0);
      return false;
    }
    if (pivot !== col) {
      for (let c = 0; c < size; c++) {
        const t = m[col * size + c];
        m[col * size + c] = m[pivot * size + c];
        m[pivot * size + c] = t;
      }
      let t = b0[col];
      b0[col] = b0[pivot];
      b0[pivot] = t;
      t = b1[col];
      b1[col] = b1[pivot];
      b1[pivot] = t;
    }
    const d = m[col * size + col];
    for (let r = col + 1; r < size; r++) {
      const f = m[r * size + col] / d;
      if (f === 0) continue;
      m[r * size + col] = 0;
      for (let c = col + 1; c < size; c++) m[r * size + c] -= f * m[col * size + c];
      b0[r] -= f * b0[col];
      b1[r] -= f * b1[col];
    }
  }
  for (let r = size - 1; r >= 0; r--) {
    let s0 = b0[r];
    let s1 = b1[r];
    for (let c = r + 1; c < size; c++) {
      s0 -= m[r * size + c] * b0[c];
      s1 -= m[r * size + c] * b1[c];
    }
    const d = m[r * size + r];
    b0[r] = s0 / d;
    b1[r] = s1 / d;
  }
  return true;
}

/** Voltage of `node` (GND allowed) in a solution, as the affine pair [c0, c1]. */
export function nodeAffine(sol: Solution, node: number): [number, number] {
  return node === GND ? [0, 0] : [sol.v0[node], sol.v1[node]];
}
