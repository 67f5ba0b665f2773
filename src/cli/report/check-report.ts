import type { Analysis } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { formatEng, formatRkm } from '../../engine/values';
import { textTable } from './table';

/** Options for the readable check report. */
export interface ReportOptions {
  /** Plain ASCII: `u` for micro, `ohm` for the ohm sign. */
  ascii: boolean;
  /** File name shown in the title. */
  fileName: string;
}

/** The readable `check` report: taps, trip table, currents, findings. */
export function checkReport(design: Design, a: Analysis, opts: ReportOptions): string {
  const e = (v: number, unit: string, digits = 3) => formatEng(v, unit, { ascii: opts.ascii, digits });
  const ux = design.quantity.unit;
  const x = (v: number | undefined | null) => (v === undefined || v === null ? '-' : e(v, ux, 4));
  const out: string[] = [];
  out.push(`${design.name} (${opts.fileName})`);
  out.push(`${design.quantity.name}: ${x(design.quantity.min)} to ${x(design.quantity.max)}; supply ${supplyText(design, e)}; reference ${referenceText(design, e)}`);
  out.push('', 'String, top to bottom');
  const rows: string[][] = [[design.reference.kind === 'supply' ? 'supply' : 'ref', '', '', '']];
  design.string.forEach((ohms, k) => {
    rows.push([`RS${k + 1}`, formatRkm(ohms), '', '']);
    const tap = a.taps.find((t) => t.node === `T${k + 1}`);
    if (tap) rows.push([tap.node, '', `${e(tap.min, 'V', 4)}..${e(tap.max, 'V', 4)}`, tap.channels.join(' ')]);
  });
  rows.push(['gnd', '', '', '']);
  out.push(textTable(['node', 'value', 'tap voltage', 'channels'], rows));
  out.push('', 'Channels');
  out.push(
    textTable(
      ['ch', 'pkg.ch', 'label', `rising (${ux})`, `falling (${ux})`, 'hysteresis', 'at pins', 'max sink'],
      a.channels.map((c) => [
        c.id,
        `${c.package}.${c.channel}`,
        c.label,
        x(c.rising?.x),
        x(c.falling?.x),
        c.hysteresis === null ? '-' : e(c.hysteresis, ux),
        c.hysteresisPins === null ? '-' : e(c.hysteresisPins, 'V'),
        e(c.sinkMax, 'A'),
      ]),
      ['left', 'left', 'left', 'right', 'right', 'right', 'right', 'right'],
    ),
  );
  const s = a.supplyCurrent;
  out.push('', `Supply current: ${e(s.min, 'A')} at ${x(s.minAt)} (least) to ${e(s.max, 'A')} at ${x(s.maxAt)} (most)`);
  out.push('', a.findings.length ? `Findings (${a.findings.length})` : 'Findings: none');
  for (const f of a.findings) {
    const where = f.x === null ? '' : ` at ${x(f.x)}`;
    out.push(`  ${f.severity.toUpperCase().padEnd(7)} ${f.code} [${f.part}]${where}${f.amount ? `: ${f.amount}` : ''}`);
    out.push(`          ${f.message}`, `          Fix: ${f.fix}`);
  }
  return `${out.join('\n')}\n`;
}

function supplyText(d: Design, e: (v: number, u: string) => string): string {
  return d.supply.kind === 'measured' ? 'from the measured voltage' : `${e(d.supply.volts, 'V')} (${e(d.supply.min, 'V')} to ${e(d.supply.max, 'V')})`;
}

function referenceText(d: Design, e: (v: number, u: string) => string): string {
  const r = d.reference;
  if (r.kind === 'supply') return 'the supply (ratiometric)';
  if (r.kind === 'external') return `external ${e(r.volts, 'V')}`;
  return `shunt ${e(r.volts, 'V')} with ${formatRkm(r.bias)} bias`;
}

/** Version tag of the `check --json` document; bump on any incompatible change. */
export const CHECK_JSON_FORMAT = 'tapline-check/1';

/** The stable machine-readable `check --json` document. */
export function checkJson(design: Design, a: Analysis): object {
  return {
    format: CHECK_JSON_FORMAT,
    design: design.name,
    quantity: { name: design.quantity.name, unit: design.quantity.unit, min: design.quantity.min, max: design.quantity.max },
    channels: a.channels.map((c) => ({
      id: c.id,
      label: c.label,
      package: c.package,
      channel: c.channel,
      rising: c.rising,
      falling: c.falling,
      risingTo: c.risingTo,
      hysteresis: c.hysteresis,
      hysteresisPins: c.hysteresisPins,
      sinkMax: c.sinkMax,
      ledCurrentMax: c.ledCurrentMax,
    })),
    taps: a.taps,
    supplyCurrent: a.supplyCurrent,
    dissipation: a.dissipation,
    chatter: a.chatter,
    findings: a.findings,
  };
}
