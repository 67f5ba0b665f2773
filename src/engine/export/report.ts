/**
 * The design report in Markdown: job statement, the string, allocation map, target against
 * realised trip points, currents and battery life, spread summary, findings and cautions.
 */
import type { Analysis } from '../analysis-types';
import type { Design } from '../design/types';
import type { SpreadReport } from '../spread/summary';
import { formatEng } from '../values';
import { bomTable, buildBom } from './bom';
import type { Designators } from './designators';
import { drawString, formatX, jobStatement } from './report-parts';
import { tripRows } from './trip-rows';

/** What the report is drawn from. */
export interface ReportInput {
  design: Design;
  analysis: Analysis;
  designators: Designators;
  /** Spread analysis, when it was run; the section says so when it was not. */
  spread?: SpreadReport | null;
  /** Safety cautions, one paragraph each. */
  cautions?: string[];
}

const table = (head: string[], rows: string[][]) =>
  [`| ${head.join(' | ')} |`, `|${head.map(() => '---').join('|')}|`, ...rows.map((r) => `| ${r.map((c) => c.replace(/\|/g, '/')).join(' | ')} |`)].join('\n');

/** Days a battery of `capacityAh` lasts at `amperes` (d). */
export function drainDays(capacityAh: number, amperes: number): number {
  return amperes > 0 ? capacityAh / amperes / 24 : Infinity;
}

/** The whole report as Markdown text. Pure. */
export function buildReport(input: ReportInput): string {
  const { design, analysis: a, designators: ds } = input;
  const fx = (x: number | null) => formatX(design, x);
  const parts: string[] = [`# ${design.name}`, '', '## Job', '', jobStatement(design)];
  if (design.notes) parts.push('', `Notes: ${design.notes}`);

  parts.push('', '## String', '', drawString(design, a, ds));

  parts.push('', '## Allocation', '');
  const load = (id: string) => {
    const ch = design.channels.find((c) => c.id === id);
    if (!ch) return '';
    const bits = [
      ch.led ? `LED ${ds.of(`D:${ch.id}`)} via ${ds.of(`RL:${ch.id}`)}` : '',
      ch.pullup ? `pull-up ${ds.of(`RP:${ch.id}`)} to ${ch.pullup.to}` : '',
      ch.feedback ? `feedback ${ds.of(`RF:${ch.id}`)} to ${ch.feedback.to === 'plus' ? '+' : '−'}` : '',
      ch.wiredTo ? `wired to ${ds.unitOf(ch.wiredTo)}` : '',
    ];
    return bits.filter(Boolean).join('; ');
  };
  const alloc = [
    ...design.channels.map((c) => ({ p: c.package, k: c.channel, row: [ds.unitOf(c.id), c.id, c.label, c.plus, c.minus, load(c.id)] })),
    ...design.spares.map((s) => ({ p: s.package, k: s.channel, row: [`package ${s.package} ch ${s.channel}`, '-', 'spare, inputs tied', s.plus, s.minus, 'none'] })),
  ].sort((x, y) => x.p - y.p || x.k - y.k);
  parts.push(table(['Unit', 'Channel', 'Function', '+ input', '− input', 'Output'], alloc.map((r) => r.row)));

  parts.push('', '## Trip points', '', `x in ${design.quantity.unit || 'its unit'}; realised values are the exact sweep of the values as built.`, '');
  const rows = tripRows(design, a).map((r) => [
    `${ds.unitOf(r.channel)} (${r.channel})`,
    r.label,
    r.edge,
    fx(r.target),
    fx(r.realised),
    r.error === null ? '-' : formatX(design, r.error),
  ]);
  parts.push(table(['Unit', 'Function', 'Edge', 'Target', 'Realised', 'Error'], rows));
  const hyst = a.channels.map((c) => `${c.id} ${fx(c.hysteresis)}`).join(', ');
  parts.push('', `Hysteresis: ${hyst}.`);

  parts.push('', '## Currents', '');
  const sc = a.supplyCurrent;
  parts.push(`- Standby (least) drain: ${formatEng(sc.min, 'A')} at ${fx(sc.minAt)}.`, `- Largest drain: ${formatEng(sc.max, 'A')} at ${fx(sc.maxAt)}.`);
  for (const c of a.channels) if (c.ledCurrentMax !== null) parts.push(`- LED of ${c.id}: up to ${formatEng(c.ledCurrentMax, 'A')}; output sinks up to ${formatEng(c.sinkMax, 'A')}.`);
  const bat = design.battery;
  if (bat && design.supply.kind === 'measured') {
    const days = (i: number) => `${Number(drainDays(bat.capacityAh, i).toPrecision(3))} days`;
    parts.push(`- From a ${bat.capacityAh} Ah ${bat.chemistry} battery: ${days(sc.min)} at standby drain, ${days(sc.max)} at the largest drain (drain of this circuit alone).`);
  }

  parts.push('', '## Spread', '', spreadSection(design, input.spread ?? null));

  parts.push('', '## Findings', '');
  parts.push(a.findings.length ? a.findings.map((f) => `- **${f.severity}** ${f.code} (${f.part}${f.x === null ? '' : ` at ${fx(f.x)}`}): ${f.message} ${f.fix}`).join('\n') : 'None.');

  parts.push('', '## Cautions', '');
  parts.push(input.cautions?.length ? input.cautions.map((c) => `- ${c}`).join('\n') : 'None for this design.');

  parts.push('', '## Bill of materials', '', bomTable(buildBom(design, a, ds)));
  return `${parts.join('\n')}`;
}

function spreadSection(design: Design, s: SpreadReport | null): string {
  if (!s) return 'Not run.';
  const fx = (x: number | null | undefined) => formatX(design, x ?? null);
  const pct = (v: number | null) => (v === null ? '-' : `${Number((v * 100).toPrecision(3))} %`);
  const head = `${s.trials} Monte Carlo trials (seed ${s.seed})${s.worstCase ? ` and a worst-case search (${s.worstCase.method}, ${s.worstCase.evaluations} sweeps)` : ''}. Overall yield ${pct(s.yield)}${s.allowance === null ? '' : ` within ±${fx(s.allowance)}`}; chatter in ${pct(s.chatter)} of trials.`;
  const rows = s.channels.flatMap((c) =>
    (['rising', 'falling'] as const).map((edge) => {
      const q = c[edge];
      return [c.id, edge, fx(q.nominal), q.stats ? `${fx(q.stats.p00135)} .. ${fx(q.stats.p99865)}` : '-', q.bound ? `${fx(q.bound.min)} .. ${fx(q.bound.max)}` : '-', pct(q.yield)];
    }),
  );
  const risks = [...s.order, ...s.windows].filter((r) => r.probability > 0);
  const order = risks.length ? risks.map((r) => `${r.lower}/${r.upper} swap in ${pct(r.probability)}`).join('; ') : 'no step swaps order in any trial';
  return [head, '', table(['Channel', 'Edge', 'Nominal', '±3σ (MC)', 'Worst case', 'Yield'], rows), '', `Order: ${order}.`].join('\n');
}
