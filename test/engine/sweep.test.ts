import { describe, expect, test } from 'vitest';
import { analyze } from '../../src/engine/analyze';
import type { Design } from '../../src/engine/design/types';
import { buildNetwork } from '../../src/engine/network/build';
import { Solver } from '../../src/engine/network/solve';
import { sweep } from '../../src/engine/sweep';
import { GND } from '../../src/engine/network/types';
import { fourStepDesign, makeDesign, stepChannel } from '../helpers/designs';
import { logUniform, rng } from '../helpers/random';

/**
 * Test-only brute force: walks x in 1 mV steps, and inside any step where the present state stops
 * being consistent, in 1 µV steps; at each inconsistency it flips the first inconsistent element
 * (not the most violated) until the state holds. Shares only the linear solver (checked against
 * mathjs in solve.test.ts) with the engine.
 */
function bruteForceTrips(design: Design): Map<string, { up: number; down: number }> {
  const net = buildNetwork(design);
  const solver = new Solver(net);
  const nc = net.comparators.length;
  const v = (sol: { v0: Float64Array; v1: Float64Array }, node: number, x: number) => (node === GND ? 0 : sol.v0[node] + sol.v1[node] * x);
  const firstBad = (state: Uint8Array, x: number): number => {
    const sol = solver.solve(state);
    for (let k = 0; k < state.length; k++) {
      let m: number;
      if (k < nc) {
        const c = net.comparators[k];
        m = v(sol, c.minus, x) - v(sol, c.plus, x) - c.vos;
      } else {
        const d = net.diodes[k - nc];
        m = v(sol, d.anode, x) - v(sol, d.cathode, x) - d.knee;
      }
      if ((state[k] ? m : -m) < 0) return k;
    }
    return -1;
  };
  const trips = new Map<string, { up: number; down: number }>();
  const relax = (state: Uint8Array, x: number, dir: 'up' | 'down') => {
    for (let guard = 0; guard < 100; guard++) {
      const k = firstBad(state, x);
      if (k < 0) return;
      state[k] ^= 1;
      if (k < nc) {
        const id = net.comparators[k].id;
        const t = trips.get(id) ?? { up: NaN, down: NaN };
        if (Number.isNaN(t[dir])) t[dir] = x;
        trips.set(id, t);
      }
    }
  };
  const state = new Uint8Array(nc + net.diodes.length);
  const { min, max } = design.quantity;
  relax(state, min, 'up');
  trips.clear();
  for (const dir of ['up', 'down'] as const) {
    const h = dir === 'up' ? 1e-3 : -1e-3;
    const steps = Math.round((max - min) / 1e-3);
    for (let s = 1; s <= steps; s++) {
      const x0 = dir === 'up' ? min + (s - 1) * 1e-3 : max - (s - 1) * 1e-3;
      if (firstBad(state, x0 + h) < 0) continue;
      for (let f = 1; f <= 1000; f++) {
        const x = x0 + (h * f) / 1000;
        if (firstBad(state, x) >= 0) {
          relax(state, x, dir);
          break;
        }
      }
    }
  }
  return trips;
}

/** One channel whose feedback goes to its own inverting input: a band with no stable state. */
function oscillating(): Design {
  return makeDesign({
    string: [10e3, 10e3],
    channels: [stepChannel('N', 1, 'T1', { seriesMinus: 10e3, feedback: { ohms: 100e3, to: 'minus' }, pullup: { ohms: 10e3, to: 'supply' } })],
  });
}

describe('shared-string interaction', () => {
  const design = fourStepDesign(1e6);
  const exact = analyze(design);

  test('the exact sweep equals a brute-force fine-step simulation to 0.1 mV', () => {
    const brute = bruteForceTrips(design);
    for (const c of exact.channels) {
      expect(Math.abs((c.rising?.x ?? NaN) - brute.get(c.id)!.up)).toBeLessThan(1e-4);
      expect(Math.abs((c.falling?.x ?? NaN) - brute.get(c.id)!.down)).toBeLessThan(1e-4);
    }
  });

  test('the exact sweep differs from the isolated-channel formula by more than 1 mV somewhere', () => {
    // Isolated channel (each tap alone, textbook Thevenin + Schmitt superposition, see analyze.test.ts):
    // tap Thevenin Vth = Vref·Rbelow/Rtotal, Rth = Rabove‖Rbelow; output high ≈ Vsupply − LED knee,
    // low ≈ 0 V; V_H = (Vth/Rth + Vhigh/Rf)/(1/Rth + 1/Rf), V_L = Vth·Rf/(Rth + Rf).
    const total = design.string.reduce((a, b) => a + b, 0);
    const supply = design.supply.kind === 'fixed' ? design.supply.volts : 0;
    let worst = 0;
    for (const ch of design.channels) {
      const k = Number(ch.plus.slice(1));
      const above = design.string.slice(0, k).reduce((a, b) => a + b, 0);
      const below = total - above;
      const vth = (5 * below) / total;
      const rth = (above * below) / total;
      const rf = ch.feedback!.ohms;
      const vhigh = supply - ch.led!.knee;
      const vh = (vth / rth + vhigh / rf) / (1 / rth + 1 / rf);
      const vl = (vth * rf) / (rth + rf);
      const c = exact.channels.find((r) => r.id === ch.id)!;
      worst = Math.max(worst, Math.abs(c.rising!.x - vh), Math.abs(c.falling!.x - vl));
    }
    expect(worst).toBeGreaterThan(1e-3);
  });
});

describe('properties', () => {
  test('positive feedback gives rising >= falling on 100 random four-step designs', () => {
    const r = rng(42);
    for (let n = 0; n < 100; n++) {
      const d = fourStepDesign(logUniform(r, 1e5, 1e8));
      d.string = d.string.map(() => logUniform(r, 1e3, 1e5));
      for (const c of analyze(d).channels) {
        if (c.rising && c.falling) expect(c.rising.x - c.falling.x).toBeGreaterThanOrEqual(-1e-9);
      }
    }
  });

  test('feedback resistance to infinity takes hysteresis to zero', () => {
    const hyst = [1e6, 1e8, 1e10, 1e12].map((rf) => {
      const d = makeDesign({ string: [10e3, 10e3], channels: [stepChannel('A', 1, 'T1', { feedback: { ohms: rf, to: 'plus' }, pullup: { ohms: 10e3, to: 'supply' } })] });
      return analyze(d).channels[0].hysteresis ?? NaN;
    });
    for (let k = 1; k < hyst.length; k++) expect(hyst[k]).toBeLessThan(hyst[k - 1]);
    expect(hyst[3]).toBeLessThan(1e-6);
  });

  test('results do not depend on node numbering (channel order reversed, to 1 nV)', () => {
    const d = fourStepDesign(2.2e6);
    const rev: Design = { ...d, channels: [...d.channels].reverse() };
    const a = analyze(d).channels;
    const b = analyze(rev).channels;
    for (const c of a) {
      const o = b.find((r) => r.id === c.id)!;
      expect(o.rising!.x).toBeCloseTo(c.rising!.x, 9);
      expect(o.falling!.x).toBeCloseTo(c.falling!.x, 9);
    }
  });

  test('no NaN or Infinity reaches the analysis of 50 random designs', () => {
    const r = rng(9);
    const finite = (v: unknown): boolean =>
      typeof v === 'number' ? Number.isFinite(v) : v && typeof v === 'object' ? Object.values(v).every(finite) : true;
    for (let n = 0; n < 50; n++) {
      const d = fourStepDesign(logUniform(r, 1e3, 1e9));
      d.string = d.string.map(() => logUniform(r, 1, 1e7));
      expect(finite(analyze(d))).toBe(true);
    }
  });
});

describe('oscillation', () => {
  test('feedback to the inverting input gives a band with no stable state, reported as an error', () => {
    const d = makeDesign({
      string: [10e3, 10e3],
      channels: [stepChannel('N', 1, 'T1', { seriesMinus: 10e3, feedback: { ohms: 100e3, to: 'minus' }, pullup: { ohms: 10e3, to: 'supply' } })],
    });
    const a = analyze(d);
    expect(a.chatter.length).toBeGreaterThan(0);
    expect(a.findings.find((f) => f.code === 'no-stable-state')?.severity).toBe('error');
    expect(a.findings.some((f) => f.code === 'negative-feedback')).toBe(true);
  });
});

describe('sweep options', () => {
  test('without segments the flips, bands and starting state are the same (exact)', () => {
    // Reference: the same sweep with segments recorded. Both a plain four-step bar and a band with no stable state.
    for (const d of [fourStepDesign(470e3), oscillating()]) {
      const full = sweep(new Solver(buildNetwork(d)), d.quantity.min, d.quantity.max);
      const lean = sweep(new Solver(buildNetwork(d)), d.quantity.min, d.quantity.max, undefined, { segments: false });
      expect(lean.segments).toEqual([]);
      expect({ ...lean, segments: full.segments }).toEqual(full);
    }
  });

  test('onFlip is told every flip the record would hold, in order, and nothing is recorded', () => {
    // Reference: the recorded flips of the same sweep; a four-step bar and a band with no stable state.
    for (const d of [fourStepDesign(470e3), oscillating()]) {
      const full = sweep(new Solver(buildNetwork(d)), d.quantity.min, d.quantity.max);
      const told: { element: number; to: boolean; x: number; direction: string }[] = [];
      const lean = sweep(new Solver(buildNetwork(d)), d.quantity.min, d.quantity.max, undefined, {
        onFlip: (element, to, x, direction) => told.push({ element, to, x, direction }),
      });
      expect(lean.flips).toEqual([]);
      expect(told).toEqual(full.flips.map(({ element, to, x, direction }) => ({ element, to, x, direction })));
      expect(lean.bands).toEqual(full.bands);
    }
  });
});
