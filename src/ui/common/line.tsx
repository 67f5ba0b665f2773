import { Text } from 'ink';
import type { TextStyle } from '../theme';

/** A run of text with one style. */
export interface Seg {
  text: string;
  style?: TextStyle;
}

/** Props of Line. */
export interface LineProps {
  segs: Seg[];
  /** Cells available; text beyond is cut so a line never wraps and shifts the panes below. */
  width: number;
}

/** Cuts segments to `width` cells in total. */
export function cutSegs(segs: Seg[], width: number): Seg[] {
  const out: Seg[] = [];
  let left = width;
  for (const s of segs) {
    if (left <= 0) break;
    const chars = [...s.text];
    out.push(chars.length <= left ? s : { ...s, text: chars.slice(0, left).join('') });
    left -= Math.min(left, chars.length);
  }
  return out;
}

/** Joins neighbouring segments of the same style: fewer text nodes make each frame cheaper to draw. */
export function mergeSegs(segs: Seg[]): Seg[] {
  const out: Seg[] = [];
  for (const s of segs) {
    const last = out[out.length - 1];
    if (last && JSON.stringify(last.style ?? {}) === JSON.stringify(s.style ?? {})) out[out.length - 1] = { ...last, text: last.text + s.text };
    else out.push(s);
  }
  return out;
}

/** One screen line made of styled segments, never wider than `width`. */
export function Line({ segs, width }: LineProps) {
  const cut = mergeSegs(cutSegs(segs, width));
  return (
    <Text wrap="truncate-end">
      {cut.every((s) => s.text === '') ? ' ' : cut.map((s, k) => <Text key={k} {...s.style}>{s.text}</Text>)}
    </Text>
  );
}
