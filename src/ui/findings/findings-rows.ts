/**
 * How the findings pane lays its entries out on screen rows. Pure. Every entry is wrapped, never cut,
 * so a caution is always readable in full: unfocused, the pane shows as many whole entries as fit and
 * says how many more there are; focused, Up/Down step through the entries, and through an entry taller
 * than the pane one pane-full at a time.
 */
import { wrapWords } from '../common/wrap-words';
import type { FindingLine } from './findings-lines';

/** Cells of the tag column ("CARE ") and of the indent of continued and detail rows. */
export const TAG_W = 5;

/** One screen row of the pane. */
export interface FindingRow {
  key: string;
  /** The entry it belongs to; -1 for the "no findings" and "more" notes. */
  entry: number;
  /** Set on an entry's first row: its tag is drawn before the text. */
  tag?: FindingLine['tag'];
  /** What the row says about its entry: the entry's own text, its detail (the fix), or a note. */
  part: 'text' | 'detail' | 'note';
  text: string;
}

/** What the pane shows: its rows, the position note for the title, and the entry to highlight. */
export interface FindingsView {
  rows: FindingRow[];
  /** "3-5/9" when not every row is shown, else "". */
  position: string;
  /** The highlighted entry, or -1. */
  selectedEntry: number;
}

/** Options of findingsView. */
export interface FindingsViewOptions {
  /** The engine found nothing: a "no findings" note is shown when it fits. */
  isClean: boolean;
  /** Stop index chosen with Up/Down (clamped here; the app state does not know the row count). */
  selected: number;
  isFocused: boolean;
  /** Pane width and rows below the title, in cells. */
  width: number;
  visible: number;
  /** Wide terminal: every entry but spread shows its detail even unfocused. */
  isWide: boolean;
}

const NONE = 'no findings: every check passes';

/** The rows of entry `k`, wrapped to `width` cells; its detail too when `withDetail`. */
export function entryRows(l: FindingLine, k: number, width: number, withDetail: boolean): FindingRow[] {
  const textW = Math.max(10, width - TAG_W);
  const rows: FindingRow[] = wrapWords(l.text, textW).map((t, j) => ({
    key: `l${k}.${j}`, entry: k, part: 'text' as const, text: t, ...(j === 0 ? { tag: l.tag } : {}),
  }));
  if (withDetail && l.detail) wrapWords(l.detail, textW).forEach((t, j) => rows.push({ key: `d${k}.${j}`, entry: k, part: 'detail', text: t }));
  return rows;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/** The note that stands for entries not shown; the longest wording that fits `width`. */
export function moreNote(hidden: FindingLine[], isFirst: boolean, width: number): string {
  const cautions = hidden.filter((l) => l.tag === 'caution').length;
  const count = isFirst ? plural(hidden.length, 'entry').replace('entrys', 'entries') : `+${hidden.length} more`;
  const what = cautions ? ` (${plural(cautions, 'caution')})` : '';
  const words = [`${count}${what}: Tab to Findings, Up/Down to read`, `${count}${what}: Tab, Up/Down`, `${count}${what}: Tab to read`, `${count}${what}`, count];
  return words.find((w) => [...w].length <= width) ?? count;
}

/** Unfocused: as many whole entries as fit, then a note naming how many more (and how many cautions). */
function summary(lines: FindingLine[], o: FindingsViewOptions): FindingsView {
  const blocks = lines.map((l, k) => entryRows(l, k, o.width, o.isWide && l.tag !== 'spread'));
  const total = blocks.reduce((n, b) => n + b.length, 0);
  const none: FindingRow = { key: 'none', entry: -1, part: 'note', text: NONE };
  if (total + (o.isClean ? 1 : 0) <= o.visible) return { rows: [...(o.isClean ? [none] : []), ...blocks.flat()], position: '', selectedEntry: -1 };
  const rows: FindingRow[] = [];
  let k = 0;
  while (k < blocks.length && rows.length + blocks[k].length <= o.visible - (k < blocks.length - 1 ? 1 : 0)) rows.push(...blocks[k++]);
  if (k < blocks.length) rows.push({ key: 'more', entry: -1, part: 'note', text: moreNote(lines.slice(k), k === 0, o.width) });
  return { rows: rows.slice(0, o.visible), position: '', selectedEntry: -1 };
}

/** Focused: every entry with its detail; the window starts at the selected stop (an entry, or a further pane-full of a tall one). */
function reader(lines: FindingLine[], o: FindingsViewOptions): FindingsView {
  const rows: FindingRow[] = [];
  const stops: { row: number; entry: number }[] = [];
  if (o.isClean) rows.push({ key: 'none', entry: -1, part: 'note', text: NONE });
  lines.forEach((l, k) => {
    const block = entryRows(l, k, o.width, true);
    for (let r = 0; r < block.length; r += o.visible) stops.push({ row: rows.length + r, entry: k });
    rows.push(...block);
  });
  if (stops.length === 0) return { rows, position: '', selectedEntry: -1 };
  // The note above the first entry shares its window when both fit.
  if (o.isClean && entryRows(lines[0], 0, o.width, true).length + 1 <= o.visible) stops[0].row = 0;
  const stop = stops[Math.min(Math.max(0, o.selected), stops.length - 1)];
  // The last windows do not leave the pane half empty.
  const start = Math.max(0, Math.min(stop.row, rows.length - o.visible));
  const shown = rows.slice(start, start + o.visible);
  const position = rows.length > o.visible ? `${start + 1}-${start + shown.length}/${rows.length}` : '';
  return { rows: shown, position, selectedEntry: stop.entry };
}

/** The rows the findings pane shows for `lines` under `o`. */
export function findingsView(lines: FindingLine[], o: FindingsViewOptions): FindingsView {
  return o.isFocused ? reader(lines, o) : summary(lines, o);
}
