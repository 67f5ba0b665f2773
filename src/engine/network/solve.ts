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
  /** False when the system could not be solved for this state. */
  ok: boolean;
}

/**
 * Two-terminal branches in flat arrays: current from a[k] to b[k] = g[k]·(V(a) − V(b) − e[k]).
 * Flat typed arrays keep the per-state work free of object lookups.
 */
class Branches {
  readonly a: Int32Array;
  readonly b: Int32Array;
  readonly g: Float64Array;
  readonly e: Float64Array;
  constructor(count: number) {
    this.a = new Int32Array(count);
    this.b = new Int32Array(count);
    this.g = new Float64Array(count);
    this.e = new Float64Array(count);
  }
  set(k: number, a: number, b: number, g: number, e: number): void {
    this.a[k] = a;
    this.b[k] = b;
    this.g[k] = g;
    this.e[k] = e;
  }
}

/**
 * A network prepared for repeated solves. Nodes held by a voltage source are known (affine in x),
 * so only the remaining nodes are unknowns; their conductance matrix is symmetric positive definite
 * and is solved by Cholesky factorisation (pivoting LU as the fallback). The state-independent part
 * is stamped once; each state adds only its own branches. Solutions are cached per state.
 */
export class Solver {
  readonly net: Network;
  /** Node count. */
  readonly size: number;
  /** Unknown index of every node, or -1 when a source holds it. */
  private readonly slot: Int32Array;
  private readonly nu: number;
  private readonly held0: Float64Array;
  private readonly held1: Float64Array;
  private readonly baseA: Float64Array;
  private readonly baseR0: Float64Array;
  private readonly baseR1: Float64Array;
  private readonly inj0: Float64Array;
  private readonly inj1: Float64Array;
  /** Fixed branches (resistors) and, per element, the branch it adds when set (on) or clear (off). */
  private readonly fixed: Branches;
  private readonly on: Branches;
  private readonly off: Branches;
  private readonly hasOff: Uint8Array;
  private readonly work: Float64Array;
  private readonly r0: Float64Array;
  private readonly r1: Float64Array;
  private readonly cache = new Map<number | string, Solution>();

  constructor(net: Network) {
    this.net = net;
    const n = net.nodes.length;
    this.size = n;
    this.held0 = new Float64Array(n);
    this.held1 = new Float64Array(n);
    const isHeld = new Uint8Array(n);
    for (const s of net.vsources) {
      isHeld[s.node] = 1;
      this.held0[s.node] = s.c0;
      this.held1[s.node] = s.c1;
    }
    this.slot = new Int32Array(n);
    let nu = 0;
    for (let k = 0; k < n; k++) this.slot[k] = isHeld[k] ? -1 : nu++;
    this.nu = nu;
    this.baseA = new Float64Array(nu * nu);
    this.work = new Float64Array(nu * nu);
    this.baseR0 = new Float64Array(nu);
    this.baseR1 = new Float64Array(nu);
    this.r0 = new Float64Array(nu);
    this.r1 = new Float64Array(nu);
    this.inj0 = new Float64Array(n);
    this.inj1 = new Float64Array(n);
    for (let i = 0; i < nu; i++) this.baseA[i * nu + i] += GMIN;
    for (const s of net.isources) {
      this.inject(s.from, -s.c0, -s.c1);
      this.inject(s.to, s.c0, s.c1);
    }
    for (const c of net.comparators) {
      this.inject(c.plus, c.ibPlus, 0);
      this.inject(c.minus, c.ibMinus, 0);
    }
    for (let k = 0; k < n; k++) {
      const s = this.slot[k];
      if (s < 0) continue;
      this.baseR0[s] += this.inj0[k];
      this.baseR1[s] += this.inj1[k];
    }
    this.fixed = new Branches(net.resistors.length);
    net.resistors.forEach((r, k) => {
      this.fixed.set(k, r.a, r.b, 1 / r.ohms, 0);
      this.stamp(this.baseA, this.baseR0, this.baseR1, this.fixed, k);
    });
    const count = net.comparators.length + net.diodes.length;
    this.on = new Branches(count);
    this.off = new Branches(count);
    this.hasOff = new Uint8Array(count);
    net.comparators.forEach((c, k) => {
      this.on.set(k, c.out, GND, 1 / c.rsat, c.vsat0);
      if (c.pushPull) {
        this.off.set(k, c.out, net.supply, 1 / c.rout, -c.vohDrop);
        this.hasOff[k] = 1;
      }
    });
    const nc = net.comparators.length;
    net.diodes.forEach((d, k) => this.on.set(nc + k, d.anode, d.cathode, 1 / (d.rSeries + d.rdyn), d.knee));
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

  private inject(node: number, i0: number, i1: number): void {
    if (node === GND) return;
    this.inj0[node] += i0;
    this.inj1[node] += i1;
  }

  /** Adds branch k of `br` to the reduced system: held node voltages move to the right-hand sides. */
  private stamp(m: Float64Array, r0: Float64Array, r1: Float64Array, br: Branches, k: number): void {
    const nu = this.nu;
    const a = br.a[k];
    const b = br.b[k];
    const g = br.g[k];
    const e = br.e[k];
    const sa = a === GND ? -1 : this.slot[a];
    const sb = b === GND ? -1 : this.slot[b];
    if (sa >= 0) {
      m[sa * nu + sa] += g;
      r0[sa] += g * e;
      if (sb >= 0) m[sa * nu + sb] -= g;
      else if (b !== GND) {
        r0[sa] += g * this.held0[b];
        r1[sa] += g * this.held1[b];
      }
    }
    if (sb >= 0) {
      m[sb * nu + sb] += g;
      r0[sb] -= g * e;
      if (sa >= 0) m[sb * nu + sa] -= g;
      else if (a !== GND) {
        r0[sb] += g * this.held0[a];
        r1[sb] += g * this.held1[a];
      }
    }
  }

  private stampState(state: State): void {
    const { work, r0, r1 } = this;
    work.set(this.baseA);
    r0.set(this.baseR0);
    r1.set(this.baseR1);
    for (let k = 0; k < state.length; k++) {
      if (state[k]) this.stamp(work, r0, r1, this.on, k);
      else if (this.hasOff[k]) this.stamp(work, r0, r1, this.off, k);
    }
  }

  private factorAndSolve(state: State): Solution {
    const { net, size: n, nu, r0, r1 } = this;
    this.stampState(state);
    let ok = choleskySolve2(this.work, nu, r0, r1);
    if (!ok) {
      this.stampState(state);
      ok = luSolve2(this.work, nu, r0, r1);
    }
    const m = net.vsources.length;
    const v0 = new Float64Array(n + m);
    const v1 = new Float64Array(n + m);
    for (let k = 0; k < n; k++) {
      const s = this.slot[k];
      v0[k] = s < 0 ? this.held0[k] : r0[s];
      v1[k] = s < 0 ? this.held1[k] : r1[s];
    }
    for (let j = 0; j < m; j++) this.sourceCurrent(v0, v1, state, j);
    const nc = net.comparators.length;
    const da = new Float64Array(state.length);
    const db = new Float64Array(state.length);
    for (let k = 0; k < nc; k++) {
      const c = net.comparators[k];
      da[k] = at(v0, c.minus) - at(v0, c.plus) - c.vos;
      db[k] = at(v1, c.minus) - at(v1, c.plus);
    }
    const on = this.on;
    for (let k = nc; k < state.length; k++) {
      da[k] = at(v0, on.a[k]) - at(v0, on.b[k]) - on.e[k];
      db[k] = at(v1, on.a[k]) - at(v1, on.b[k]);
    }
    return { v0, v1, da, db, ok };
  }

  /** Current source j delivers: what leaves its node through the branches, minus injections. */
  private sourceCurrent(v0: Float64Array, v1: Float64Array, state: State, j: number): void {
    const node = this.net.vsources[j].node;
    const n = this.size;
    const acc = { i0: -this.inj0[node], i1: -this.inj1[node] };
    const add = (br: Branches, k: number) => {
      const a = br.a[k];
      const b = br.b[k];
      const sign = a === node ? 1 : b === node ? -1 : 0;
      if (!sign) return;
      acc.i0 += sign * br.g[k] * (at(v0, a) - at(v0, b) - br.e[k]);
      acc.i1 += sign * br.g[k] * (at(v1, a) - at(v1, b));
    };
    for (let k = 0; k < this.fixed.g.length; k++) add(this.fixed, k);
    for (let k = 0; k < state.length; k++) {
      if (state[k]) add(this.on, k);
      else if (this.hasOff[k]) add(this.off, k);
    }
    v0[n + j] = acc.i0;
    v1[n + j] = acc.i1;
  }
}

function at(vec: Float64Array, node: number): number {
  return node === GND ? 0 : vec[node];
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
 * Cholesky factorisation of the symmetric positive definite `a` (size×size, row-major, lower
 * triangle used and overwritten), solving for two right-hand sides in place. Returns false when a
 * pivot is not positive.
 */
export function choleskySolve2(a: Float64Array, size: number, b0: Float64Array, b1: Float64Array): boolean {
  for (let j = 0; j < size; j++) {
    const rj = j * size;
    let d = a[rj + j];
    for (let k = 0; k < j; k++) d -= a[rj + k] * a[rj + k];
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    a[rj + j] = l;
    for (let i = j + 1; i < size; i++) {
      const ri = i * size;
      let s = a[ri + j];
      for (let k = 0; k < j; k++) s -= a[ri + k] * a[rj + k];
      a[ri + j] = s / l;
    }
  }
  for (let i = 0; i < size; i++) {
    const ri = i * size;
    let s0 = b0[i];
    let s1 = b1[i];
    for (let k = 0; k < i; k++) {
      s0 -= a[ri + k] * b0[k];
      s1 -= a[ri + k] * b1[k];
    }
    b0[i] = s0 / a[ri + i];
    b1[i] = s1 / a[ri + i];
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
