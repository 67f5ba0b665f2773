/**
 * Output loads: LED resistors from rail, knee, sink voltage and target current; pull-ups for
 * logic and relay-driver inputs; dot-mode LEDs between adjacent outputs with pull-ups sized to feed
 * them (and the current they waste counted); wired window outputs where the output type allows.
 */
import type { Channel, Design, Targets } from '../design/types';
import { nearestInSeries } from '../series';
import { supplyAt } from './scaling';
import type { PlanProblem, Unit } from './types';

/** Share of a between-outputs LED branch given to the LED resistor; the pull-up takes the rest (common practice, no source). */
const LED_SHARE = 0.1;

/** Sizes every load in place on `design.channels`. Returns problems that stop planning. */
export function sizeLoads(design: Design, t: Targets, units: Unit[], notes: string[]): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const part = design.part;
  const oc = part.output === 'open-collector';
  const ch = (u: Unit) => design.channels.find((c) => c.id === u.id) as Channel;
  const { min, max } = design.quantity;
  // Supply where the LED is lit, halfway through the lit stretch (V).
  const vsLit = (u: Unit) => supplyAt(design, u.sinksOnRise ? (u.rising + max) / 2 : (min + u.falling) / 2);
  const branch = (u: Unit, vs: number, sinkShare = 0.9, xTop?: number): number | null => {
    const r = (vs - t.led.knee - part.vsat0) / t.led.current - t.led.rdyn - part.rsat;
    const vTop = supplyAt(design, xTop ?? (u.sinksOnRise ? max : u.falling));
    const rSink = (vTop - t.led.knee - part.vsat0) / (sinkShare * part.sinkMax) - t.led.rdyn - part.rsat;
    const need = Math.max(r, rSink);
    if (r <= 0) {
      problems.push({
        target: u.fn.id,
        message: `the ${vs.toPrecision(3)} V supply cannot drive the LED (knee ${t.led.knee} V) at ${(t.led.current * 1e3).toPrecision(3)} mA through channel ${u.id}.`,
        fix: 'Use a lower-knee LED, a smaller LED current, or a higher supply.',
      });
      return null;
    }
    if (rSink > r) notes.push(`${u.id}: LED resistor raised so the output stays under the part's ${(part.sinkMax * 1e3).toPrecision(3)} mA sink rating at the top of the range.`);
    return need;
  };
  const led = (u: Unit, anode: string, ohms: number) => {
    ch(u).led = { ohms: nearestInSeries(ohms, design.series), knee: t.led.knee, rdyn: t.led.rdyn, anode };
  };
  const pullup = (u: Unit) => {
    if (oc) ch(u).pullup = { ohms: nearestInSeries(t.pullup, design.series), to: 'supply' };
  };
  // An output under a between-outputs LED also sinks its own pull-up's current: share the rating.
  const between = (lower: Unit, upper: Unit) => {
    const r = branch(lower, vsLit(lower), 0.35);
    if (r === null) return;
    led(lower, `out:${upper.id}`, Math.max(1, r * LED_SHARE));
    if (oc) ch(upper).pullup = { ohms: nearestInSeries(r * (1 - LED_SHARE), design.series), to: 'supply' };
  };
  for (const fn of new Set(units.map((u) => u.fn))) {
    const mine = units.filter((u) => u.fn === fn);
    if (fn.kind === 'bar') {
      mine.forEach((u, k) => {
        const upper = mine[k + 1];
        if (fn.mode === 'dot' && upper) between(u, upper);
        else {
          const r = branch(u, vsLit(u), fn.mode === 'dot' ? 0.35 : 0.9);
          if (r !== null) led(u, 'supply', r);
        }
      });
      if (fn.mode === 'dot' && oc) {
        const w = mine.slice(1).reduce((s, u) => s + (supplyAt(design, max) - part.vsat0) / (ch(u).pullup?.ohms ?? Infinity), 0);
        notes.push(`${fn.id}: dot mode; each LED hangs between adjacent outputs and the pull-ups feeding them waste up to ${(w * 1e3).toPrecision(3)} mA when their outputs sink.`);
      }
    } else if (fn.kind === 'window') {
      const [lo, hi] = mine;
      if (fn.sense === 'inside' && fn.load === 'led') {
        between(lo, hi);
        notes.push(`${fn.id}: the LED hangs between the two outputs; it lights only while the low channel sinks and the high one is released, i.e. inside the window.`);
        continue;
      }
      if (!oc) {
        problems.push({
          target: fn.id,
          message: `the window needs its two outputs wired together, and the part class (${part.id}) has push-pull outputs: one would drive high while the other sinks, shorting the supply through both output stages.`,
          fix: 'Pick an open-collector or open-drain part class, or combine the two outputs with a logic gate.',
        });
        continue;
      }
      ch(hi).wiredTo = lo.id;
      if (fn.load === 'led') {
        const r = branch(lo, supplyAt(design, (min + max) / 2), 0.9, max);
        if (r !== null) led(lo, 'supply', r);
      } else {
        pullup(lo);
        if (fn.sense === 'inside') notes.push(`${fn.id}: the wired outputs are released (pulled high) inside the window and sink outside it: an active-high inside signal.`);
      }
    } else {
      const [u] = mine;
      if (fn.load === 'led') {
        const r = branch(u, vsLit(u));
        if (r !== null) led(u, 'supply', r);
      } else pullup(u);
    }
  }
  return problems;
}
