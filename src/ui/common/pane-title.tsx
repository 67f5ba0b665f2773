import { Text } from 'ink';
import type { Theme } from '../theme';

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
