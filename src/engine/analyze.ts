import type { Analysis, ChannelResult, ProbeResult, TapResult, Trip } from './analysis-types';
import { runChecks } from './checks';
import type { Design } from './design/types';
import type { Solution } from './network/solve';
import { type Prepared, prepare, stateAt, supplyCurrentAt, voltAt } from './prepare';
import { type Direction, firstFlip } from './sweep';

/**
 * The full exact analysis of a design (ENGINE.md §2 and §5): trip points and hysteresis of every
 * channel, tap voltages, supply current extremes, dissipation and findings. Pure and bounded.
 */
export function analyze(design: Design, prepared: Prepared = prepare(design)): Analysis {
  const p = prepared;
  const stats = segmentStats(p);
  const channels = channelResults(p, stats);
  const analysis: Analysis = {
    channels,
    taps: tapResults(p, stats),
    segments: p.sweep.segments.map((s) => ({
      direction: s.direction,
      from: s.from,
      to: s.to,
      low: lowMap(p, s.state),
      lit: litMap(p, s.state, (s.from + s.to) / 2),
    })),
    chatter: p.sweep.bands.map((b) => ({
      direction: b.direction,
      from: b.from,
      to: b.to,
      elements: b.elements.map((k) => elementLabel(p, k)),
    })),
    supplyCurrent: stats.supply,
    dissipation: stats.dissipation,
    findings: [],
  };
  analysis.findings = runChecks(p, analysis, stats);
  return analysis;
}

/** Extremes gathered over every segment end of both sweeps. */
export interface SegmentStats {
  supply: { min: number; minAt: number; max: number; maxAt: number };
  /** Per node name, lowest and highest voltage (V). */
  nodeMin: Record<string, number>;
  nodeMax: Record<string, number>;
  /** Per resistor designator, worst dissipation (W). */
  dissipation: Record<string, number>;
  /** The same as a list, for loops. */
  powers: { id: string; watts: number }[];
  /** Per channel id, largest sink current (A); per LED channel id, largest LED current (A). */
  sinkMax: Record<string, number>;
  ledMax: Record<string, number>;
  /** Every (x, solution, state) sample at segment ends, for the checks. */
  samples: { x: number; sol: Solution; state: Uint8Array }[];
}

function segmentStats(p: Prepared): SegmentStats {
  const { net } = p;
  const nc = net.comparators.length;
  const nn = net.nodes.length;
  // One buffer for all six columns: a typed array of its own each costs about ten times more.
  const nr = net.resistors.length;
  const nd = net.diodes.length;
  const columns = new Float64Array(2 * nn + nr + 2 * nd + nc);
  const vmin = columns.subarray(0, nn).fill(Infinity);
  const vmax = columns.subarray(nn, 2 * nn).fill(-Infinity);
  const power = columns.subarray(2 * nn, 2 * nn + nr);
  const ledPower = columns.subarray(2 * nn + nr, 2 * nn + nr + nd);
  const ledMax = columns.subarray(2 * nn + nr + nd, 2 * nn + nr + 2 * nd);
  const sinkMax = columns.subarray(2 * nn + nr + 2 * nd);
  const supply = { min: Infinity, minAt: 0, max: -Infinity, maxAt: 0 };
  const samples: SegmentStats['samples'] = [];
  for (const seg of p.sweep.segments) {
    const sol = p.solver.solve(seg.state);
    const { v0, v1 } = sol;
    const [i0, i1] = p.solver.sourceCurrent(sol, net.supplySource);
    for (let e = 0; e < 2; e++) {
      const x = e === 0 ? seg.from : seg.to;
      samples.push({ x, sol, state: seg.state });
      const i = i0 + i1 * x + net.quiescent;
      if (i < supply.min) {
        supply.min = i;
        supply.minAt = x;
      }
      if (i > supply.max) {
        supply.max = i;
        supply.maxAt = x;
      }
      for (let k = 0; k < nn; k++) {
        const v = v0[k] + v1[k] * x;
        if (v < vmin[k]) vmin[k] = v;
        if (v > vmax[k]) vmax[k] = v;
      }
      for (let k = 0; k < net.resistors.length; k++) {
        const r = net.resistors[k];
        const v = voltAt(sol, r.a, x) - voltAt(sol, r.b, x);
        const w = (v * v) / r.ohms;
        if (w > power[k]) power[k] = w;
      }
      for (let k = 0; k < nc; k++) {
        if (!seg.state[k]) continue;
        const c = net.comparators[k];
        const sink = (voltAt(sol, c.out, x) - c.vsat0) / c.rsat;
        if (sink > sinkMax[k]) sinkMax[k] = sink;
      }
      for (let k = 0; k < net.diodes.length; k++) {
        if (!seg.state[nc + k]) continue;
        const d = net.diodes[k];
        const current = diodeCurrent(sol, d, x);
        if (current > ledMax[k]) ledMax[k] = current;
        if (current * current * d.rSeries > ledPower[k]) ledPower[k] = current * current * d.rSeries;
      }
    }
  }
  const st: SegmentStats = {
    supply: Number.isFinite(supply.min) ? supply : { min: 0, minAt: 0, max: 0, maxAt: 0 },
    nodeMin: {},
    nodeMax: {},
    dissipation: {},
    powers: [],
    sinkMax: {},
    ledMax: {},
    samples,
  };
  net.nodes.forEach((name, k) => {
    st.nodeMin[name] = Number.isFinite(vmin[k]) ? vmin[k] : 0;
    st.nodeMax[name] = Number.isFinite(vmax[k]) ? vmax[k] : 0;
  });
  net.resistors.forEach((r, k) => st.powers.push({ id: r.id, watts: power[k] }));
  net.comparators.forEach((c, k) => (st.sinkMax[c.id] = sinkMax[k]));
  net.diodes.forEach((d, k) => {
    if (d.channel) st.ledMax[d.channel] = ledMax[k];
    if (d.seriesId) st.powers.push({ id: d.seriesId, watts: ledPower[k] });
  });
  for (const { id, watts } of st.powers) st.dissipation[id] = watts;
  return st;
}

function diodeCurrent(sol: Solution, d: { anode: number; cathode: number; knee: number; rSeries: number; rdyn: number }, x: number): number {
  return Math.max(0, (voltAt(sol, d.anode, x) - voltAt(sol, d.cathode, x) - d.knee) / (d.rSeries + d.rdyn));
}

function channelResults(p: Prepared, st: SegmentStats): ChannelResult[] {
  const { net, design } = p;
  return net.comparators.map((c, k) => {
    const ch = design.channels.find((d) => d.id === c.id);
    // Flips at x = min are the initial settle (the output's starting state), not a trip.
    const up = firstFlip(p.sweep, k, 'up');
    const down = firstFlip(p.sweep, k, 'down');
    const trip = (f: typeof up): Trip | null => (f ? { x: f.x, pinPlus: f.pinPlus, pinMinus: f.pinMinus } : null);
    const signalIsMinus = ch?.plus === 'in' ? false : true;
    const pin = (f: NonNullable<typeof up>) => (signalIsMinus ? f.pinMinus : f.pinPlus);
    return {
      id: c.id,
      label: ch?.label ?? c.id,
      package: ch?.package ?? 0,
      channel: ch?.channel ?? 0,
      rising: trip(up),
      falling: trip(down),
      risingTo: up ? (up.to ? 'low' : 'high') : null,
      hysteresis: up && down ? up.x - down.x : null,
      hysteresisPins: up && down ? pin(up) - pin(down) : null,
      sinkMax: st.sinkMax[c.id],
      ledCurrentMax: c.id in st.ledMax ? st.ledMax[c.id] : null,
    };
  });
}

function tapResults(p: Prepared, st: SegmentStats): TapResult[] {
  const taps = p.net.nodes.filter((n) => /^T\d+$/.test(n));
  return taps.map((node) => ({
    node,
    min: st.nodeMin[node] ?? 0,
    max: st.nodeMax[node] ?? 0,
    channels: p.design.channels.filter((c) => c.plus === node || c.minus === node).map((c) => c.id),
  }));
}

/** Output state per channel id (true = sinking), keys in network order. */
function lowMap(p: Prepared, state: Uint8Array): Record<string, boolean> {
  const low: Record<string, boolean> = {};
  const comparators = p.net.comparators;
  for (let k = 0; k < comparators.length; k++) low[comparators[k].id] = state[k] === 1;
  return low;
}

/**
 * LED current from which an indicator counts as lit (A). Below it an LED may still conduct, e.g. the
 * few microamperes an open output leaks through its feedback resistor: a faint glow, not a reading.
 * Common practice, no source: indicator LEDs read as plainly on from about half a milliampere.
 */
export const LIT_CURRENT = 0.5e-3;

function litMap(p: Prepared, state: Uint8Array, x: number): Record<string, boolean> {
  const nc = p.net.comparators.length;
  const sol = p.solver.solve(state);
  const lit: Record<string, boolean> = {};
  p.net.diodes.forEach((d, k) => {
    if (d.channel) lit[d.channel] = state[nc + k] === 1 && diodeCurrent(sol, d, x) >= LIT_CURRENT;
  });
  return lit;
}

/** Readable name of a state element: channel id for a comparator, "LED A" or "reference" for diodes. */
export function elementLabel(p: Prepared, k: number): string {
  const nc = p.net.comparators.length;
  if (k < nc) return p.net.comparators[k].id;
  const d = p.net.diodes[k - nc];
  return d.kind === 'shunt' ? 'reference' : `LED ${d.channel}`;
}

/** The circuit at x on the given sweep direction: node voltages, outputs, LEDs and currents. */
export function probe(p: Prepared, x: number, direction: Direction): ProbeResult {
  const state = stateAt(p, x, direction);
  const sol = p.solver.solve(state);
  const nc = p.net.comparators.length;
  const nodes: Record<string, number> = { gnd: 0 };
  p.net.nodes.forEach((name, k) => (nodes[name] = voltAt(sol, k, x)));
  const low = lowMap(p, state);
  const sinkCurrent: Record<string, number> = {};
  p.net.comparators.forEach((c, k) => {
    sinkCurrent[c.id] = state[k] ? Math.max(0, (voltAt(sol, c.out, x) - c.vsat0) / c.rsat) : 0;
  });
  const ledCurrent: Record<string, number> = {};
  p.net.diodes.forEach((d, k) => {
    if (d.channel) ledCurrent[d.channel] = state[nc + k] ? diodeCurrent(sol, d, x) : 0;
  });
  return { x, direction, nodes, low, lit: litMap(p, state, x), supplyCurrent: supplyCurrentAt(p, sol, x), sinkCurrent, ledCurrent };
}
