import { type Solution, type Solver, type State, stateFromKey, stateKey, toggledKey } from './network/solve';
import { GND } from './network/types';

/** Sweep direction: x rising or falling. */
export type Direction = 'up' | 'down';

/** One element changing state during a sweep. */
export interface Flip {
  /** Index into the state vector (comparators first, then diodes). */
  element: number;
  /** New value: for a comparator true = sinking; for a diode true = conducting. */
  to: boolean;
  /** Where it happened (unit of x). */
  x: number;
  direction: Direction;
  /** Voltages at the comparator's + and − pins just before the flip (V); 0 for diodes. */
  pinPlus: number;
  pinMinus: number;
}

/** A stretch of x in one state. */
export interface SweepSegment {
  direction: Direction;
  from: number;
  to: number;
  state: State;
}

/** A band with no stable state. */
export interface Band {
  direction: Direction;
  from: number;
  to: number;
  /** Indices of the elements that cycle. */
  elements: number[];
}

/** Result of sweeping up from `min` to `max` and back down. */
export interface SweepResult {
  flips: Flip[];
  /** Stretches of x in one state; empty when the sweep was asked not to record them. */
  segments: SweepSegment[];
  bands: Band[];
  /** State at the start (x = min, settled going up). */
  initial: State;
}

/** Options of a sweep. */
export interface SweepOptions {
  /** Whether to record the segments; default true. Spread trials need only the flips and bands. */
  segments?: boolean;
  /**
   * Called for every flip (after the starting state is settled) instead of recording it in `flips`:
   * no Flip objects and no pin voltages, the lean path of spread trials.
   */
  onFlip?: (element: number, to: boolean, x: number, direction: Direction) => void;
}

/** What one sweep carries through its walks and settles. */
interface SweepRun {
  solver: Solver;
  out: SweepResult;
  /** Keys of the states one settle has been through (reused by each settle; one array per sweep). */
  seen: (number | string)[];
  segments: boolean;
  /** Key of the state the last settle returned. */
  key: number | string;
  onFlip: SweepOptions['onFlip'];
  /** False while the starting state is settled: those flips are not transitions of the circuit. */
  recording: boolean;
}

/** Numerical zero for margins (V). */
const TOL = 1e-12;

/** The first flip of `element` in `direction`, or undefined when it never changes going that way. */
export function firstFlip(result: SweepResult, element: number, direction: Direction): Flip | undefined {
  return result.flips.find((f) => f.element === element && f.direction === direction);
}

/**
 * Starting guess at x: every comparator high, and every diode conducting where it would conduct with
 * all of them off. With the comparators fixed the diodes' states are unique (a resistive network with
 * monotone diodes has one solution), so this guess changes no result; it only spares the solves of
 * switching the diodes on one at a time.
 */
function diodeGuess(solver: Solver, x: number): State {
  const nc = solver.net.comparators.length;
  const state: State = new Uint8Array(nc + solver.net.diodes.length);
  const off = solver.solve(state);
  for (let k = nc; k < state.length; k++) if (off.da[k] + off.db[k] * x > 0) state[k] = 1;
  return state;
}

/**
 * How badly an element's state is violated just past x in `dir` (0 when consistent), from its
 * decision a + b·x (`Solution.da`, `db`) and whether it is set: its margin, positive when the state
 * holds, is the decision for a set element and minus it for a clear one.
 */
function violation(a: number, b: number, set: boolean, x: number, sign: number): number {
  const bx = b * x;
  const m = set ? a + bx : -(a + bx);
  const scale = TOL * (1 + Math.abs(a) + Math.abs(bx));
  if (m > scale) return 0;
  if (m < -scale) return -m;
  return (set ? b : -b) * sign < 0 ? TOL * 1e-3 : 0;
}

/**
 * The exact event-driven sweep of ENGINE.md §2: settles a consistent state at `min`, then walks from
 * event to event up to `max` and back down, settling cascades and reporting bands with no stable
 * state. Iterations are bounded by the element count. Settling starts from `diodeGuess`, or from
 * `guess` (e.g. the nominal circuit's starting state when sweeping a perturbed copy), which saves
 * the solves of flipping into it when it is already consistent.
 */
export function sweep(solver: Solver, min: number, max: number, guess?: State, options: SweepOptions = {}): SweepResult {
  const net = solver.net;
  const count = net.comparators.length + net.diodes.length;
  const result: SweepResult = { flips: [], segments: [], bands: [], initial: new Uint8Array(count) };
  const run: SweepRun = { solver, out: result, seen: [], segments: options.segments !== false, key: 0, onFlip: options.onFlip, recording: false };
  let state: State = guess && guess.length === count ? guess.slice() : diodeGuess(solver, min);
  state = settle(run, state, min, 'up', max);
  // Settling the starting state is not a transition of the circuit: only later flips are trips.
  result.flips.length = 0;
  run.recording = true;
  result.initial = state.slice();
  state = walk(run, state, min, max, 'up');
  walk(run, state, max, min, 'down');
  return result;
}

function walk(run: SweepRun, start: State, from: number, to: number, dir: Direction): State {
  const { solver, out } = run;
  const sign = dir === 'up' ? 1 : -1;
  let state = start;
  let x = from;
  let key = stateKey(state);
  const limit = 4 * (state.length + 2) * (state.length + 2) + 16;
  for (let step = 0; step < limit; step++) {
    const sol = solver.solveKeyed(state, key);
    let next = to;
    const { da, db } = sol;
    for (let k = 0; k < state.length; k++) {
      // The margin, signed so that positive keeps element k as it is, is ±(da + db·x): it heads
      // for its edge when its slope points against the sweep, and reaches it where da + db·x = 0.
      const b = db[k];
      if ((state[k] ? b : -b) * sign >= 0) continue;
      const xz = -da[k] / b;
      // An element already at its edge was flipped by settle; only strictly later crossings count.
      if ((xz - x) * sign <= 0) continue;
      if ((xz - next) * sign < 0) next = xz;
    }
    // The solution keeps its own copy of the state, so segments can share it.
    if (run.segments && (next - x) * sign > 0) pushSegment(out, dir, x, next, sol.state);
    if (next === to) return state;
    x = next;
    state = settle(run, state, x, dir, to);
    key = run.key;
    // Guarded: reading index −1 of an empty array is a slow named-property lookup.
    const band = out.bands.length > 0 ? out.bands[out.bands.length - 1] : undefined;
    if (band && band.direction === dir && band.from === x) {
      if (band.to === to) return state;
      x = band.to;
    }
  }
  return state;
}

function pushSegment(out: SweepResult, dir: Direction, a: number, b: number, state: State): void {
  const last = out.segments.length > 0 ? out.segments[out.segments.length - 1] : undefined;
  const from = Math.min(a, b);
  const to = Math.max(a, b);
  if (last && last.direction === dir && sameState(last.state, state)) {
    last.from = Math.min(last.from, from);
    last.to = Math.max(last.to, to);
    return;
  }
  out.segments.push({ direction: dir, from, to, state });
}

function voltageAt(sol: Solution, node: number, x: number): number {
  return node === GND ? 0 : sol.v0[node] + sol.v1[node] * x;
}

function sameState(a: State, b: State): boolean {
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return false;
  return true;
}

/**
 * Flips the most violated element until the state is consistent just past x (changing `start` in
 * place; the sweep owns it). A repeated state is a
 * cycle: the band with no stable state is recorded and the sweep resumes where a cycle state becomes
 * consistent again.
 */
function settle(run: SweepRun, start: State, x: number, dir: Direction, to: number): State {
  const { solver, out, seen } = run;
  const sign = dir === 'up' ? 1 : -1;
  const nc = solver.net.comparators.length;
  let seenCount = 0;
  const state = start;
  let key = stateKey(state);
  const limit = 4 * state.length + 8;
  for (let step = 0; step <= limit; step++) {
    let repeat = -1;
    for (let i = 0; i < seenCount && repeat < 0; i++) if (seen[i] === key) repeat = i;
    if (repeat >= 0) {
      const escaped = escapeBand(solver, seen.slice(repeat, seenCount).map((k) => stateFromKey(k, state.length)), x, dir, out, to);
      run.key = stateKey(escaped);
      return escaped;
    }
    seen[seenCount++] = key;
    const sol = solver.solveKeyed(state, key);
    const { da, db } = sol;
    let worst = -1;
    let amount = 0;
    for (let k = 0; k < state.length; k++) {
      const v = violation(da[k], db[k], state[k] !== 0, x, sign);
      if (v > amount) {
        amount = v;
        worst = k;
      }
    }
    if (worst < 0) {
      run.key = key;
      return state;
    }
    if (run.onFlip) {
      state[worst] = state[worst] ? 0 : 1;
      key = toggledKey(key, state, worst);
      if (run.recording) run.onFlip(worst, state[worst] === 1, x, dir);
      continue;
    }
    let pinPlus = 0;
    let pinMinus = 0;
    if (worst < nc) {
      const c = solver.net.comparators[worst];
      pinPlus = voltageAt(sol, c.plus, x);
      pinMinus = voltageAt(sol, c.minus, x);
    }
    state[worst] = state[worst] ? 0 : 1;
    key = toggledKey(key, state, worst);
    out.flips.push({ element: worst, to: state[worst] === 1, x, direction: dir, pinPlus, pinMinus });
  }
  run.key = key;
  return state;
}

function escapeBand(solver: Solver, states: State[], x: number, dir: Direction, out: SweepResult, to: number): State {
  const sign = dir === 'up' ? 1 : -1;
  const elements: number[] = [];
  for (let k = 0; k < states[0].length; k++) {
    if (states.some((s) => s[k] !== states[0][k])) elements.push(k);
  }
  let bestX = to;
  let best = states[0];
  for (const s of states) {
    const sol = solver.solve(s);
    // The state is consistent on the interval where every margin is >= 0; find where that starts.
    let lo = -Infinity;
    let hi = Infinity;
    for (let k = 0; k < s.length; k++) {
      const flip = s[k] ? 1 : -1;
      const a = sol.da[k] * flip;
      const b = sol.db[k] * flip;
      if (b === 0) {
        if (a < 0) lo = Infinity;
        continue;
      }
      const xz = -a / b;
      if (b > 0) lo = Math.max(lo, xz);
      else hi = Math.min(hi, xz);
    }
    if (lo > hi) continue;
    const enter = sign > 0 ? lo : hi;
    const candidate = (enter - x) * sign > 0 ? enter : null;
    if (candidate !== null && (candidate - bestX) * sign < 0) {
      bestX = candidate;
      best = s;
    }
  }
  out.bands.push({ direction: dir, from: x, to: bestX, elements });
  return best.slice();
}
