/**
 * Synthesis: from placed units to a first circuit. Coincident trip targets share a tap; the string
 * is sized for its budget; feedback placement is chosen per channel; loads (LED resistors,
 * pull-ups, dot-mode LEDs between outputs, wired window outputs) are sized; feedback resistors get
 * a first value from the local source resistance. Closure then makes the trips exact.
 */
import type { Channel, Design, Targets } from '../design/types';
import { nearestInSeries } from '../series';
import { sizeLoads } from './loads';
import { supplyAt, type Sense } from './scaling';
import type { PlanProblem, Unit } from './types';

/** The planner's working state: a design plus the unknowns closure adjusts. */
export interface Model {
  design: Design;
  targets: Targets;
  units: Unit[];
  /** Taps top to bottom (T1 first) with the units comparing against each. */
  taps: { name: string; units: Unit[] }[];
  /** Unloaded tap voltages (V), T1 first: the string's unknowns. */
  tapVolts: number[];
  /** Voltage the string hangs from (V) and its total resistance (ohms). */
  vref: number;
  total: number;
  sense: Sense;
  notes: string[];
}

/** String resistors (ohms, top to bottom) for unloaded tap voltages `u` (V, descending) under `vref` with `total` ohms. */
export function stringFromTaps(vref: number, total: number, u: readonly number[]): number[] {
  const edges = [vref, ...u, 0];
  return edges.slice(1).map((v, k) => ((edges[k] - v) / vref) * total);
}

/** Source resistance of tap `j` (1-based) of a string (ohms). */
export function tapResistance(string: readonly number[], j: number): number {
  const above = string.slice(0, j).reduce((a, b) => a + b, 0);
  const below = string.slice(j).reduce((a, b) => a + b, 0);
  return (above * below) / (above + below);
}

const mergeKey = (u: Unit) => `${u.sinksOnRise}:${u.rising.toPrecision(9)}:${u.falling.toPrecision(9)}`;

/**
 * Builds the first circuit in place on `design` (channels, string, loads, feedback) from placed
 * units. Returns the model, or problems that stop planning.
 */
export function synthesize(design: Design, targets: Targets, units: Unit[], vref: number, sense: Sense): Model | PlanProblem[] {
  const notes: string[] = [];
  const groups = new Map<string, Unit[]>();
  for (const u of units) groups.set(mergeKey(u), [...(groups.get(mergeKey(u)) ?? []), u]);
  const ordered = [...groups.values()].sort((a, b) => b[0].rising + b[0].falling - (a[0].rising + a[0].falling));
  const taps = ordered.map((us, k) => ({ name: `T${k + 1}`, units: us }));
  for (const tap of taps) {
    for (const u of tap.units) u.tap = tap.name;
    if (tap.units.length > 1) notes.push(`${tap.units.map((u) => u.id).join(' and ')} have the same trip points and share tap ${tap.name}.`);
  }
  const tapVolts = taps.map((tp) => sense.a0 + (sense.a1 * (tp.units[0].rising + tp.units[0].falling)) / 2);
  const total = (vref / targets.stringBudget) * 1.02;
  design.string = stringFromTaps(vref, total, tapVolts);
  design.series = targets.series;
  design.resistorTolerance = targets.tolerance;
  for (const tap of taps) for (const u of tap.units) placeFeedback(u, tap.units.length > 1, targets.feedback, notes);
  design.channels = units.map((u) => channelFor(u));
  const problems = sizeLoads(design, targets, units, notes);
  if (problems.length) return problems;
  const model: Model = { design, targets, units, taps, tapVolts, vref, total, sense, notes };
  for (const u of units) initialFeedback(model, u);
  return model;
}

function placeFeedback(u: Unit, shared: boolean, mode: Targets['feedback'], notes: string[]): void {
  if (u.rising - u.falling <= 0) {
    u.feedback = 'none';
    u.feedbackWhy = 'no hysteresis asked';
    return;
  }
  if (!u.sinksOnRise) {
    u.feedback = 'input';
    u.feedbackWhy = 'the signal is on its non-inverting input, so feedback goes there through a series resistor instead of loading the shared sense node';
    if (mode === 'tap') notes.push(`${u.id}: feedback cannot go into a tap (the tap is on its inverting input); placed input-side.`);
  } else if (mode === 'input' || (mode === 'auto' && shared)) {
    u.feedback = 'input';
    u.feedbackWhy = shared ? 'its tap is shared, and feedback into it would move the other channel' : 'input-side placement asked (targets.feedback)';
  } else {
    u.feedback = 'tap';
    u.feedbackWhy = mode === 'tap' ? 'tap placement asked (targets.feedback)' : 'its tap is its own: no extra resistor; the shift this causes on the other taps is corrected by closure';
  }
}

function channelFor(u: Unit): Channel {
  const ch: Channel = {
    id: u.id,
    label: u.label,
    package: u.package,
    channel: u.channel,
    plus: u.sinksOnRise ? u.tap : 'in',
    minus: u.sinksOnRise ? 'in' : u.tap,
  };
  return ch;
}

/** Output swing a channel's feedback sees (V): released level minus sinking level, at its threshold. */
function swing(model: Model, u: Unit, ch: Channel): number {
  const x = (u.rising + u.falling) / 2;
  const vs = supplyAt(model.design, x);
  const partner = model.design.channels.find((c) => c.led?.anode === `out:${ch.id}`);
  const high = ch.pullup || partner ? vs : ch.led ? vs - ch.led.knee : vs;
  return Math.max(0.1, high - model.design.part.vsat0);
}

/** Source resistance the feedback works against (ohms): the tap, or series resistor plus node. */
export function feedbackSource(model: Model, ch: Channel, u: Unit): number {
  const tapR = tapResistance(model.design.string, Number(u.tap.slice(1)));
  if (u.feedback === 'tap') return tapR;
  const node = u.sinksOnRise ? tapR : model.sense.rth;
  return (ch.seriesPlus ?? 0) + node;
}

function initialFeedback(model: Model, u: Unit): void {
  const ch = model.design.channels.find((c) => c.id === u.id) as Channel;
  if (u.feedback === 'none') return;
  if (u.feedback === 'input') {
    const node = u.sinksOnRise ? tapResistance(model.design.string, Number(u.tap.slice(1))) : model.sense.rth;
    ch.seriesPlus = nearestInSeries(Math.min(470e3, Math.max(10e3, 4 * node)), model.design.series);
  }
  const s = feedbackSource(model, ch, u);
  const dv = model.sense.a1 * (u.rising - u.falling);
  ch.feedback = { ohms: Math.max(s, s * (swing(model, u, ch) / dv - 1)), to: 'plus' };
}
