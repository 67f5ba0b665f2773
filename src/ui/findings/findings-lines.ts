/**
 * What the findings pane lists: the engine's findings, safety cautions for the design's battery, and
 * the spread of each trip point once it has been computed. Pure.
 */
import type { Finding } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import type { Range, SpreadStatus } from '../state/app-state';
import { fmtX } from '../format';

/** One entry: a tag ("ERR", "WARN", "info", "CAUTION", "spread") and its text; `detail` is shown when selected. */
export interface FindingLine {
  tag: 'error' | 'warning' | 'info' | 'caution' | 'spread';
  text: string;
  detail?: string;
}

/** The usual cautions for work on a battery of the design's chemistry. */
export function batteryCautions(d: Design): FindingLine[] {
  if (!d.battery) return [];
  const chem = d.battery.chemistry.toLowerCase();
  const out: FindingLine[] = [{
    tag: 'caution',
    text: `${d.battery.chemistry} battery: it can drive very large currents into a short`,
    detail: 'fuse the supply lead (a few hundred mA) right at the battery terminal and insulate the leads before connecting',
  }];
  if (chem.includes('lead')) out.push({ tag: 'caution', text: 'lead-acid vents hydrogen on charge', detail: 'keep sparks and flames away; connect and disconnect with the charger off' });
  if (chem.includes('lith')) out.push({ tag: 'caution', text: 'lithium cells burn when shorted, crushed or over-charged', detail: 'fuse at the cell, never probe across a damaged cell, keep the gauge drain within the pack maker\'s standby budget' });
  return out;
}

function worst(r: Range | null, d: Design, ascii: boolean): string {
  return r && r.worstMin !== null && r.worstMax !== null ? range(r.worstMin, r.worstMax, d, ascii) : 'not computed';
}

function range(lo: number, hi: number, d: Design, ascii: boolean): string {
  return `${fmtX(lo, d, ascii)}..${fmtX(hi, d, ascii)}`;
}

/** Lines for a finished spread: per channel, the ±3 sigma range of each trip point; extremes and worst case when selected. */
export function spreadLines(s: SpreadStatus, d: Design, ascii: boolean): FindingLine[] {
  if (s.state === 'failed') return [{ tag: 'spread', text: `spread failed: ${s.message}` }];
  if (s.state !== 'done') return [];
  return s.result.channels.map((c) => ({
    tag: 'spread' as const,
    text: `${c.id} rise ${c.rising ? range(c.rising.lo, c.rising.hi, d, ascii) : '-'}  fall ${c.falling ? range(c.falling.lo, c.falling.hi, d, ascii) : '-'}`,
    detail: `${s.result.trials} trials, ±3 sigma shown; worst case rise ${worst(c.rising, d, ascii)}, fall ${worst(c.falling, d, ascii)}`,
  }));
}

/** Every entry of the findings pane in order: errors, warnings, info, cautions, spread. */
export function findingLines(findings: Finding[], d: Design, spread: SpreadStatus, ascii: boolean): FindingLine[] {
  const order = { error: 0, warning: 1, info: 2 } as const;
  const sorted = [...findings].sort((a, b) => order[a.severity] - order[b.severity]);
  const own: FindingLine[] = sorted.map((f) => ({
    tag: f.severity,
    text: `${f.part}${f.x !== null ? ` @${fmtX(f.x, d, ascii)}` : ''}: ${f.message}${f.amount ? ` (${f.amount})` : ''}`,
    detail: f.fix,
  }));
  return [...own, ...batteryCautions(d), ...spreadLines(spread, d, ascii)];
}
