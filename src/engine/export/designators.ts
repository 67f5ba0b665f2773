/**
 * Conventional reference designators for a design: sequential R1.., D1.., U1.. in place of the
 * engine's descriptive ones (RS1, RF:A, RL:A, ...). Netlist, bill of materials and report all use
 * the one map this module builds, so a part has the same name everywhere.
 */
import type { Design } from '../design/types';

/** One physical part with its conventional designator. */
export interface DesignatorEntry {
  /** Conventional designator, e.g. "R3", "D1", "U2". */
  ref: string;
  /** Engine designator or element id: "RS1", "RF:A", "RL:A", "D:A", "VREF", "PKG:1". */
  internal: string;
  /** Kind of part. */
  kind: 'resistor' | 'led' | 'comparator' | 'reference';
  /** Resistance for resistors (ohms); 0 otherwise. */
  ohms: number;
  /** What the part does, in words, e.g. "string, top", "feedback of channel A". */
  role: string;
}

/** The whole map, in designator order (resistors, LEDs, integrated circuits). */
export interface Designators {
  entries: DesignatorEntry[];
  /** Conventional designator of an engine designator ("RS1" -> "R1"); the input itself when unknown. */
  of: (internal: string) => string;
  /** Comparator unit of a channel id, package designator plus unit letter: "U1A". */
  unitOf: (channelId: string) => string;
}

/** Unit letters for the four channels of a quad package. */
const UNIT_LETTERS = ['A', 'B', 'C', 'D'];

/**
 * Builds the designator map of `design`: resistors in the order string (top to bottom), reference
 * bias, input path, then per channel (package, then channel order) series inputs, feedback,
 * pull-up and LED resistor; LEDs in channel order; comparator packages by package number, then the
 * shunt reference. Pure.
 */
export function assignDesignators(design: Design): Designators {
  const entries: DesignatorEntry[] = [];
  let r = 0;
  const resistor = (internal: string, ohms: number, role: string) =>
    entries.push({ ref: `R${++r}`, internal, kind: 'resistor', ohms, role });

  const n = design.string.length;
  design.string.forEach((ohms, k) => resistor(`RS${k + 1}`, ohms, k === 0 ? 'string, top' : k === n - 1 ? 'string, bottom' : `string, below T${k}`));
  if (design.reference.kind === 'shunt') resistor('RB', design.reference.bias, 'reference bias');
  if (design.input.signal === 'current') resistor('RSH', design.input.shunt ?? 250, 'loop shunt');
  else if (design.input.divider) {
    resistor('RD1', design.input.divider.top, 'input divider, top');
    resistor('RD2', design.input.divider.bottom, 'input divider, bottom');
  }
  const channels = [...design.channels].sort((a, b) => a.package - b.package || a.channel - b.channel);
  for (const ch of channels) {
    if (ch.seriesPlus !== undefined) resistor(`RIP:${ch.id}`, ch.seriesPlus, `series into + of channel ${ch.id}`);
    if (ch.seriesMinus !== undefined) resistor(`RIM:${ch.id}`, ch.seriesMinus, `series into − of channel ${ch.id}`);
    if (ch.feedback) resistor(`RF:${ch.id}`, ch.feedback.ohms, `feedback of channel ${ch.id}`);
    if (ch.pullup) resistor(`RP:${ch.id}`, ch.pullup.ohms, `pull-up of channel ${ch.id}`);
    if (ch.led) resistor(`RL:${ch.id}`, ch.led.ohms, `LED resistor of channel ${ch.id}`);
  }
  let d = 0;
  for (const ch of channels) {
    if (ch.led) entries.push({ ref: `D${++d}`, internal: `D:${ch.id}`, kind: 'led', ohms: 0, role: `indicator of channel ${ch.id}` });
  }
  const packages = [...new Set([...design.channels, ...design.spares].map((c) => c.package))].sort((a, b) => a - b);
  let u = 0;
  const packageRef = new Map<number, string>();
  for (const p of packages) {
    const ref = `U${++u}`;
    packageRef.set(p, ref);
    entries.push({ ref, internal: `PKG:${p}`, kind: 'comparator', ohms: 0, role: `quad comparator package ${p}` });
  }
  if (design.reference.kind === 'shunt') entries.push({ ref: `U${++u}`, internal: 'VREF', kind: 'reference', ohms: 0, role: 'shunt reference' });

  const byInternal = new Map(entries.map((e) => [e.internal, e.ref]));
  const unitByChannel = new Map(design.channels.map((c) => [c.id, `${packageRef.get(c.package)}${UNIT_LETTERS[c.channel - 1] ?? c.channel}`]));
  return {
    entries,
    of: (internal) => byInternal.get(internal) ?? internal,
    unitOf: (channelId) => unitByChannel.get(channelId) ?? channelId,
  };
}
