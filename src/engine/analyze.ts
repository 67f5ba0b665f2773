import type { Analysis, ChannelResult, ProbeResult, TapResult, Trip } from './analysis-types';
import { runChecks } from './checks';
import type { Design } from './design/types';
import type { Solution } from './network/solve';
import { type Prepared, prepare, stateAt, supplyCurrentAt, voltAt } from './prepare';
import type { Direction } from './sweep';

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
      low: Object.fromEntries(p.net.comparators.map((c, k) => [c.id, s.state[k] === 1])),
      lit: litMap(p, s.state),
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
  /** Per channel id, largest sink current (A); per LED channel id, largest LED current (A). */
  sinkMax: Record<string, number>;
  ledMax: Record<string, number>;
  /** Every (x, solution, state) sample at segment ends, for the checks. */
  samples: { x: number; sol: Solution; state: Uint8Array }[];
}

function segmentStats(p: Prepared): SegmentStats {
  const { net } = p;
  const nc = net.comparators.length;
  const st: SegmentStats = {
    supply: { min: Infinity, minAt: 0, max: -Infinity, maxAt: 0 },
    nodeMin: {},
    nodeMax: {},
    dissipation: {},
    sinkMax: Object.fromEntries(net.comparators.map((c) => [c.id, 0])),
    ledMax: {},
    samples: [],
  };
  for (const seg of p.sweep.segments) {
    const sol = p.solver.solve(seg.state);
    for (const x of [seg.from, seg.to]) {
      st.samples.push({ x, sol, state: seg.state });
      const i = supplyCurrentAt(p, sol, x);
      if (i < st.supply.min) Object.assign(st.supply, { min: i, minAt: x });
      if (i > st.supply.max) Object.assign(st.supply, { max: i, maxAt: x });
      net.nodes.forEach((name, k) => {
        const v = voltAt(sol, k, x);
        st.nodeMin[name] = Math.min(st.nodeMin[name] ?? Infinity, v);
        st.nodeMax[name] = Math.max(st.nodeMax[name] ?? -Infinity, v);
      });
      for (const r of net.resistors) {
        const v = voltAt(sol, r.a, x) - voltAt(sol, r.b, x);
        st.dissipation[r.id] = Math.max(st.dissipation[r.id] ?? 0, (v * v) / r.ohms);
      }
      net.comparators.forEach((c, k) => {
        if (!seg.state[k]) return;
        const sink = (voltAt(sol, c.out, x) - c.vsat0) / c.rsat;
        st.sinkMax[c.id] = Math.max(st.sinkMax[c.id], sink);
      });
      net.diodes.forEach((d, k) => {
        const on = seg.state[nc + k] === 1;
        const current = on ? diodeCurrent(sol, d, x) : 0;
        if (d.channel) st.ledMax[d.channel] = Math.max(st.ledMax[d.channel] ?? 0, current);
        if (d.seriesId) st.dissipation[d.seriesId] = Math.max(st.dissipation[d.seriesId] ?? 0, current * current * d.rSeries);
      });
    }
  }
  if (!Number.isFinite(st.supply.min)) st.supply = { min: 0, minAt: 0, max: 0, maxAt: 0 };
  return st;
}

function diodeCurrent(sol: Solution, d: { anode: number; cathode: number; knee: number; rSeries: number; rdyn: number }, x: number): number {
  return Math.max(0, (voltAt(sol, d.anode, x) - voltAt(sol, d.cathode, x) - d.knee) / (d.rSeries + d.rdyn));
}

function channelResults(p: Prepared, st: SegmentStats): ChannelResult[] {
  const { net, design } = p;
  return net.comparators.map((c, k) => {
    const ch = design.channels.find((d) => d.id === c.id);
    const up = p.sweep.flips.find((f) => f.element === k && f.direction === 'up');
    const down = p.sweep.flips.find((f) => f.element === k && f.direction === 'down');
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

function litMap(p: Prepared, state: Uint8Array): Record<string, boolean> {
  const nc = p.net.comparators.length;
  const lit: Record<string, boolean> = {};
  p.net.diodes.forEach((d, k) => {
    if (d.channel) lit[d.channel] = state[nc + k] === 1;
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
  const low: Record<string, boolean> = {};
  const sinkCurrent: Record<string, number> = {};
  p.net.comparators.forEach((c, k) => {
    low[c.id] = state[k] === 1;
    sinkCurrent[c.id] = state[k] ? Math.max(0, (voltAt(sol, c.out, x) - c.vsat0) / c.rsat) : 0;
  });
  const ledCurrent: Record<string, number> = {};
  p.net.diodes.forEach((d, k) => {
    if (d.channel) ledCurrent[d.channel] = state[nc + k] ? diodeCurrent(sol, d, x) : 0;
  });
  return { x, direction, nodes, low, lit: litMap(p, state), supplyCurrent: supplyCurrentAt(p, sol, x), sinkCurrent, ledCurrent };
}
