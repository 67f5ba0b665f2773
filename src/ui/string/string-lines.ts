/**
 * The resistor string drawn top to bottom as wired: supply, reference, each resistor with its value,
 * each tap with its voltage at the probe and the channels wired to it, ground, then the input path.
 * Pure: lines of segments, some of which are editable fields.
 */
import type { ProbeResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { fieldText } from '../state/app-reducer';
import type { Field } from '../state/fields';
import { fmtV } from '../format';
import type { Glyphs } from '../theme';

/** A piece of a string line: plain text, or the shown value of a field. */
export type StringSeg = { text: string; fieldId?: string; isMuted?: boolean };

/** One line of the string drawing; `fieldIds` lists the fields it shows. */
export interface StringLine {
  segs: StringSeg[];
  fieldIds: string[];
}

function line(...segs: StringSeg[]): StringLine {
  return { segs, fieldIds: segs.flatMap((s) => (s.fieldId ? [s.fieldId] : [])) };
}

/** The channels wired to `node`, as "S1+" (non-inverting) or "S1-" (inverting). */
function wiredTo(d: Design, node: string, minus: string): string {
  return d.channels.flatMap((c) => [c.plus === node ? `${c.id}+` : '', c.minus === node ? `${c.id}${minus}` : '']).filter(Boolean).join(' ');
}

/** Every line of the string pane. `probe` null (unsolvable circuit) shows no voltages. */
export function stringLines(d: Design, fields: Field[], probe: ProbeResult | null, g: Glyphs, ascii: boolean): StringLine[] {
  const byId = new Map(fields.map((f) => [f.id, f]));
  const val = (id: string): StringSeg => {
    const f = byId.get(id);
    return { text: f ? fieldText(f, d) : '?', fieldId: id };
  };
  const volts = (node: string) => (probe && node in probe.nodes ? fmtV(probe.nodes[node], ascii) : '');
  const minus = ascii ? '-' : '−';
  const out: StringLine[] = [];
  const supplyText = d.supply.kind === 'measured' ? `supply=x ${volts('supply')}` : 'supply ';
  out.push(d.supply.kind === 'fixed'
    ? line(val('series'), { text: '  supply ' }, val('supply.volts'))
    : line(val('series'), { text: `  ${supplyText}` }));
  const ref = d.reference;
  if (ref.kind === 'shunt') {
    out.push(line({ text: `${g.wire} RB ` }, val('ref.bias'), { text: ' from supply', isMuted: true }));
  }
  if (ref.kind === 'supply') {
    out.push(line({ text: `${g.top} top = supply ${volts('supply')}` }));
  } else {
    // The reference node normally sits at its set value; its actual voltage is shown only when it
    // differs by more than a millivolt (a shunt out of regulation, a loaded external reference).
    const actual = probe && 'ref' in probe.nodes ? probe.nodes.ref : ref.volts;
    const off = Math.abs(actual - ref.volts) > 1e-3 ? ` now ${volts('ref')}` : '';
    out.push(line({ text: `${g.top} ref ` }, val('ref.volts'), { text: off }));
  }
  d.string.forEach((_, k) => {
    out.push(line({ text: `${g.wire} RS${k + 1} ` }, val(`string.${k}`)));
    if (k < d.string.length - 1) {
      const tap = `T${k + 1}`;
      const who = wiredTo(d, tap, minus);
      out.push(line({ text: `${g.tap} ${tap} ${volts(tap)}` }, { text: who ? `  ${who}` : '', isMuted: false }));
    }
  });
  out.push(line({ text: `${g.bottom} gnd 0 V` }));
  const inWho = wiredTo(d, 'in', minus);
  if (d.input.divider) {
    out.push(line({ text: `in ${volts('in')} RD1 ` }, val('input.top'), { text: ' RD2 ' }, val('input.bottom'), { text: inWho ? `  ${inWho}` : '', isMuted: true }));
  } else if (d.input.shunt !== undefined) {
    out.push(line({ text: `in ${volts('in')} RSH ` }, val('input.shunt'), { text: inWho ? `  ${inWho}` : '', isMuted: true }));
  } else {
    out.push(line({ text: `in ${volts('in')}` }, { text: inWho ? `  ${inWho}` : '', isMuted: true }));
  }
  return out;
}
