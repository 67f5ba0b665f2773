/**
 * The channels table as data: which columns fit the width, and each row's cells (some of them
 * editable fields). Pure, so the choice of columns per width is tested without rendering.
 */
import type { ChannelResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { formatBare, formatEng } from '../../engine/values';
import { fmtA, fmtDx, fmtOhm, fmtX } from '../format';
import type { TargetMatch } from '../state/target-match';

/** A cell: text pieces, each possibly the shown value of a field. */
export type Cell = { text: string; fieldId?: string }[];

/** One column. */
export interface Column {
  key: string;
  head: string;
  width: number;
  /** Lower numbers are dropped first when the width is short. */
  priority: number;
  align: 'left' | 'right';
  /** Takes the width left over (at least `width`). */
  isFlexible?: boolean;
  cell(c: ChannelResult): Cell;
}

/** Inputs for building the columns. */
export interface TableInput {
  design: Design;
  channels: ChannelResult[];
  targets: Record<string, TargetMatch>;
  ascii: boolean;
  /** Show units in every cell (wide screens) rather than once in the title. */
  hasUnits: boolean;
}

const t = (text: string): Cell => [{ text }];

function xText(x: number | null | undefined, inp: TableInput, digits = 4): string {
  if (x === null || x === undefined) return inp.ascii ? '-' : '—';
  return inp.hasUnits ? fmtX(x, inp.design, inp.ascii, digits) : formatBare(x, inp.design.quantity.unit, { digits, ascii: inp.ascii });
}

function loadCell(d: Design, id: string): Cell {
  const ch = d.channels.find((c) => c.id === id);
  if (!ch) return t('');
  if (ch.led) return [{ text: 'LED ' }, { text: fmtOhm(ch.led.ohms), fieldId: `ch.${id}.led` }];
  if (ch.pullup) return [{ text: 'pu ' }, { text: fmtOhm(ch.pullup.ohms), fieldId: `ch.${id}.pullup` }];
  return t(ch.wiredTo ? `= ${ch.wiredTo}` : 'open');
}

/** Every column that could be shown, before fitting. */
export function allColumns(inp: TableInput): Column[] {
  const d = inp.design;
  const chan = (id: string) => d.channels.find((c) => c.id === id);
  const idWidth = Math.max(2, ...d.channels.map((c) => c.id.length));
  const xw = inp.hasUnits ? 8 : 6;
  const cols: Column[] = [
    { key: 'id', head: 'ch', width: idWidth, priority: 100, align: 'left', cell: (c) => t(c.id) },
    { key: 'pk', head: 'pk', width: 3, priority: 60, align: 'left', cell: (c) => t(`${c.package}.${c.channel}`) },
    { key: 'fn', head: 'function', width: 8, priority: 40, align: 'left', isFlexible: true, cell: (c) => t(c.label) },
    { key: 'rise', head: 'rise', width: xw, priority: 95, align: 'right', cell: (c) => t(xText(c.rising?.x, inp)) },
    { key: 'fall', head: 'fall', width: xw, priority: 94, align: 'right', cell: (c) => t(xText(c.falling?.x, inp)) },
    { key: 'hyst', head: 'hyst', width: inp.hasUnits ? 8 : 6, priority: 90, align: 'right', cell: (c) => t(xText(c.hysteresis, inp, 3)) },
  ];
  if (Object.keys(inp.targets).length > 0) {
    cols.push(
      { key: 'target', head: 'target', width: xw, priority: 70, align: 'right', cell: (c) => t(inp.targets[c.id] ? xText(inp.targets[c.id].target.x, inp) : '') },
      { key: 'error', head: 'off by', width: inp.hasUnits ? 9 : 7, priority: 75, align: 'right',
        cell: (c) => t(inp.targets[c.id] ? (inp.hasUnits ? fmtDx(inp.targets[c.id].error, d, inp.ascii) : signed(inp.targets[c.id].error, d.quantity.unit, inp.ascii)) : '') },
    );
  }
  cols.push(
    { key: 'fb', head: 'fdbk', width: 5, priority: 85, align: 'right',
      cell: (c) => { const f = chan(c.id)?.feedback; return f ? [{ text: fmtOhm(f.ohms), fieldId: `ch.${c.id}.feedback` }] : t(''); } },
    { key: 'load', head: 'load', width: 9, priority: 80, align: 'left', cell: (c) => loadCell(d, c.id) },
    { key: 'sink', head: 'sink', width: inp.hasUnits ? 8 : 6, priority: 65, align: 'right',
      cell: (c) => t(inp.hasUnits ? fmtA(c.sinkMax, inp.ascii) : c.sinkMax < 1e-12 ? '0' : formatEng(c.sinkMax, '', { digits: 3, ascii: inp.ascii })) },
  );
  if (d.channels.some((c) => c.led && c.pullup)) {
    cols.push({ key: 'pu', head: 'pull-up', width: 7, priority: 50, align: 'right',
      cell: (c) => { const p = chan(c.id)?.pullup; return p && chan(c.id)?.led ? [{ text: fmtOhm(p.ohms), fieldId: `ch.${c.id}.pullup` }] : t(''); } });
  }
  if (d.channels.some((c) => c.seriesPlus !== undefined || c.seriesMinus !== undefined)) {
    cols.push({ key: 'ser', head: 'in R', width: 11, priority: 55, align: 'left', cell: (c) => {
      const ch = chan(c.id);
      const out: Cell = [];
      if (ch?.seriesPlus !== undefined) out.push({ text: '+' }, { text: fmtOhm(ch.seriesPlus), fieldId: `ch.${c.id}.seriesPlus` });
      if (ch?.seriesMinus !== undefined) out.push({ text: out.length ? ' -' : '-' }, { text: fmtOhm(ch.seriesMinus), fieldId: `ch.${c.id}.seriesMinus` });
      return out;
    } });
  }
  return cols;
}

function signed(v: number, unit: string, ascii: boolean): string {
  const s = formatBare(v, unit, { digits: 2, ascii });
  return v > 0 ? `+${s}` : s;
}

/** The columns that fit in `width` cells (one space between columns, one for the row mark), flexible ones widened. */
export function fitColumns(cols: Column[], width: number): Column[] {
  const need = (cs: Column[]) => 1 + cs.reduce((n, c) => n + c.width + 1, 0);
  let kept = [...cols];
  while (kept.length > 1 && need(kept) > width) {
    const low = kept.reduce((a, b) => (b.priority < a.priority ? b : a));
    kept = kept.filter((c) => c !== low);
  }
  const spare = width - need(kept);
  const flex = kept.find((c) => c.isFlexible);
  return flex && spare > 0 ? kept.map((c) => (c === flex ? { ...c, width: c.width + spare } : c)) : kept;
}
