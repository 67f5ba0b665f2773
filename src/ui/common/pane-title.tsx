import { Text } from 'ink';
import type { Theme } from '../theme';
import { Lines, type Seg } from './line';

/** Props of PaneTitle. */
export interface PaneTitleProps {
  title: string;
  /** Extra words after the title (units, legend, counts). */
  note?: string;
  /** The pane keys act on: marked with the focus glyph as well as by style, so it reads without colour. */
  isFocused: boolean;
  width: number;
  theme: Theme;
}

/**
 * The title line as segments: focus mark and title, note, then a rule to the width. Null when even
 * the title does not fit, which only Ink's own cut (with its ellipsis) draws as before.
 */
export function titleSegs({ title, note, isFocused, width, theme }: PaneTitleProps): Seg[] | null {
  const g = theme.glyphs;
  const mark = isFocused ? `${g.focus} ` : '  ';
  const head = `${mark}${title}`;
  const headLength = [...head].length;
  if (headLength > width) return null;
  const tail = note ? ` ${note} ` : ' ';
  const used = headLength + [...tail].length;
  const rule = g.rule.repeat(Math.max(0, width - used));
  const noteText = [...tail].slice(0, Math.max(0, width - headLength)).join('');
  return [{ text: head, style: theme.title(isFocused) }, { text: noteText, style: theme.muted() }, { text: rule }];
}

/** A pane's title line: focus mark, title, note, then a rule to the width. */
export function PaneTitle({ title, note, isFocused, width, theme }: PaneTitleProps) {
  const g = theme.glyphs;
  const mark = isFocused ? `${g.focus} ` : '  ';
  const head = `${mark}${title}`;
  const tail = note ? ` ${note} ` : ' ';
  const used = [...head].length + [...tail].length;
  const rule = g.rule.repeat(Math.max(0, width - used));
  const noteText = [...tail].slice(0, Math.max(0, width - [...head].length)).join('');
  return (
    <Text wrap="truncate-end">
      <Text {...theme.title(isFocused)}>{head}</Text>
      <Text {...theme.muted()}>{noteText}</Text>
      {rule}
    </Text>
  );
}

/** Props of PaneText. */
export interface PaneTextProps {
  title: PaneTitleProps;
  /** The lines under the title. */
  rows: Seg[][];
  width: number;
}

/** A pane's title and lines as one text node where the title fits (see Lines). */
export function PaneText({ title, rows, width }: PaneTextProps) {
  const head = titleSegs(title);
  if (head) return <Lines width={width} rows={[head, ...rows]} />;
  return (
    <>
      <PaneTitle {...title} />
      <Lines width={width} rows={rows} />
    </>
  );
}
