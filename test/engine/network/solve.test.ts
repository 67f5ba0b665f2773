import { lusolve } from 'mathjs';
import { describe, expect, test } from 'vitest';
import { GMIN, KERNEL_AFTER, Solver, stateFromKey, stateKey, toggledKey } from '../../../src/engine/network/solve';
import { GND, type Network } from '../../../src/engine/network/types';
import { logUniform, rng } from '../../helpers/random';

/** A random connected network with every kind of element, in a random state. */
function randomNetwork(seed: number): { net: Network; state: Uint8Array } {
  const r = rng(seed);
  const n = 6 + Math.floor(r() * 10);
  const nodes = Array.from({ length: n }, (_, k) => `n${k}`);
  const pick = () => Math.floor(r() * (n + 1)) - 1; // includes GND
  const net: Network = { nodes, resistors: [], vsources: [], isources: [], comparators: [], diodes: [], supply: 0, supplySource: 0, quiescent: 0 };
  // A spanning tree to ground keeps every node connected, then extra random branches.
  for (let k = 0; k < n; k++) net.resistors.push({ id: `T${k}`, a: k, b: k === 0 ? GND : Math.floor(r() * k), ohms: logUniform(r, 10, 1e6) });
  for (let k = 0; k < n; k++) {
    const a = pick();
    const b = pick();
    if (a !== b) net.resistors.push({ id: `X${k}`, a, b, ohms: logUniform(r, 10, 1e6) });
  }
  net.vsources.push({ id: 'V0', node: 0, c0: r() * 20 - 5, c1: r() * 2 });
  if (n > 8) net.vsources.push({ id: 'V1', node: n - 1, c0: r() * 5, c1: 0 });
  net.isources.push({ id: 'I0', from: pick(), to: 1, c0: r() * 1e-3, c1: r() * 1e-4 });
  for (let k = 0; k < 2; k++) {
    net.comparators.push({ id: `C${k}`, plus: 2 + k, minus: 3 + k, out: 4 + k, vos: 1e-3, ibPlus: 1e-7, ibMinus: -2e-7, vsat0: 0.1, rsat: 50, pushPull: k === 1, vohDrop: 0.2, rout: 100 });
  }
  net.diodes.push({ id: 'D0', kind: 'led', anode: 0, cathode: 4, knee: 1.9, rSeries: 1000, rdyn: 20 });
  const state = Uint8Array.from([r() < 0.5 ? 1 : 0, r() < 0.5 ? 1 : 0, r() < 0.5 ? 1 : 0]);
  return { net, state };
}

/**
 * Independent reference: builds the modified nodal equations element by element, with every
 * Thevenin branch (saturated output, push-pull high, conducting LED) written as its own source, and
 * solves them with mathjs lusolve (a general-purpose reference library).
 */
function referenceVoltages(net: Network, state: Uint8Array, x: number): number[] {
  const n = net.nodes.length;
  const m = net.vsources.length;
  const A = Array.from({ length: n + m }, () => new Array<number>(n + m).fill(0));
  const b = new Array<number>(n + m).fill(0);
  const branch = (a: number, c: number, ohms: number, emf: number) => {
    // Current from a to c = (Va − Vc − emf)/ohms.
    const g = 1 / ohms;
    if (a >= 0) { A[a][a] += g; b[a] += g * emf; }
    if (c >= 0) { A[c][c] += g; b[c] -= g * emf; }
    if (a >= 0 && c >= 0) { A[a][c] -= g; A[c][a] -= g; }
  };
  for (let k = 0; k < n; k++) A[k][k] += GMIN;
  for (const res of net.resistors) branch(res.a, res.b, res.ohms, 0);
  net.vsources.forEach((s, j) => { A[n + j][s.node] = 1; A[s.node][n + j] = 1; b[n + j] = s.c0 + s.c1 * x; });
  for (const s of net.isources) {
    const i = s.c0 + s.c1 * x;
    if (s.from >= 0) b[s.from] -= i;
    if (s.to >= 0) b[s.to] += i;
  }
  net.comparators.forEach((c, k) => {
    b[c.plus] += c.ibPlus;
    b[c.minus] += c.ibMinus;
    if (state[k]) branch(c.out, GND, c.rsat, c.vsat0);
    else if (c.pushPull) branch(c.out, net.supply, c.rout, -c.vohDrop);
  });
  net.diodes.forEach((d, k) => {
    if (state[net.comparators.length + k]) branch(d.anode, d.cathode, d.rSeries + d.rdyn, d.knee);
  });
  const sol = lusolve(A, b) as number[][];
  // Node voltages, then each source's delivered current (the MNA unknown is the current into it).
  return sol.map((row, k) => (k < n ? row[0] : -row[0]));
}

describe('Solver', () => {
  test('node voltages and source currents equal mathjs lusolve on 200 random networks (6 significant digits)', () => {
    for (let seed = 1; seed <= 200; seed++) {
      const { net, state } = randomNetwork(seed);
      const solver = new Solver(net);
      const sol = solver.solve(state);
      const n = net.nodes.length;
      for (const x of [0, 3.7]) {
        const ref = referenceVoltages(net, state, x);
        ref.forEach((v, k) => {
          const [c0, c1] = k < n ? [sol.v0[k], sol.v1[k]] : solver.sourceCurrent(sol, k - n);
          const got = c0 + c1 * x;
          expect(Math.abs(got - v)).toBeLessThanOrEqual(1e-6 * Math.max(1e-3, Math.abs(v)));
        });
      }
    }
  });

  test('a repeated state is answered from the cache (same object)', () => {
    const { net, state } = randomNetwork(7);
    const solver = new Solver(net);
    expect(solver.solve(state)).toBe(solver.solve(state.slice()));
  });

  test('load re-values the solver for the same wiring: same answers as a fresh solver', () => {
    const a = randomNetwork(11);
    const b = randomNetwork(11);
    b.net.resistors = b.net.resistors.map((r) => ({ ...r, ohms: r.ohms * 1.37 }));
    const reused = new Solver(a.net);
    reused.solve(a.state);
    reused.load(b.net);
    const fresh = new Solver(b.net).solve(b.state);
    const again = reused.solve(b.state);
    expect([...again.v0]).toEqual([...fresh.v0]);
    expect([...again.v1]).toEqual([...fresh.v1]);
  });
});

/** A solver of `net` that has factored KERNEL_AFTER times, so it runs its straight-line code. */
function hotSolver(net: Network): Solver {
  const solver = new Solver(net);
  const state = new Uint8Array(net.comparators.length + net.diodes.length);
  for (let k = 0; k < KERNEL_AFTER; k++) {
    solver.load(net);
    solver.solve(state);
  }
  expect(solver.compiled).toBe(true);
  return solver;
}

/** Every number a solution holds, for bit-for-bit comparison. */
const bits = (s: { v0: Float64Array; v1: Float64Array; da: Float64Array; db: Float64Array; ok: boolean }) => ({
  ok: s.ok,
  v0: [...s.v0],
  v1: [...s.v1],
  da: [...s.da],
  db: [...s.db],
});

describe('Solver written out as straight-line code', () => {
  test("gives the loops' results bit for bit, in every state of 60 random networks, and mathjs lusolve's voltages", () => {
    for (let seed = 300; seed < 360; seed++) {
      const { net } = randomNetwork(seed);
      const hot = hotSolver(net);
      const count = net.comparators.length + net.diodes.length;
      for (let key = 0; key < 2 ** count; key++) {
        const state = stateFromKey(key, count);
        const compiled = hot.solve(state);
        expect(bits(compiled)).toEqual(bits(new Solver(net).solve(state)));
        // Reference: mathjs lusolve on the modified nodal equations, as in the test above.
        const ref = referenceVoltages(net, state, 1.5);
        for (let k = 0; k < net.nodes.length; k++) {
          expect(Math.abs(compiled.v0[k] + 1.5 * compiled.v1[k] - ref[k])).toBeLessThanOrEqual(1e-6 * Math.max(1e-3, Math.abs(ref[k])));
        }
      }
    }
  });

  test('a wiring too large to write out keeps the loops, with the same answers', () => {
    // 80 nodes joined by 600 random resistors: the envelope is nearly full, far past the statement limit.
    const r = rng(90);
    const n = 80;
    const net: Network = { nodes: Array.from({ length: n }, (_, k) => `n${k}`), resistors: [], vsources: [{ id: 'V0', node: 0, c0: 5, c1: 1 }], isources: [], comparators: [], diodes: [], supply: 0, supplySource: 0, quiescent: 0 };
    for (let k = 1; k < n; k++) net.resistors.push({ id: `T${k}`, a: k, b: k - 1, ohms: logUniform(r, 100, 1e5) });
    for (let k = 0; k < 600; k++) net.resistors.push({ id: `X${k}`, a: Math.floor(r() * n), b: Math.floor(r() * n) - 1, ohms: logUniform(r, 100, 1e5) });
    const solver = new Solver(net);
    for (let k = 0; k < KERNEL_AFTER + 1; k++) {
      solver.load(net);
      solver.solve(new Uint8Array(0));
    }
    expect(solver.compiled).toBe(false);
    expect(bits(solver.solve(new Uint8Array(0)))).toEqual(bits(new Solver(net).solve(new Uint8Array(0))));
  });

  test('falls back to pivoting LU as the loops do when the matrix is not positive definite', () => {
    // A negative resistance (not a physical part) makes the matrix indefinite: LDLᵀ fails part-way.
    for (let seed = 400; seed < 420; seed++) {
      const { net, state } = randomNetwork(seed);
      const hot = hotSolver(net);
      const odd = { ...net, resistors: net.resistors.map((r, k) => (k === 1 ? { ...r, ohms: -r.ohms / 3 } : r)) };
      hot.load(odd);
      expect(bits(hot.solve(state))).toEqual(bits(new Solver(odd).solve(state)));
    }
  });
});

describe('state keys', () => {
  test('a key is the state read as binary digits, any non-zero byte a 1, and turns back into the state', () => {
    // Reference: positional binary notation (bit k = element k), worked by hand: 1 + 4 + 8 = 13.
    expect(stateKey(Uint8Array.from([1, 0, 1, 1]))).toBe(13);
    expect(stateKey(Uint8Array.from([255, 0, 2, 1]))).toBe(13);
    expect([...stateFromKey(13, 4)]).toEqual([1, 0, 1, 1]);
    const wide = new Uint8Array(40);
    wide[39] = 1;
    expect(stateKey(wide)).toBe(2 ** 39);
  });

  test('the key after one element changes equals the key computed afresh, for short, long and text keys', () => {
    // Reference: stateKey of the changed state.
    const r = rng(5);
    for (const n of [4, 30, 31, 52, 53, 60]) {
      const state = Uint8Array.from({ length: n }, () => (r() < 0.5 ? 1 : 0));
      let key = stateKey(state);
      for (let step = 0; step < 20; step++) {
        const k = Math.floor(r() * n);
        state[k] = state[k] ? 0 : 1;
        key = toggledKey(key, state, k);
        expect(key).toBe(stateKey(state));
      }
    }
  });
});
