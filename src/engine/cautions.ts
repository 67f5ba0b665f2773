/**
 * Safety cautions that reports and the interactive screen show where they apply. They are derived
 * from the design alone (battery chemistry, supply and measured voltages, the part's absolute
 * maximum); the model has no "mains" flag, so hazardous voltage is judged by level. Every caution
 * defers to local codes and licensed practice.
 */
import type { Design } from './design/types';

/** One caution: a stable id and one short paragraph. */
export interface Caution {
  /** Stable id: "battery-fault-current", "not-cell-protection", "hazardous-voltage", "abs-max-supply". */
  id: string;
  text: string;
}

/**
 * DC level above which a voltage is treated as hazardous to touch (V): the safety extra-low voltage
 * limit for DC in dry conditions, from memory (IEC 61140 and equipment standards use 60 V ripple-free).
 */
export const HAZARDOUS_DC_VOLTS = 60;

/** Fraction of the part's absolute maximum above which the supply is flagged (common practice, no source). */
export const ABS_MAX_MARGIN = 0.8;

const LEAD_ACID = /lead|pb|agm|gel|sla|flooded/i;
const LITHIUM = /lith|li-?ion|lipo|lifepo|li-?po|nmc|lfp/i;

/** Highest voltage the design can see anywhere (V): supply, measured voltage, reference, rails. */
export function highestVolts(design: Design): number {
  const q = design.quantity;
  const candidates = [0, ...design.rails.map((r) => r.volts)];
  if (design.supply.kind === 'fixed') candidates.push(design.supply.max, design.supply.volts);
  else candidates.push(q.max);
  if (design.input.signal === 'voltage') candidates.push(design.input.offset + design.input.gain * q.max, design.input.offset + design.input.gain * q.min);
  if (design.reference.kind !== 'supply') candidates.push(design.reference.volts);
  return Math.max(...candidates.map(Math.abs));
}

/** Highest comparator supply (V) over the design's range. */
export function highestSupply(design: Design): number {
  return design.supply.kind === 'fixed' ? Math.max(design.supply.max, design.supply.volts) : design.quantity.max;
}

/**
 * The cautions that apply to `design`, in a fixed order:
 * - a lead-acid or lithium battery: its fault current, and fusing the sense lead near the battery;
 * - any battery: a gauge is not a cell-protection circuit;
 * - any voltage above `HAZARDOUS_DC_VOLTS` (this covers mains-derived supplies, which the model cannot
 *   name): isolation and licensed practice;
 * - a supply above `ABS_MAX_MARGIN` of the part's absolute maximum: transients (charging, load dump)
 *   can exceed it.
 */
export function cautionsFor(design: Design): Caution[] {
  const out: Caution[] = [];
  const chemistry = design.battery?.chemistry ?? '';
  const kind = LEAD_ACID.test(chemistry) ? 'Lead-acid' : LITHIUM.test(chemistry) ? 'Lithium' : null;
  if (kind) {
    out.push({
      id: 'battery-fault-current',
      text: `${kind} batteries can deliver hundreds to thousands of amperes into a short: a pinched sense lead can burn or start a fire. Fuse the sense lead as close to the battery terminal as you can, size wire and fuse for the fault, and follow local codes and the battery maker's instructions.`,
    });
  }
  if (design.battery) {
    out.push({
      id: 'not-cell-protection',
      text: 'A threshold gauge shows state; it is not a cell-protection circuit. Over-charge, over-discharge, over-current and temperature protection need a dedicated, qualified protection device.',
    });
  }
  const top = highestVolts(design);
  if (top > HAZARDOUS_DC_VOLTS) {
    out.push({
      id: 'hazardous-voltage',
      text: `This design sees up to ${round(top)} V, above the ${HAZARDOUS_DC_VOLTS} V usually treated as safe to touch. Circuits on mains-derived or high-voltage supplies need reinforced isolation, creepage and clearance, an enclosure and licensed practice; follow local codes.`,
    });
  }
  const supply = highestSupply(design);
  if (supply > ABS_MAX_MARGIN * design.part.absMaxSupply) {
    out.push({
      id: 'abs-max-supply',
      text: `The supply reaches ${round(supply)} V against an absolute maximum of ${round(design.part.absMaxSupply)} V for this part class. Charging voltages, load dump and switching transients can exceed it: add margin or a clamp, and check your datasheet.`,
    });
  }
  return out;
}

function round(v: number): string {
  return String(Math.round(v * 10) / 10);
}
