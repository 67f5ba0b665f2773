/**
 * Bill of materials: parts grouped by kind and value with their conventional designators, as CSV
 * (RFC 4180: CRLF line ends, fields quoted when they hold a comma, quote or line break, quotes
 * doubled) and as a readable table.
 */
import type { Analysis } from '../analysis-types';
import type { Design } from '../design/types';
import { isInSeries } from '../series';
import { formatEng, formatRkm } from '../values';
import type { Designators } from './designators';

/** Derating margin on resistor power: rating >= 2 x worst dissipation (common practice, no source). */
export const POWER_MARGIN = 2;

/** Common resistor power ratings (W), smallest first (common practice, no source). */
export const POWER_RATINGS = [0.0625, 0.1, 0.125, 0.25, 0.5, 1, 2, 3, 5] as const;

/** One line of the bill: a group of identical parts. */
export interface BomLine {
  /** Conventional designators, in order, e.g. ["R1", "R4"]. */
  designators: string[];
  quantity: number;
  /** Part kind in words: "resistor", "LED", "quad comparator", "shunt reference". */
  part: string;
  /** Value as text, e.g. "10.0 kohm (10k)". */
  value: string;
  /** Tolerance as text, e.g. "1 %", or "" when it does not apply. */
  tolerance: string;
  /** Rating as text: resistor power, LED current, comparator supply range. */
  rating: string;
  /** Anything else: series membership, parameters of the class. */
  notes: string;
}

/** Smallest common rating (W) that covers `watts` with the derating margin. */
export function powerRating(watts: number): number {
  const need = watts * POWER_MARGIN;
  return POWER_RATINGS.find((r) => r >= need) ?? POWER_RATINGS[POWER_RATINGS.length - 1];
}

const percent = (rel: number) => `${Number((rel * 100).toPrecision(3))} %`;
const watts = (w: number) => formatEng(w, 'W', { ascii: true, digits: 3 });

/** The bill of materials of `design` with the designators `ds` and the analysis `a` (for dissipation and currents). */
export function buildBom(design: Design, a: Analysis, ds: Designators): BomLine[] {
  const groups = new Map<string, BomLine>();
  const put = (key: string, ref: string, line: Omit<BomLine, 'designators' | 'quantity'>) => {
    const g = groups.get(key);
    if (g) {
      g.designators.push(ref);
      g.quantity++;
    } else groups.set(key, { designators: [ref], quantity: 1, ...line });
  };
  for (const e of ds.entries) {
    if (e.kind === 'resistor') {
      const rating = powerRating(a.dissipation[e.internal] ?? 0);
      const value = `${formatEng(e.ohms, 'Ω', { ascii: true, digits: 3 })} (${formatRkm(e.ohms)})`;
      const inSeries = isInSeries(e.ohms, design.series);
      put(`R|${e.ohms}|${rating}`, e.ref, {
        part: 'resistor',
        value,
        tolerance: percent(design.resistorTolerance),
        rating: watts(rating),
        notes: inSeries ? design.series : `not in ${design.series}`,
      });
    } else if (e.kind === 'led') {
      const ch = design.channels.find((c) => `D:${c.id}` === e.internal);
      const led = ch?.led;
      const current = a.channels.find((c) => c.id === ch?.id)?.ledCurrentMax ?? 0;
      const colour = led?.colour ?? 'any colour';
      put(`D|${colour}|${led?.knee}`, e.ref, {
        part: 'LED',
        value: `${colour}, ${formatEng(led?.knee ?? 0, 'V', { ascii: true })} forward`,
        tolerance: '',
        rating: `>= ${formatEng(current * POWER_MARGIN, 'A', { ascii: true })}`,
        notes: `indicator; up to ${formatEng(current, 'A', { ascii: true })} in this circuit`,
      });
    } else if (e.kind === 'comparator') {
      const p = design.part;
      put('U|part', e.ref, {
        part: 'quad comparator',
        value: p.description,
        tolerance: '',
        rating: `${formatEng(p.supplyMin, 'V', { ascii: true })} to ${formatEng(p.supplyMax, 'V', { ascii: true })} supply`,
        notes: `${p.output}; Vos <= ${formatEng(p.vosMax, 'V', { ascii: true })}; Ib <= ${formatEng(p.ibMax, 'A', { ascii: true })}; sink >= ${formatEng(p.sinkMax, 'A', { ascii: true })}`,
      });
    } else if (design.reference.kind === 'shunt') {
      const r = design.reference;
      put('U|ref', e.ref, {
        part: 'adjustable shunt reference',
        value: formatEng(r.volts, 'V', { ascii: true, digits: 4 }),
        tolerance: percent(r.tolerance),
        rating: `${formatEng(r.minCurrent, 'A', { ascii: true })} to ${formatEng(r.maxCurrent, 'A', { ascii: true })} cathode`,
        notes: `set to ${formatEng(r.volts, 'V', { ascii: true, digits: 4 })}`,
      });
    }
  }
  return [...groups.values()];
}

/** Column headings of the CSV and the table. */
export const BOM_COLUMNS = ['Designators', 'Quantity', 'Part', 'Value', 'Tolerance', 'Rating', 'Notes'] as const;

function cells(line: BomLine): string[] {
  return [line.designators.join(' '), String(line.quantity), line.part, line.value, line.tolerance, line.rating, line.notes];
}

/** One RFC 4180 field: quoted when it holds a comma, a double quote, CR or LF; quotes doubled. */
export function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The bill as RFC 4180 CSV: a header record, one record per line, CRLF after every record. */
export function bomCsv(lines: BomLine[]): string {
  return [[...BOM_COLUMNS], ...lines.map(cells)].map((r) => `${r.map(csvField).join(',')}\r\n`).join('');
}

/** The bill as a Markdown table (readable as plain text too). */
export function bomTable(lines: BomLine[]): string {
  const rows = [[...BOM_COLUMNS], ...lines.map(cells)].map((r) => r.map((c) => c.replace(/\|/g, '/')));
  const widths = BOM_COLUMNS.map((_, k) => Math.max(3, ...rows.map((r) => r[k].length)));
  const fmt = (r: string[]) => `| ${r.map((c, k) => c.padEnd(widths[k])).join(' | ')} |`;
  return [fmt(rows[0]), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...rows.slice(1).map(fmt)].join('\n') + '\n';
}
