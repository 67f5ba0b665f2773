import { type Envelope, envelopeOf, envelopeToDense, ldltEnvelope2, luSolve2 } from './factor';
import { type KernelArrays, kernelFor, type SolveKernel } from './kernel';
import { envelopeStarts, reverseCuthillMcKee } from './ordering';
import { GND, type Network } from './types';

/**
 * Factorisations after which a solver writes its wiring out as straight-line code (`kernel.ts`):
 * every spread run reaches it within its first trials; a one-off analysis does not, and keeps the
 * loops, which stay compiled from analysis to analysis.
 */
export const KERNEL_AFTER = 64;

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
 * Two-terminal branches in flat arrays: current from a[k] to b[k] = g[k]·(V(a) − V(b) − e[k]). The
 * ends (wiring, set once) are kept both as nodes (`a`, `b`) and as indices into a solver's extended
 * vectors (`ia`, `ib`, see `Solver`); `g` and `e` (values) are set by each `load`. Flat arrays keep
 * the per-state work free of object lookups.
 */
class Branches {
  readonly a: number[];
  readonly b: number[];
  readonly ia: number[];
  readonly ib: number[];
  readonly g: Float64Array;
  readonly e: Float64Array;
  /** Plain arrays and arena views: a typed array of its own costs about a microsecond to make. */
  constructor(count: number, arena: Arena) {
    this.a = new Array<number>(count).fill(GND);
    this.b = new Array<number>(count).fill(GND);
    this.ia = new Array<number>(count).fill(0);
    this.ib = new Array<number>(count).fill(0);
    this.g = arena.take(count);
    this.e = arena.take(count);
  }
  wire(k: number, a: number, b: number, ext: (node: number) => number): void {
    this.a[k] = a;
    this.b[k] = b;
    this.ia[k] = ext(a);
    this.ib[k] = ext(b);
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
 * unknowns, their envelope-friendly numbering and the envelope storage of the reordered matrix.
 * Networks that differ only in element values (spread trials) share one layout.
 */
export interface SolverLayout {
  /** Unknown index of every node, or -1 when a source holds it. */
  slot: Int32Array;
  /** Number of unknowns. */
  nu: number;
  /** Envelope storage of the reordered matrix (row starts and offsets). */
  envelope: Envelope;
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
  return { slot, nu, envelope: envelopeOf(envelopeStarts(nu, edges, index)) };
}

/**
 * A network prepared for repeated solves. Nodes held by a voltage source are known (affine in x),
 * so only the remaining nodes are unknowns; their conductance matrix is symmetric positive definite
 * and is solved by LDLᵀ factorisation in envelope storage (pivoting LU as the fallback). The
 * state-independent part is stamped once; each state adds only its own branches. Solutions are
 * cached per state. `load` re-values the solver for an identically wired network (spread trials),
 * reusing every buffer.
 *
 * Voltages live in two extended vectors (constant and per-unit-x parts): the unknowns first (where
 * the right-hand sides are stamped and solved in place), then the held nodes' source values, then a
 * zero for ground. Every branch end and margin pin is an index into them, so no per-node test is
 * left in the per-state work.
 */
export class Solver {
  /** The wiring-only part, to hand to a solver for an identically wired network. */
  readonly layout: SolverLayout;
  net: Network;
  /** Node count. */
  readonly size: number;
  private readonly nu: number;
  private readonly env: Envelope;
  private readonly count: number;
  /** Extended-vector index of every node (see the class comment). */
  private readonly ix: number[];
  private readonly arena: Arena;
  private readonly ext0: Float64Array;
  private readonly ext1: Float64Array;
  private readonly inj0: Float64Array;
  private readonly inj1: Float64Array;
  private readonly baseA: Float64Array;
  private readonly baseR0: Float64Array;
  private readonly baseR1: Float64Array;
  private readonly work: Float64Array;
  /** Fixed branches (resistors) and, per element, the branch it adds when set (on) or clear (off). */
  private readonly fixed: Branches;
  private readonly on: Branches;
  private readonly off: Branches;
  private readonly hasOff: number[];
  /** Each element's margin: ext[mPos] − ext[mNeg] − mOff (see Solution.da). */
  private readonly mPos: number[];
  private readonly mNeg: number[];
  private readonly mOff: Float64Array;
  /**
   * Solutions by state key, each tagged with the `load` it belongs to: after a `load` an entry of an
   * earlier one is refilled in place when its state comes up again, so a spread run reuses the same
   * few solutions trial after trial instead of emptying and refilling a map.
   */
  private readonly cache = new Map<number | string, { sol: Solution; generation: number }>();
  private generation = 0;
  /** The state `solveKeyed` answered last, and for which `load`. */
  private lastKey: number | string = -1;
  private lastSol: Solution | null = null;
  private lastGeneration = -1;
  /** Factorisations so far, counted up to KERNEL_AFTER. */
  private uses = 0;
  /** The straight-line code for this wiring, once it is hot (null before, or when too large). */
  private kernel: SolveKernel | null = null;
  private readonly arrays: KernelArrays;
  /** Per node, the branches that end there (see `touching`). */
  private readonly incident = new Map<number, { fixed: number[]; elements: number[] }>();

  /** Prepares `net`; pass the layout of an identically wired network to skip recomputing it. */
  constructor(net: Network, layout: SolverLayout = solverLayout(net)) {
    this.net = net;
    this.layout = layout;
    const n = net.nodes.length;
    const nu = layout.nu;
    this.size = n;
    this.nu = nu;
    this.env = layout.envelope;
    this.count = net.comparators.length + net.diodes.length;
    const ix = new Array<number>(n).fill(0);
    let held = nu;
    for (let k = 0; k < n; k++) ix[k] = layout.slot[k] >= 0 ? layout.slot[k] : held++;
    this.ix = ix;
    const ground = held;
    const ext = (node: number) => (node === GND ? ground : ix[node]);
    // The fixed arrays below, and room for the first few solutions (v0, v1, da, db each).
    const fixedSize = 2 * (ground + 1) + 2 * n + 2 * this.env.size + 2 * nu + 2 * net.resistors.length + 5 * this.count;
    this.arena = new Arena(fixedSize + 3 * (2 * n + 2 * this.count));
    this.ext0 = this.arena.take(ground + 1);
    this.ext1 = this.arena.take(ground + 1);
    this.inj0 = this.arena.take(n);
    this.inj1 = this.arena.take(n);
    this.baseA = this.arena.take(this.env.size);
    this.work = this.arena.take(this.env.size);
    this.baseR0 = this.arena.take(nu);
    this.baseR1 = this.arena.take(nu);
    this.fixed = new Branches(net.resistors.length, this.arena);
    this.on = new Branches(this.count, this.arena);
    this.off = new Branches(this.count, this.arena);
    this.hasOff = new Array<number>(this.count).fill(0);
    this.mPos = new Array<number>(this.count).fill(0);
    this.mNeg = new Array<number>(this.count).fill(0);
    this.mOff = this.arena.take(this.count);
    net.resistors.forEach((r, k) => this.fixed.wire(k, r.a, r.b, ext));
    net.comparators.forEach((c, k) => {
      this.on.wire(k, c.out, GND, ext);
      if (c.pushPull) {
        this.off.wire(k, c.out, net.supply, ext);
        this.hasOff[k] = 1;
      }
      this.mPos[k] = ext(c.minus);
      this.mNeg[k] = ext(c.plus);
    });
    const nc = net.comparators.length;
    net.diodes.forEach((d, k) => {
      this.on.wire(nc + k, d.anode, d.cathode, ext);
      this.mPos[nc + k] = ext(d.anode);
      this.mNeg[nc + k] = ext(d.cathode);
    });
    const { work, baseA, ext0, ext1, baseR0, baseR1, on, off, mOff } = this;
    this.arrays = { work, baseA, ext0, ext1, baseR0, baseR1, onG: on.g, onE: on.e, offG: off.g, offE: off.e, mOff };
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
    const { nu, ext0, ext1, ix, inj0, inj1, baseA, baseR0, baseR1, env, on, off, fixed, mOff } = this;
    ext0.fill(0);
    ext1.fill(0);
    inj0.fill(0);
    inj1.fill(0);
    baseA.fill(0);
    const { vsources, isources, comparators, resistors, diodes } = net;
    for (let j = 0; j < vsources.length; j++) {
      const s = vsources[j];
      ext0[ix[s.node]] = s.c0;
      ext1[ix[s.node]] = s.c1;
    }
    for (let i = 0; i < nu; i++) baseA[env.base[i] + i] = GMIN;
    for (let j = 0; j < isources.length; j++) {
      const s = isources[j];
      this.inject(s.from, -s.c0, -s.c1);
      this.inject(s.to, s.c0, s.c1);
    }
    const nc = comparators.length;
    for (let k = 0; k < nc; k++) {
      const c = comparators[k];
      this.inject(c.plus, c.ibPlus, 0);
      this.inject(c.minus, c.ibMinus, 0);
      mOff[k] = c.vos;
      on.g[k] = 1 / c.rsat;
      on.e[k] = c.vsat0;
      if (this.hasOff[k]) {
        off.g[k] = 1 / c.rout;
        off.e[k] = -c.vohDrop;
      }
    }
    for (let k = 0; k < this.size; k++) {
      const s = ix[k];
      if (s >= nu) continue;
      baseR0[s] = inj0[k];
      baseR1[s] = inj1[k];
    }
    for (let k = 0; k < resistors.length; k++) {
      const r = resistors[k];
      fixed.g[k] = 1 / r.ohms;
      this.stamp(baseA, baseR0, baseR1, fixed, k);
    }
    for (let k = 0; k < diodes.length; k++) {
      const d = diodes[k];
      on.g[nc + k] = 1 / (d.rSeries + d.rdyn);
      on.e[nc + k] = d.knee;
      mOff[nc + k] = d.knee;
    }
  }

  /** Solves the network in `state`, from the cache when it has been solved before. */
  solve(state: State): Solution {
    return this.solveKeyed(state, stateKey(state));
  }

  /** `solve` for a caller that already has the state's `stateKey`. */
  solveKeyed(state: State, key: number | string): Solution {
    // A sweep asks for the same state several times in a row (walk, settle, walk): skip the map then.
    if (key === this.lastKey && this.lastGeneration === this.generation) return this.lastSol!;
    let entry = this.cache.get(key);
    if (entry === undefined) {
      // A circuit that visits very many states (a long cycle search) must not grow this without end.
      if (this.cache.size >= CACHE_LIMIT) this.cache.clear();
      entry = { sol: this.factorAndSolve(state), generation: this.generation };
      this.cache.set(key, entry);
    } else if (entry.generation !== this.generation) {
      this.factorAndSolve(state, entry.sol);
      entry.generation = this.generation;
    }
    this.lastKey = key;
    this.lastSol = entry.sol;
    this.lastGeneration = this.generation;
    return entry.sol;
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

  /**
   * Adds branch k of `br` to the reduced system (matrix `m` in envelope storage, right-hand sides
   * `r0`, `r1`): held node voltages (and ground's zero) move to the right-hand sides.
   */
  private stamp(m: Float64Array, r0: Float64Array, r1: Float64Array, br: Branches, k: number): void {
    const { nu, ext0, ext1 } = this;
    const base = this.env.base;
    const ia = br.ia[k];
    const ib = br.ib[k];
    const g = br.g[k];
    const e = br.e[k];
    if (ia < nu) {
      m[base[ia] + ia] += g;
      r0[ia] += g * e;
      if (ib >= nu) {
        r0[ia] += g * ext0[ib];
        r1[ia] += g * ext1[ib];
      } else if (ib < ia) m[base[ia] + ib] -= g;
    }
    if (ib < nu) {
      m[base[ib] + ib] += g;
      r0[ib] -= g * e;
      if (ia >= nu) {
        r0[ib] += g * ext0[ia];
        r1[ib] += g * ext1[ia];
      } else if (ia < ib) m[base[ib] + ia] -= g;
    }
  }

  /** Stamps `state` into the working matrix and the unknowns' part of the extended vectors. */
  private stampState(state: State): void {
    const { work, ext0, ext1, baseR0, baseR1, nu } = this;
    work.set(this.baseA);
    for (let i = 0; i < nu; i++) {
      ext0[i] = baseR0[i];
      ext1[i] = baseR1[i];
    }
    for (let k = 0; k < state.length; k++) {
      if (state[k]) this.stamp(work, ext0, ext1, this.on, k);
      else if (this.hasOff[k]) this.stamp(work, ext0, ext1, this.off, k);
    }
  }

  /** Whether this solver runs its wiring's straight-line code (see KERNEL_AFTER). */
  get compiled(): boolean {
    return this.kernel !== null;
  }

  /** Factors and solves `state`, into `reuse`'s arrays when given (a solution of an earlier `load`). */
  private factorAndSolve(state: State, reuse?: Solution): Solution {
    const { size: n, nu, ext0, ext1, ix } = this;
    if (this.kernel === null && ++this.uses === KERNEL_AFTER) {
      const { env, on, off, hasOff, mPos, mNeg } = this;
      this.kernel = kernelFor({ env, nu, ix, onA: on.ia, onB: on.ib, offA: off.ia, offB: off.ib, hasOff, mPos, mNeg });
    }
    // New solutions take their arrays from the arena: a typed array of its own costs about ten times more.
    const { arena } = this;
    const sol = reuse ?? {
      v0: arena.take(n), v1: arena.take(n), da: arena.take(state.length), db: arena.take(state.length),
      ok: true, state: new Uint8Array(state.length),
    };
    sol.state.set(state);
    const { v0, v1, da, db } = sol;
    let ok: boolean;
    if (this.kernel !== null) {
      ok = this.kernel(state, this.arrays, v0, v1, da, db);
      if (ok) {
        sol.ok = true;
        return sol;
      }
    } else {
      this.stampState(state);
      ok = ldltEnvelope2(this.work, this.env, ext0, ext1);
    }
    if (!ok) {
      this.stampState(state);
      ok = luSolve2(envelopeToDense(this.work, this.env), nu, ext0.subarray(0, nu), ext1.subarray(0, nu));
    }
    for (let k = 0; k < n; k++) {
      v0[k] = ext0[ix[k]];
      v1[k] = ext1[ix[k]];
    }
    const { mPos, mNeg, mOff } = this;
    for (let k = 0; k < state.length; k++) {
      const p = mPos[k];
      const q = mNeg[k];
      da[k] = ext0[p] - ext0[q] - mOff[k];
      db[k] = ext1[p] - ext1[q];
    }
    sol.ok = ok;
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
