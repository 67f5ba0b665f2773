/**
 * The plan as text: package/channel map, resistor values, target vs realised, notes and problems.
 */
import type { PlanResult } from '../../engine/planner/index';
import { formatEng, formatRkm } from '../../engine/values';
import { textTable } from './table';

/** Options for the plan report. */
export interface PlanReportOptions {
  /** Plain ASCII output (no µ, Ω, − or ±). */
  ascii: boolean;
  /** Where the realised design was written, or null when nothing was written. */
  output: string | null;
}

/** The whole plan report as text, ending in a newline. */
export function planReport(result: PlanResult, opts: PlanReportOptions): string {
  const unit = result.design.quantity.unit;
  const minus = opts.ascii ? '-' : '−';
  const fx = (x: number | null) => (x === null ? 'never' : formatEng(x, unit, { digits: 5, ascii: opts.ascii }));
  const parts: string[] = [];
  if (result.allocation.length) {
    parts.push('Packages and channels');
    parts.push(textTable(
      ['pkg', 'ch', 'channel', '+in', `${minus}in`, 'out', 'function'],
      result.allocation.map((e) => [String(e.package), String(e.channel), e.id ?? '(spare)', e.pins.plusIn, e.pins.minusIn, e.pins.out, e.role]),
      ['right', 'right'],
    ));
  }
  if (result.values.length) {
    parts.push('Values');
    parts.push(textTable(['resistor', 'value', 'role'], result.values.map((v) => [v.id, formatRkm(v.ohms), v.role]), ['left', 'right']));
  }
  if (result.pairs.length) {
    parts.push('Two-resistor pairs');
    parts.push(result.pairs.map((p) => `  ${p.resistor}: ${formatRkm(p.values[0])} ${p.how === 'series' ? '+' : '||'} ${formatRkm(p.values[1])} = ${formatRkm(p.realised)} (wanted ${formatRkm(p.ideal)})`).join('\n'));
  }
  if (result.rows.length) {
    parts.push('Target vs realised');
    parts.push(textTable(
      ['channel', 'edge', 'target', 'realised', 'error', ''],
      result.rows.map((r) => [r.channel, r.edge, fx(r.target), fx(r.realised), r.error === null ? '' : formatEng(r.error, unit, { digits: 3, ascii: opts.ascii }), r.ok ? 'ok' : 'MISSED']),
      ['left', 'left', 'right', 'right', 'right'],
    ));
  }
  if (result.notes.length) parts.push(['Notes', ...result.notes.map((n) => `  ${n}`)].join('\n'));
  if (result.problems.length) {
    parts.push(['Cannot meet the targets', ...result.problems.map((p) => `  ${p.target}: ${p.message}\n    Fix: ${p.fix}`)].join('\n'));
  }
  if (result.design.battery) {
    parts.push(`Caution: a ${result.design.battery.chemistry} battery can drive very large currents into a short. Fuse the supply lead at the battery terminal and insulate the leads before connecting.`);
  }
  parts.push(opts.output ? `Realised design written to ${opts.output}` : 'No design written.');
  return `${parts.join('\n\n')}\n`;
}
