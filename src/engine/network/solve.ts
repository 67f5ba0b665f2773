import { choleskyEnvelope2, luSolve2 } from './factor';
import { envelopeStarts, reverseCuthillMcKee } from './ordering';
import { GND, type Network } from './types';

/** Most solutions a solver keeps before it starts its cache afresh. */
const CACHE_LIMIT = 4096;

/** Conductance from every node to ground that keeps floating nodes defined (S). */
export const GMIN = 1e-15;

/**
 * The state of every switching element: one flag per comparator (true = output sinking, "low")
 * followed by one flag per diode (true = conducting).
 */
export type State = Uint8Array;

/** Node voltages of one state, affine in x: V(node) = v0[node] + x·v1[node] (V). */
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
  /** The state solved. */
  state: State;
}

/**
 * Two-terminal branches in flat arrays: current from a[k] to b[k] = g[k]·(V(a) − V(b) − e[k]).
 * Flat arrays keep the per-state work free of object lookups.
 */
class Branches {
  readonly a: number[];
  readonly b: number[];
  readonly g: number[];
  readonly e: number[];
  constructor(count: number) {
    this.a = new Array<number>(count).fill(GND);
    this.b = new Array<number>(count).fill(GND);
    this.g = new Array<number>(count).fill(0);
    this.e = new Array<number>(count).fill(0);
  }
  set(k: number, a: number, b: number, g: number, e: number): void {
    this.a[k] = a;
    this.b[k] = b;
    this.g[k] = g;
    this.e[k] = e;
  }
}

/**
 * Hands out views of a backing buffer (a new one of `chunk` doubles when it is used up), so the fixed
 * arrays of a solver and the arrays of its solutions cost one allocation per chunk instead of one
 * (off-heap, garbage-collected) buffer each.
 */
class Arena {
  private buffer: Float64Array;
  private used = 0;
  constructor(private readonly chunk: number) {
    this.buffer = new Float64Array(chunk);
  }
  /** A view of `length` doubles; callers overwrite it (reused storage is not zeroed). */
  take(length: number): Float64Array {
    if (this.used + length > this.buffer.length) {
      this.buffer = new Float64Array(Math.max(this.chunk, length));
      this.used = 0;
    }
    const view = this.buffer.subarray(this.used, this.used + length);
    this.used += length;
    return view;
  }
}

/**
 * The part of a solver that depends only on the network's wiring, not its values: which nodes are
 * unknowns, their envelope-friendly numbering and each row's envelope start. Networks that differ
 * only in element values (spread trials) share one layout.
 */
export interface SolverLayout {
  /** Unknown index of every node, or -1 when a source holds it. */
  slot: Int32Array;
  /** Number of unknowns. */
  nu: number;
  /** Envelope start of every row of the reordered matrix. */
  first: Int32Array;
}

/** Computes the layout of `net` (see SolverLayout). */
export function solverLayout(net: Network): SolverLayout {
  const n = net.nodes.length;
  const slot = new Int32Array(n);
  for (const s of net.vsources) slot[s.node] = -1;
  let nu = 0;
  for (let k = 0; k < n; k++) slot[k] = slot[k] < 0 ? -1 : nu++;
  const edges: [number, number][] = [];
  const link = (a: number, b: number) => {
    const sa = a === GND ? -1 : slot[a];
    const sb = b === GND ? -1 : slot[b];
    if (sa >= 0 && sb >= 0 && sa !== sb) edges.push([sa, sb]);
  };
  for (const r of net.resistors) link(r.a, r.b);
  for (const c of net.comparators) if (c.pushPull) link(c.out, net.supply);
  for (const d of net.diodes) link(d.anode, d.cathode);
  // Renumber the unknowns so every state's matrix factors inside narrow row envelopes.
  const index = reverseCuthillMcKee(nu, edges);
  for (let k = 0; k < n; k++) if (slot[k] >= 0) slot[k] = index[slot[k]];
  return { slot, nu, first: envelopeStarts(nu, edges, index) };
}

/**
 * A network prepared for repeated solves. Nodes held by a voltage source are known (affine in x),
 * so only the remaining nodes are unknowns; their conductance matrix is symmetric positive definite
 * and is solved by Cholesky factorisation inside row envelopes (pivoting LU as the fallback). The
 * state-independent part is stamped once; each state adds only its own branches. Solutions are
 * cached per state. `load` re-values the solver for an identically wired network (spread trials),
 * reusing every buffer.
 */
export class Solver {
  /** The wiring-only part, to hand to a solver for an identically wired network. */
  readonly layout: SolverLayout;
  net: Network;
  /** Node count. */
  readonly size: number;
  private readonly slot: Int32Array;
  private readonly nu: number;
  private readonly first: Int32Array;
  private readonly count: number;
  private readonly arena: Arena;
  private readonly held0: Float64Array;
  private readonly held1: Float64Array;
  private readonly baseA: Float64Array;
  private readonly baseR0: Float64Array;
  private readonly baseR1: Float64Array;
  private readonly inj0: Float64Array;
  private readonly inj1: Float64Array;
  private readonly work: Float64Array;
  private readonly r0: Float64Array;
  private readonly r1: Float64Array;
  /** Fixed branches (resistors) and, per element, the branch it adds when set (on) or clear (off). */
  private readonly fixed: Branches;
  private readonly on: Branches;
  private readonly off: Branches;
  private readonly hasOff: boolean[];
  /** Comparator pins and offsets, flattened for the margin loop. */
  private readonly cPlus: number[];
  private readonly cMinus: number[];
  private readonly cVos: number[];
  /**
   * Solutions by state key, each tagged with the `load` it belongs to: after a `load` an entry of an
   * earlier one is refilled in place when its state comes up again, so a spread run reuses the same
   * few solutions trial after trial instead of emptying and refilling a map.
   */
  private readonly cache = new Map<number | string, { sol: Solution; generation: number }>();
  private generation = 0;
  /** Per node, the branches that end there (see `touching`). */
  private readonly incident = new Map<number, { fixed: number[]; elements: number[] }>();

  /** Prepares `net`; pass the layout of an identically wired network to skip recomputing it. */
  constructor(net: Network, layout: SolverLayout = solverLayout(net)) {
    this.net = net;
    this.layout = layout;
    const n = net.nodes.length;
    const nu = layout.nu;
    this.size = n;
    this.slot = layout.slot;
    this.first = layout.first;
    this.nu = nu;
    this.count = net.comparators.length + net.diodes.length;
    this.arena = new Arena(2 * nu * nu + 6 * nu + 4 * n);
    this.held0 = this.arena.take(n);
    this.held1 = this.arena.take(n);
    this.inj0 = this.arena.take(n);
    this.inj1 = this.arena.take(n);
    this.baseA = this.arena.take(nu * nu);
    this.work = this.arena.take(nu * nu);
    this.baseR0 = this.arena.take(nu);
    this.baseR1 = this.arena.take(nu);
    this.r0 = this.arena.take(nu);
    this.r1 = this.arena.take(nu);
    this.fixed = new Branches(net.resistors.length);
    this.on = new Branches(this.count);
    this.off = new Branches(this.count);
    this.hasOff = new Array<boolean>(this.count).fill(false);
    this.cPlus = net.comparators.map((c) => c.plus);
    this.cMinus = net.comparators.map((c) => c.minus);
    this.cVos = new Array<number>(net.comparators.length).fill(0);
    this.load(net);
  }

  /**
   * Takes the element values of `net`, which must be wired exactly like the network this solver was
   * built for. Earlier solutions are dropped and their storage reused: results that still refer to
   * them (the segments of an earlier sweep) are no longer valid.
   */
  load(net: Network): void {
    this.net = net;
    this.generation++;
    const { nu, held0, held1, inj0, inj1, baseA, baseR0, baseR1 } = this;
    held0.fill(0);
    held1.fill(0);
    inj0.fill(0);
    inj1.fill(0);
    baseA.fill(0);
    baseR0.fill(0);
    baseR1.fill(0);
    for (const s of net.vsources) {
      held0[s.node] = s.c0;
      held1[s.node] = s.c1;
    }
    for (let i = 0; i < nu; i++) baseA[i * nu + i] = GMIN;
    for (const s of net.isources) {
      this.inject(s.from, -s.c0, -s.c1);
      this.inject(s.to, s.c0, s.c1);
    }
    net.comparators.forEach((c, k) => {
      this.inject(c.plus, c.ibPlus, 0);
      this.inject(c.minus, c.ibMinus, 0);
      this.cVos[k] = c.vos;
      this.on.set(k, c.out, GND, 1 / c.rsat, c.vsat0);
      if (c.pushPull) {
        this.off.set(k, c.out, net.supply, 1 / c.rout, -c.vohDrop);
        this.hasOff[k] = true;
      }
    });
    for (let k = 0; k < this.size; k++) {
      const s = this.slot[k];
      if (s < 0) continue;
      baseR0[s] += inj0[k];
      baseR1[s] += inj1[k];
    }
    net.resistors.forEach((r, k) => {
      this.fixed.set(k, r.a, r.b, 1 / r.ohms, 0);
      this.stamp(baseA, baseR0, baseR1, this.fixed, k);
    });
    const nc = net.comparators.length;
    net.diodes.forEach((d, k) => this.on.set(nc + k, d.anode, d.cathode, 1 / (d.rSeries + d.rdyn), d.knee));
  }

  /** Solves the network in `state`, from the cache when it has been solved before. */
  solve(state: State): Solution {
    return this.solveKeyed(state, stateKey(state));
  }

  /** `solve` for a caller that already has the state's `stateKey`. */
  solveKeyed(state: State, key: number | string): Solution {
    const entry = this.cache.get(key);
    if (entry && entry.generation === this.generation) return entry.sol;
    const sol = this.factorAndSolve(state, entry?.sol);
    if (entry) entry.generation = this.generation;
    else {
      // A circuit that visits very many states (a long cycle search) must not grow this without end.
      if (this.cache.size >= CACHE_LIMIT) this.cache.clear();
      this.cache.set(key, { sol, generation: this.generation });
    }
    return sol;
  }

  /**
   * Current that voltage source j delivers into its node in `sol` (A), as the affine pair [c0, c1]:
   * what leaves the node through every branch, minus what is injected there.
   */
  sourceCurrent(sol: Solution, j: number): [number, number] {
    const node = this.net.vsources[j].node;
    const sums = [-this.inj0[node], -this.inj1[node]];
    const touch = this.touching(node);
    for (const k of touch.fixed) addBranchCurrent(sums, this.fixed, k, node, sol.v0, sol.v1);
    for (const k of touch.elements) {
      if (sol.state[k]) addBranchCurrent(sums, this.on, k, node, sol.v0, sol.v1);
      else if (this.hasOff[k]) addBranchCurrent(sums, this.off, k, node, sol.v0, sol.v1);
    }
    return [sums[0], sums[1]];
  }

  /** The fixed branches and the elements whose branches end at `node`, in index order (wiring only). */
  private touching(node: number): { fixed: number[]; elements: number[] } {
    let found = this.incident.get(node);
    if (!found) {
      const ends = (br: Branches, k: number) => br.a[k] === node || br.b[k] === node;
      found = { fixed: [], elements: [] };
      for (let k = 0; k < this.fixed.g.length; k++) if (ends(this.fixed, k)) found.fixed.push(k);
      for (let k = 0; k < this.count; k++) if (ends(this.on, k) || (this.hasOff[k] && ends(this.off, k))) found.elements.push(k);
      this.incident.set(node, found);
    }
    return found;
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

  /** Factors and solves `state`, into `reuse`'s arrays when given (a solution of an earlier `load`). */
  private factorAndSolve(state: State, reuse?: Solution): Solution {
    const { size: n, nu, r0, r1 } = this;
    this.stampState(state);
    let ok = choleskyEnvelope2(this.work, nu, this.first, r0, r1);
    if (!ok) {
      this.stampState(state);
      ok = luSolve2(this.work, nu, r0, r1);
    }
    // New solutions take their arrays from the arena: a typed array of its own costs about ten times more.
    const { arena } = this;
    const sol = reuse ?? {
      v0: arena.take(n), v1: arena.take(n), da: arena.take(state.length), db: arena.take(state.length),
      ok, state: new Uint8Array(state.length),
    };
    const { v0, v1, da, db } = sol;
    for (let k = 0; k < n; k++) {
      const s = this.slot[k];
      v0[k] = s < 0 ? this.held0[k] : r0[s];
      v1[k] = s < 0 ? this.held1[k] : r1[s];
    }
    const nc = this.cPlus.length;
    for (let k = 0; k < nc; k++) {
      const p = this.cPlus[k];
      const q = this.cMinus[k];
      da[k] = at(v0, q) - at(v0, p) - this.cVos[k];
      db[k] = at(v1, q) - at(v1, p);
    }
    const on = this.on;
    for (let k = nc; k < state.length; k++) {
      da[k] = at(v0, on.a[k]) - at(v0, on.b[k]) - on.e[k];
      db[k] = at(v1, on.a[k]) - at(v1, on.b[k]);
    }
    sol.ok = ok;
    sol.state.set(state);
    return sol;
  }
}

/** Adds the current leaving `node` through branch k (constant and per-x parts) to `sums`. */
function addBranchCurrent(sums: number[], br: Branches, k: number, node: number, v0: Float64Array, v1: Float64Array): void {
  const a = br.a[k];
  const b = br.b[k];
  const sign = a === node ? 1 : b === node ? -1 : 0;
  if (sign === 0) return;
  sums[0] += sign * br.g[k] * (at(v0, a) - at(v0, b) - br.e[k]);
  sums[1] += sign * br.g[k] * (at(v1, a) - at(v1, b));
}

function at(vec: Float64Array, node: number): number {
  return node === GND ? 0 : vec[node];
}

/**
 * Key of a state for caches and cycle detection: a number (bit k = element k) up to 52 elements,
 * exact in a double, and a text of 0s and 1s beyond.
 */
export function stateKey(state: State): number | string {
  const n = state.length;
  if (n <= 30) {
    // Small-integer bit operations: the common case, and the hot path of every sweep.
    let key = 0;
    // (−s) >>> 31 is 1 for any non-zero byte and 0 for zero: the truthiness of state[k], without a branch.
    for (let k = 0; k < n; k++) key |= (-state[k] >>> 31) << k;
    return key;
  }
  if (n > 52) {
    let text = '';
    for (let k = 0; k < n; k++) text += state[k] ? '1' : '0';
    return text;
  }
  let key = 0;
  let bit = 1;
  for (let k = 0; k < n; k++) {
    if (state[k]) key += bit;
    bit *= 2;
  }
  return key;
}

/**
 * The `stateKey` of `state` just after its element k changed, from the key before the change:
 * equal to `stateKey(state)` without a pass over the state (except for text keys).
 */
export function toggledKey(key: number | string, state: State, k: number): number | string {
  const n = state.length;
  if (typeof key === 'string' || n > 52) return stateKey(state);
  if (n <= 30) return key ^ (1 << k);
  const bit = 2 ** k;
  return state[k] ? key + bit : key - bit;
}

/** The state of `length` elements that `stateKey` turned into `key`. */
export function stateFromKey(key: number | string, length: number): State {
  const state = new Uint8Array(length);
  if (typeof key === 'string') {
    for (let k = 0; k < length; k++) state[k] = key[k] === '1' ? 1 : 0;
    return state;
  }
  let rest = key;
  for (let k = 0; k < length; k++) {
    state[k] = rest % 2;
    rest = Math.floor(rest / 2);
  }
  return state;
}
