/** The spread report as text for the terminal and as a JSON document. */
import type { Caution } from '../../engine/cautions';
import { wrapWords } from '../../ui/common/wrap-words';
import type { Design } from '../../engine/design/types';
import { PART_VALUES_NOTE } from '../../engine/parts';
import type { QuantitySpread, SpreadReport } from '../../engine/spread';
import { formatEng } from '../../engine/values';
import { textTable } from './table';

/** Text options. */
export interface SpreadTextOptions {
  /** Plain ASCII output. */
  ascii: boolean;
}

const pct = (p: number, digits = 2) => `${(p * 100).toFixed(digits)} %`;

/** The spread report as readable text (x values in the design's unit). */
export function spreadText(design: Design, r: SpreadReport, cautions: Caution[], opts: SpreadTextOptions): string {
  const unit = design.quantity.unit;
  const x = (v: number | null | undefined, digits = 4) => (v === null || v === undefined ? '-' : formatEng(v, unit, { ascii: opts.ascii, digits }));
  const lines: string[] = [];
  const wc = r.worstCase;
  lines.push(`Spread of ${design.name}: ${r.trials} Monte Carlo trials, seed ${r.seed}.`);
  if (wc) lines.push(`Worst case: ${wc.method === 'corners' ? 'every corner' : 'sensitivity-signed corners'} (${wc.evaluations} sweeps).`);
  lines.push(`Part offset and bias figures are ${PART_VALUES_NOTE}.`, '');
  const rows: string[][] = [];
  const row = (label: string, edge: string, q: QuantitySpread, extra: string) => {
    const s = q.stats;
    rows.push([
      label,
      edge,
      x(q.nominal),
      x(q.bound?.min),
      x(q.bound?.max),
      x(s?.min),
      x(s?.max),
      x(s?.std, 3),
      x(s?.p00135),
      x(s?.p99865),
      q.yield === null ? '-' : pct(q.yield),
      extra,
    ]);
  };
  for (const c of r.channels) {
    row(c.id, 'rising', c.rising, c.rising.missing ? `${c.rising.missing} lost` : '');
    row('', 'falling', c.falling, c.falling.missing ? `${c.falling.missing} lost` : '');
    row('', 'hysteresis', c.hysteresis, c.hysteresis.belowNoise > 0 ? `${pct(c.hysteresis.belowNoise)} < noise` : '');
  }
  const header = ['channel', 'edge', 'nominal', 'worst min', 'worst max', 'MC min', 'MC max', 'std dev', '0.135 %', '99.865 %', 'yield', 'note'];
  lines.push(textTable(header, rows, ['left', 'left', ...Array(9).fill('right'), 'left']), '');
  lines.push(r.allowance === null ? 'Yield: no allowance set (targets.allowance).' : `Yield within ±${x(r.allowance, 3)} of nominal, every trip point: ${pct(r.yield ?? 0)}.`);
  lines.push(`Hysteresis is compared with ${x(r.noise, 3)} peak-to-peak noise on ${design.quantity.name}.`);
  for (const o of r.order) if (o.probability > 0) lines.push(`Steps ${o.lower} and ${o.upper} swap order in ${pct(o.probability)} of trials.`);
  for (const w of r.windows) if (w.probability > 0) lines.push(`Window ${w.lower}/${w.upper} inverts in ${pct(w.probability)} of trials.`);
  if (r.order.every((o) => o.probability === 0) && r.windows.every((w) => w.probability === 0)) lines.push('No trial swapped neighbouring steps or inverted a window.');
  if (r.chatter > 0) lines.push(`${pct(r.chatter)} of trials have a band with no stable state (the circuit chatters there).`);
  if (cautions.length) {
    lines.push('', 'Cautions (follow local codes and licensed practice):');
    // Wrapped for an 80-column terminal, each under its dash.
    for (const c of cautions) wrapWords(c.text, 76).forEach((t, k) => lines.push(`${k === 0 ? '-' : ' '} ${t}`));
  }
  return `${lines.join('\n')}\n`;
}

/** The spread report as a JSON document, format "tapline-spread/1". */
export function spreadJson(design: Design, r: SpreadReport, cautions: Caution[]): object {
  return {
    format: 'tapline-spread/1',
    design: design.name,
    quantity: { name: design.quantity.name, unit: design.quantity.unit },
    partValuesNote: PART_VALUES_NOTE,
    ...r,
    cautions,
  };
}
