/**
 * A machine-readable export: the design file itself plus everything the report shows, as numbers
 * (SI units; x in the design's unit).
 */
import { designToFile } from '../design/save';
import { buildBom } from './bom';
import type { ReportInput } from './report';
import { tripRows } from './trip-rows';

/** Version of the JSON export layout. */
export const EXPORT_JSON_FORMAT = 1;

/** The export as pretty-printed JSON text (two-space indent, trailing newline). Pure. */
export function buildJsonExport(input: ReportInput): string {
  const { design, analysis: a, designators: ds } = input;
  const spread = input.spread
    ? { ...input.spread, channels: input.spread.channels.map((c) => ({ ...c, rising: { ...c.rising, histogram: undefined }, falling: { ...c.falling, histogram: undefined }, hysteresis: { ...c.hysteresis, histogram: undefined } })) }
    : null;
  const out = {
    exportFormat: EXPORT_JSON_FORMAT,
    design: designToFile(design),
    designators: ds.entries.map((e) => ({ ref: e.ref, internal: e.internal, kind: e.kind, ohms: e.kind === 'resistor' ? e.ohms : undefined, role: e.role })),
    units: Object.fromEntries(design.channels.map((c) => [c.id, ds.unitOf(c.id)])),
    trips: tripRows(design, a),
    hysteresis: Object.fromEntries(a.channels.map((c) => [c.id, c.hysteresis])),
    supplyCurrent: a.supplyCurrent,
    dissipation: Object.fromEntries(Object.entries(a.dissipation).map(([k, v]) => [ds.of(k), v])),
    bom: buildBom(design, a, ds),
    findings: a.findings,
    cautions: input.cautions ?? [],
    spread,
  };
  return `${JSON.stringify(out, null, 2)}\n`;
}
