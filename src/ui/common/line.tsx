import { Box, Text } from 'ink';
import type { ReactNode } from 'react';
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

/** Whether two styles draw the same (a key left out counts as off). */
function sameStyle(a: TextStyle | undefined, b: TextStyle | undefined): boolean {
  if (a === b) return true;
  const differs = (x: TextStyle | undefined, y: TextStyle | undefined) =>
    !!x && (Object.keys(x) as (keyof TextStyle)[]).some((k) => (x[k] || undefined) !== (y?.[k] || undefined));
  return !differs(a, b) && !differs(b, a);
}

/** Joins neighbouring segments of the same style: fewer text nodes make each frame cheaper to draw. */
export function mergeSegs(segs: Seg[]): Seg[] {
  const out: Seg[] = [];
  for (const s of segs) {
    const last = out[out.length - 1];
    if (last && sameStyle(last.style, s.style)) out[out.length - 1] = { ...last, text: last.text + s.text };
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

/** A style that changes nothing (no key set): such runs need no text node of their own. */
function isPlain(style: TextStyle | undefined): boolean {
  return !style || !Object.values(style).some(Boolean);
}

/**
 * Characters that may take two cells or none (wide East Asian forms, emoji, combining marks): with
 * them, counting code points is not counting cells, so each line needs Ink's own cut.
 */
const MAYBE_NOT_ONE_CELL = /[^\u0020-\u02FF\u0370-\u10FF\u2010-\u22FF\u2500-\u25FC]/u;

/** Props of Lines. */
export interface LinesProps {
  /** One entry per screen line. */
  rows: Seg[][];
  /** Cells available; text beyond is cut so a line never wraps and shifts the panes below. */
  width: number;
}

/**
 * Screen lines drawn as ONE text node: unstyled runs stay bare strings and only styled runs get a
 * nested <Text>. It looks the same as a column of <Line>s but leaves React and Ink far fewer nodes
 * to build, lay out and squash on every frame.
 */
export function Lines({ rows, width }: LinesProps) {
  const cut = rows.map((segs) => mergeSegs(cutSegs(segs, width)));
  if (cut.some((segs) => segs.some((s) => MAYBE_NOT_ONE_CELL.test(s.text)))) {
    return <Box flexDirection="column">{rows.map((segs, k) => <Line key={k} width={width} segs={segs} />)}</Box>;
  }
  const children: ReactNode[] = [];
  let plain = '';
  cut.forEach((segs, r) => {
    if (r > 0) plain += '\n';
    if (segs.every((s) => s.text === '')) plain += ' ';
    for (const s of segs) {
      if (isPlain(s.style)) plain += s.text;
      else if (s.text !== '') {
        if (plain) children.push(plain);
        plain = '';
        children.push(<Text key={children.length} {...s.style}>{s.text}</Text>);
      }
    }
  });
  if (plain) children.push(plain);
  return <Text wrap="truncate-end">{children}</Text>;
}
