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
 * count are the currents the voltage sources deliver into their nodes (A), in `vsources` order.
 */
export interface Solution {
  v0: Float64Array;
  v1: Float64Array;
  /**
   * Decision of every element as the affine pair (da[k] + db[k]·x) (V): for a comparator
   * V(−) − V(+) − Vos (positive wants the output low), for a diode V(anode) − V(cathode) − knee
   * (positive wants it conducting).
   */
  da: Float64Array;
  db: Float64Array;
  /** False when the matrix was singular for this state (a loop of ideal sources). */
  ok: boolean;
}

/**
 * A network prepared for repeated solves. Nodes held by a voltage source are known (affine in x),
 * so only the remaining nodes are unknowns; their conductance matrix is symmetric positive definite
 * and is solved by Cholesky factorisation. State-independent stamps are assembled once, and solutions
 * are cached per state so a sweep that revisits a state pays nothing.
 */
export class Solver {
  readonly net: Network;
  /** Node count. */
  readonly size: number;
  private readonly base: Float64Array;
  private readonly inj0: Float64Array;
  private readonly inj1: Float64Array;
  private readonly full: Float64Array;
  /** Unknown node indices, and for every node its unknown index or -1 when a source holds it. */
  private readonly unknowns: Int32Array;
  private readonly slot: Int32Array;
  private readonly reduced: Float64Array;
  private readonly cache = new Map<number | string, Solution>();
  /** Held nodes and their source coefficients, flattened for the inner loops. */
  private readonly heldNode: Int32Array;
  private readonly heldC0: Float64Array;
  private readonly heldC1: Float64Array;

  constructor(net: Network) {
    this.net = net;
    const n = net.nodes.length;
    this.size = n;
    this.base = new Float64Array(n * n);
    this.full = new Float64Array(n * n);
    this.inj0 = new Float64Array(n);
    this.inj1 = new Float64Array(n);
    for (let k = 0; k < n; k++) this.base[k * n + k] += GMIN;
    for (const r of net.resistors) this.conductance(this.base, r.a, r.b, 1 / r.ohms);
    for (const s of net.isources) {
      if (s.from !== GND) {
        this.inj0[s.from] -= s.c0;
        this.inj1[s.from] -= s.c1;
      }
      if (s.to !== GND) {
        this.inj0[s.to] += s.c0;
        this.inj1[s.to] += s.c1;
      }
    }
    for (const c of net.comparators) {
      if (c.plus !== GND) this.inj0[c.plus] += c.ibPlus;
      if (c.minus !== GND) this.inj0[c.minus] += c.ibMinus;
    }
    const held = new Set(net.vsources.map((v) => v.node));
    const list: number[] = [];
    this.slot = new Int32Array(n).fill(-1);
    for (let k = 0; k < n; k++) {
      if (held.has(k)) continue;
      this.slot[k] = list.length;
      list.push(k);
    }
    this.unknowns = Int32Array.from(list);
    this.heldNode = Int32Array.from(net.vsources, (v) => v.node);
    this.heldC0 = Float64Array.from(net.vsources, (v) => v.c0);
    this.heldC1 = Float64Array.from(net.vsources, (v) => v.c1);
    this.reduced = new Float64Array(list.length * list.length);
  }

  /** Solves the network in `state`, from the cache when it has been solved before. */
  solve(state: State): Solution {
    const key = state.length <= 52 ? stateBits(state) : stateKey(state);
    const hit = this.cache.get(key);
    if (hit) return hit;
    const sol = this.factorAndSolve(state);
    this.cache.set(key, sol);
    return sol;
  }

  private conductance(m: Float64Array, a: number, b: number, g: number): void {
    const n = this.size;
    if (a !== GND) m[a * n + a] += g;
    if (b !== GND) m[b * n + b] += g;
    if (a !== GND && b !== GND) {
      m[a * n + b] -= g;
      m[b * n + a] -= g;
    }
  }

  private factorAndSolve(state: State): Solution {
    const { net, size: n } = this;
    const g = this.full;
    g.set(this.base);
    const b0 = Float64Array.from(this.inj0);
    const b1 = Float64Array.from(this.inj1);
    const nc = net.comparators.length;
    for (let k = 0; k < nc; k++) {
      const c = net.comparators[k];
      if (state[k]) {
        this.conductance(g, c.out, GND, 1 / c.rsat);
        b0[c.out] += c.vsat0 / c.rsat;
      } else if (c.pushPull) {
        const gc = 1 / c.rout;
        this.conductance(g, c.out, net.supply, gc);
        b0[c.out] -= c.vohDrop * gc;
        b0[net.supply] += c.vohDrop * gc;
      }
    }
    for (let k = 0; k < net.diodes.length; k++) {
      if (!state[nc + k]) continue;
      const d = net.diodes[k];
      const gd = 1 / (d.rSeries + d.rdyn);
      this.conductance(g, d.anode, d.cathode, gd);
      if (d.anode !== GND) b0[d.anode] += gd * d.knee;
      if (d.cathode !== GND) b0[d.cathode] -= gd * d.knee;
    }
    // Known node voltages from the sources, then the reduced system for the unknown nodes.
    const m = net.vsources.length;
    const v0 = new Float64Array(n + m);
    const v1 = new Float64Array(n + m);
    const hn = this.heldNode;
    const h0 = this.heldC0;
    const h1 = this.heldC1;
    for (let j = 0; j < m; j++) {
      v0[hn[j]] = h0[j];
      v1[hn[j]] = h1[j];
    }
    const u = this.unknowns;
    const nu = u.length;
    const a = this.reduced;
    const r0 = new Float64Array(nu);
    const r1 = new Float64Array(nu);
    for (let i = 0; i < nu; i++) {
      const row = u[i] * n;
      let s0 = b0[u[i]];
      let s1 = b1[u[i]];
      for (let j = 0; j < m; j++) {
        const gk = g[row + hn[j]];
        s0 -= gk * h0[j];
        s1 -= gk * h1[j];
      }
      r0[i] = s0;
      r1[i] = s1;
      for (let j = 0; j < nu; j++) a[i * nu + j] = g[row + u[j]];
    }
    const ok = choleskySolve2(a, nu, r0, r1) || luSolve2(this.refill(a, g), nu, r0, r1);
    for (let i = 0; i < nu; i++) {
      v0[u[i]] = r0[i];
      v1[u[i]] = r1[i];
    }
    // Current each source delivers: what leaves its node through the network minus injections.
    net.vsources.forEach((s, j) => {
      const row = s.node * n;
      let i0 = -b0[s.node];
      let i1 = -b1[s.node];
      for (let k = 0; k < n; k++) {
        i0 += g[row + k] * v0[k];
        i1 += g[row + k] * v1[k];
      }
      v0[n + j] = i0;
      v1[n + j] = i1;
    });
    const count = nc + net.diodes.length;
    const da = new Float64Array(count);
    const db = new Float64Array(count);
    for (let k = 0; k < nc; k++) {
      const c = net.comparators[k];
      da[k] = at(v0, c.minus) - at(v0, c.plus) - c.vos;
      db[k] = at(v1, c.minus) - at(v1, c.plus);
    }
    for (let k = 0; k < net.diodes.length; k++) {
      const d = net.diodes[k];
      da[nc + k] = at(v0, d.anode) - at(v0, d.cathode) - d.knee;
      db[nc + k] = at(v1, d.anode) - at(v1, d.cathode);
    }
    return { v0, v1, da, db, ok };
  }

  /** Rebuilds the reduced matrix (Cholesky overwrote it) for the pivoting fallback. */
  private refill(a: Float64Array, g: Float64Array): Float64Array {
    const u = this.unknowns;
    const n = this.size;
    for (let i = 0; i < u.length; i++) for (let j = 0; j < u.length; j++) a[i * u.length + j] = g[u[i] * n + u[j]];
    return a;
  }
}

function at(vec: Float64Array, node: number): number {
  return node === GND ? 0 : vec[node];
}

/**
 * Cholesky factorisation of the symmetric positive definite `a` (size×size, row-major, lower
 * triangle used and overwritten), solving for two right-hand sides in place. Returns false when a
 * pivot is not positive; the right-hand sides are then untouched.
 */
export function choleskySolve2(a: Float64Array, size: number, b0: Float64Array, b1: Float64Array): boolean {
  for (let j = 0; j < size; j++) {
    let d = a[j * size + j];
    for (let k = 0; k < j; k++) d -= a[j * size + k] * a[j * size + k];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    a[j * size + j] = l;
    for (let i = j + 1; i < size; i++) {
      let s = a[i * size + j];
      for (let k = 0; k < j; k++) s -= a[i * size + k] * a[j * size + k];
      a[i * size + j] = s / l;
    }
  }
  for (let i = 0; i < size; i++) {
    let s0 = b0[i];
    let s1 = b1[i];
    for (let k = 0; k < i; k++) {
      s0 -= a[i * size + k] * b0[k];
      s1 -= a[i * size + k] * b1[k];
    }
    b0[i] = s0 / a[i * size + i];
    b1[i] = s1 / a[i * size + i];
  }
  for (let i = size - 1; i >= 0; i--) {
    let s0 = b0[i];
    let s1 = b1[i];
    for (let k = i + 1; k < size; k++) {
      s0 -= a[k * size + i] * b0[k];
      s1 -= a[k * size + i] * b1[k];
    }
    b0[i] = s0 / a[i * size + i];
    b1[i] = s1 / a[i * size + i];
  }
  return true;
}

/** Numeric key of a state of at most 52 elements (exact in a double). */
function stateBits(state: State): number {
  let key = 0;
  let bit = 1;
  for (let k = 0; k < state.length; k++) {
    if (state[k]) key += bit;
    bit *= 2;
  }
  return key;
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
