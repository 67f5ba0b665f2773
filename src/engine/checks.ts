import type { Analysis, Finding, Severity } from './analysis-types';
import type { SegmentStats } from './analyze';
import { buildNetwork } from './network/build';
import { Solver } from './network/solve';
import { type Prepared, voltAt } from './prepare';
import { firstFlip, sweep } from './sweep';
import { formatEng } from './values';

/** Resistor power rating assumed when the design names none (W): common practice, no source. */
export const DEFAULT_RESISTOR_RATING = 0.125;

/**
 * Largest resistance that behaves as its value on an ordinary board (ohms): above it surface leakage
 * and the comparator's bias current through it move trip points. Common practice, no source.
 */
export const HIGH_RESISTANCE = 10e6;

/**
 * The checks of ENGINE.md §5. Each finding names the part, where in x, how much, and what to change.
 */
export function runChecks(p: Prepared, a: Analysis, st: SegmentStats): Finding[] {
  const out: Finding[] = [];
  const unit = p.design.quantity.unit;
  const fx = (x: number) => formatEng(x, unit);
  const add = (severity: Severity, code: string, part: string, x: number | null, amount: string, message: string, fix: string) =>
    out.push({ severity, code, part, x, amount, message, fix });
  const { design, net } = p;
  const part = design.part;

  for (const band of a.chatter) {
    add('error', 'no-stable-state', band.elements.join(', '), band.from, `${fx(band.from)} to ${fx(band.to)}`,
      `No stable state while x goes ${band.direction} from ${fx(band.from)} to ${fx(band.to)}: ${band.elements.join(', ')} keep flipping, so the output will oscillate there.`,
      'Check that each feedback resistor goes to the non-inverting input and that wired outputs do not feed back into their own signal.');
  }
  for (const ch of design.channels) {
    if (ch.feedback?.to === 'minus') {
      add('error', 'negative-feedback', ch.id, null, formatEng(ch.feedback.ohms, 'Ω'),
        `Channel ${ch.id} has its feedback resistor on the inverting input: that is negative feedback, which makes a comparator oscillate instead of giving hysteresis.`,
        `Move RF:${ch.id} to the non-inverting input (feedback.to = "plus").`);
    }
  }

  // Common-mode range and supply rating, at every segment end.
  const cmWorst = new Map<string, { over: number; x: number; v: number; low: boolean }>();
  let supplyLow: { v: number; x: number } | null = null;
  let supplyHigh: { v: number; x: number } | null = null;
  for (const s of st.samples) {
    const vs = voltAt(s.sol, net.supply, s.x);
    if (vs < part.supplyMin && (!supplyLow || vs < supplyLow.v)) supplyLow = { v: vs, x: s.x };
    if (vs > part.supplyMax && (!supplyHigh || vs > supplyHigh.v)) supplyHigh = { v: vs, x: s.x };
    const top = vs - part.cmHeadroom;
    for (const c of net.comparators) {
      for (let side = 0; side < 2; side++) {
        const v = voltAt(s.sol, side === 0 ? c.plus : c.minus, s.x);
        const over = Math.max(v - top, part.cmMin - v);
        if (!(over > 0)) continue;
        const prev = cmWorst.get(c.id);
        if (!prev || over > prev.over) cmWorst.set(c.id, { over, x: s.x, v, low: v < part.cmMin });
      }
    }
  }
  for (const [id, w] of cmWorst) {
    add('error', 'common-mode', id, w.x, `${formatEng(w.over, 'V')} ${w.low ? 'below' : 'above'} the limit`,
      `An input of channel ${id} reaches ${formatEng(w.v, 'V')} at x = ${fx(w.x)}, outside the part's common-mode range.`,
      w.low ? 'Keep both inputs above the part\'s lowest input voltage.' : `Scale the input or the string down so both inputs stay at least ${formatEng(part.cmHeadroom, 'V')} below the supply.`);
  }
  if (supplyLow) {
    add('warning', 'supply-low', 'supply', supplyLow.x, `${formatEng(part.supplyMin - supplyLow.v, 'V')} below`,
      `The supply falls to ${formatEng(supplyLow.v, 'V')}, below the part class minimum of ${formatEng(part.supplyMin, 'V')}.`,
      'Raise the quantity range minimum, or choose a part class rated for the lower supply.');
  }
  if (supplyHigh) {
    const abs = supplyHigh.v > part.absMaxSupply;
    add(abs ? 'error' : 'warning', 'supply-high', 'supply', supplyHigh.x, `${formatEng(supplyHigh.v - part.supplyMax, 'V')} above`,
      `The supply reaches ${formatEng(supplyHigh.v, 'V')}, above the part class ${abs ? 'absolute maximum' : 'recommended maximum'}.`,
      'Lower the supply range or choose a part class rated for it.');
  }

  checkOutputs(p, st, add);
  checkReference(p, st, a, add, fx);
  checkHysteresis(p, a, add, fx);
  checkSlots(p, add);
  for (const r of net.resistors) {
    if (r.ohms > HIGH_RESISTANCE) {
      add('info', 'high-resistance', r.id, null, formatEng(r.ohms, 'Ω'),
        `${r.id} is ${formatEng(r.ohms, 'Ω')}: above about ${formatEng(HIGH_RESISTANCE, 'Ω')} board leakage, humidity and bias current make the value unreliable.`,
        r.id.startsWith('RF:') ? 'Lower the series input resistor (or the string impedance) so a smaller feedback resistor gives the same hysteresis.' : 'Scale the surrounding resistors down.');
    }
  }
  for (const { id, watts: w } of st.powers) {
    if (w > DEFAULT_RESISTOR_RATING) {
      add('warning', 'dissipation', id, null, formatEng(w, 'W'),
        `${id} dissipates up to ${formatEng(w, 'W')}, over the ${formatEng(DEFAULT_RESISTOR_RATING, 'W')} assumed rating.`,
        'Use a larger resistance or a resistor with a higher power rating.');
    }
  }
  return out;
}

type Add = (severity: Severity, code: string, part: string, x: number | null, amount: string, message: string, fix: string) => void;

function checkOutputs(p: Prepared, st: SegmentStats, add: Add): void {
  const { design } = p;
  const openCollector = design.part.output === 'open-collector';
  for (const ch of design.channels) {
    if (ch.wiredTo && !openCollector) {
      add('error', 'wired-push-pull', ch.id, null, '', `Channel ${ch.id} is wired to ${ch.wiredTo}, but push-pull outputs fight each other when tied.`,
        'Use an open-collector or open-drain part class, or combine the outputs with logic.');
    }
    const group = design.channels.filter((c) => c.id === ch.id || c.wiredTo === ch.id || ch.wiredTo === c.id);
    const loaded = group.some((c) => c.pullup || c.led) || design.channels.some((c) => c.led?.anode === `out:${ch.id}` || c.pullup?.to === `out:${ch.id}`);
    if (openCollector && !loaded) {
      add('warning', 'floating-output', ch.id, null, '', `The output of channel ${ch.id} has no pull-up or LED: it floats when off.`,
        `Add a pull-up resistor from out:${ch.id} to the supply, or an LED.`);
    }
    const sink = st.sinkMax[ch.id] ?? 0;
    if (sink > design.part.sinkMax) {
      add('error', 'sink-current', ch.id, null, `${formatEng(sink - design.part.sinkMax, 'A')} over`,
        `Channel ${ch.id} sinks up to ${formatEng(sink, 'A')}, over the part's ${formatEng(design.part.sinkMax, 'A')} rating.`,
        'Raise the LED or pull-up resistor.');
    }
  }
}

function checkReference(p: Prepared, st: SegmentStats, a: Analysis, add: Add, fx: (x: number) => string): void {
  const ref = p.design.reference;
  const nc = p.net.comparators.length;
  if (ref.kind === 'supply') {
    if (p.design.supply.kind === 'measured' && p.design.input.signal === 'voltage') {
      add('error', 'ratiometric-measured', 'reference', null, '', 'The string runs from the supply, and the supply is the quantity being measured: every threshold moves with x, so the ladder cannot resolve it.',
        'Feed the string from a shunt or external reference.');
    }
  }
  checkSupplyShift(p, a, add, fx);
  if (ref.kind !== 'shunt') return;
  const k = p.net.diodes.findIndex((d) => d.kind === 'shunt');
  let worst: { i: number; x: number } | null = null;
  let over: { i: number; x: number } | null = null;
  for (const s of st.samples) {
    const d = p.net.diodes[k];
    const i = s.state[nc + k] ? (voltAt(s.sol, d.anode, s.x) - d.knee) / d.rdyn : 0;
    if (i < ref.minCurrent && (!worst || i < worst.i)) worst = { i, x: s.x };
    if (i > ref.maxCurrent && (!over || i > over.i)) over = { i, x: s.x };
  }
  if (worst) {
    const trips = a.channels.flatMap((c) => [c.rising?.x, c.falling?.x]).filter((x): x is number => x !== undefined);
    const near = trips.some((x) => Math.abs(x - worst!.x) <= Math.abs(p.design.quantity.max - p.design.quantity.min) * 0.02);
    add(near ? 'error' : 'warning', 'reference-dropout', 'reference', worst.x, `${formatEng(worst.i, 'A')} of ${formatEng(ref.minCurrent, 'A')} needed`,
      `The shunt reference gets only ${formatEng(worst.i, 'A')} at x = ${fx(worst.x)} and drops out of regulation there.`,
      'Lower the bias resistor RB, or raise the string resistance so it draws less.');
  }
  if (over) {
    add('error', 'reference-overcurrent', 'reference', over.x, formatEng(over.i, 'A'),
      `The shunt reference carries ${formatEng(over.i, 'A')} at x = ${fx(over.x)}, over its ${formatEng(ref.maxCurrent, 'A')} rating.`,
      'Raise the bias resistor RB.');
  }
}

/**
 * Thresholds that move with a fixed supply: re-sweeps at the supply's minimum and maximum and reports
 * every trip point that moves by more than a tenth of its hysteresis (or 0.1 % of the x range when it
 * has none).
 */
function checkSupplyShift(p: Prepared, a: Analysis, add: Add, fx: (x: number) => string): void {
  const s = p.design.supply;
  if (s.kind !== 'fixed' || !(s.max > s.min)) return;
  const span = p.design.quantity.max - p.design.quantity.min;
  const corners = [s.min, s.max].map((v) => tripsAtSupply(p, v));
  for (const c of a.channels) {
    let worst = 0;
    for (const corner of corners) {
      const o = corner.get(c.id);
      if (!o) continue;
      if (c.rising && o.rising !== null) worst = Math.max(worst, Math.abs(o.rising - c.rising.x));
      if (c.falling && o.falling !== null) worst = Math.max(worst, Math.abs(o.falling - c.falling.x));
    }
    const allowed = c.hysteresis ? Math.abs(c.hysteresis) / 10 : span * 1e-3;
    if (worst > allowed) {
      add('warning', 'supply-dependent', c.id, c.rising?.x ?? null, `±${fx(worst)}`,
        `The trip points of ${c.id} move by up to ${fx(worst)} as the supply goes from ${formatEng(s.min, 'V')} to ${formatEng(s.max, 'V')}.`,
        p.design.reference.kind === 'supply' ? 'Feed the string from a reference instead of the supply.' : 'Take pull-ups and LED anodes that feed back into the string from a steadier rail, or raise the feedback resistors.');
    }
  }
}

/** First rising and falling trip point of each comparator from a prepared sweep. */
/**
 * Each channel's first rising and falling trip with the supply at `volts`. Only a source value
 * changes, so the network is wired as `p.net` and its solver layout is reused.
 */
function tripsAtSupply(p: Prepared, volts: number): Map<string, { rising: number | null; falling: number | null }> {
  const net = buildNetwork(p.design, { supplyVolts: volts });
  const layout = net.nodes.length === p.net.nodes.length ? p.solver.layout : undefined;
  const result = sweep(new Solver(net, layout), p.design.quantity.min, p.design.quantity.max, undefined, { segments: false });
  const out = new Map<string, { rising: number | null; falling: number | null }>();
  net.comparators.forEach((c, k) => {
    out.set(c.id, { rising: firstFlip(result, k, 'up')?.x ?? null, falling: firstFlip(result, k, 'down')?.x ?? null });
  });
  return out;
}

function checkHysteresis(p: Prepared, a: Analysis, add: Add, fx: (x: number) => string): void {
  const noise = p.design.quantity.noise;
  for (const c of a.channels) {
    if (!c.rising && !c.falling) {
      add('warning', 'never-trips', c.id, null, '', `Channel ${c.id} never changes state between ${fx(p.design.quantity.min)} and ${fx(p.design.quantity.max)}.`,
        'Check its input connections and the tap it compares against.');
      continue;
    }
    if (c.hysteresis !== null && noise > 0 && Math.abs(c.hysteresis) < noise) {
      add('warning', 'hysteresis-below-noise', c.id, c.rising?.x ?? null, `${fx(Math.abs(c.hysteresis))} < ${fx(noise)}`,
        `Channel ${c.id} has less hysteresis than the noise on x: it will flicker near its trip point.`,
        'Lower the feedback resistor to widen the hysteresis.');
    }
  }
  const steps = a.channels.filter((c) => c.rising && c.falling && c.risingTo === 'low').sort((l, r) => l.rising!.x - r.rising!.x);
  for (let k = 1; k < steps.length; k++) {
    const lower = steps[k - 1];
    const upper = steps[k];
    if (upper.falling!.x < lower.rising!.x) {
      add('warning', 'hysteresis-over-spacing', `${lower.id}/${upper.id}`, upper.falling!.x, fx(lower.rising!.x - upper.falling!.x),
        `The hysteresis band of ${upper.id} reaches below the trip point of ${lower.id}: the steps overlap.`,
        'Narrow the hysteresis or spread the thresholds apart.');
    }
  }
}

function checkSlots(p: Prepared, add: Add): void {
  const packages = [...new Set(p.design.channels.map((c) => c.package))].sort((l, r) => l - r);
  for (const pkg of packages) {
    for (let ch = 1; ch <= 4; ch++) {
      const used = p.design.channels.some((c) => c.package === pkg && c.channel === ch);
      const spare = p.design.spares.some((s) => s.package === pkg && s.channel === ch);
      if (!used && !spare) {
        add('warning', 'unused-floating', `package ${pkg} channel ${ch}`, null, '', `Channel ${ch} of package ${pkg} is unused and its inputs are not tied: it can oscillate and draw extra current.`,
          'Add it to "spares" with + tied to ground and − to the reference (output left open): common practice.');
      }
    }
  }
}
