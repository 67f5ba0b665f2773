import { Box } from 'ink';
import { Line } from '../common/line';
import { PaneTitle } from '../common/pane-title';
import { wrapWords } from '../common/wrap-words';
import { fit } from '../format';
import type { KeyContext } from '../keymap';
import type { Theme } from '../theme';
import { helpLines } from './help-lines';

/** Props of HelpOverlay. */
export interface HelpOverlayProps {
  ctx: KeyContext;
  /** First line shown (scroll position). */
  top: number;
  width: number;
  height: number;
  theme: Theme;
}

/** Cells of the keys column. */
const KEY_W = 14;

/** One screen row of the help. */
type HelpRow = { kind: 'heading'; text: string } | { kind: 'binding'; keys: string; text: string; isOff: boolean };

/** The help as screen rows `width` cells wide: long descriptions continue on the next row, never cut. */
export function helpRows(ctx: KeyContext, ascii: boolean, width: number): HelpRow[] {
  const textW = Math.max(10, width - KEY_W - 1);
  const rows: HelpRow[] = [];
  for (const l of helpLines(ctx, ascii)) {
    if (l.kind === 'heading') {
      rows.push(l);
      continue;
    }
    const isOff = !!l.why;
    wrapWords(l.text, textW).forEach((t, k) => rows.push({ kind: 'binding', keys: k === 0 ? l.keys : '', text: t, isOff }));
    if (l.why) wrapWords(`off now: ${l.why}`, textW).forEach((t) => rows.push({ kind: 'binding', keys: '', text: t, isOff }));
  }
  return rows;
}

/** Scroll positions the help has in a `width` x `height` overlay: the last one shows its last row. */
export function helpScrollCount(ctx: KeyContext, ascii: boolean, width: number, height: number): number {
  return Math.max(1, helpRows(ctx, ascii, width).length - Math.max(1, height - 1) + 1);
}

/** The help overlay: every key, grouped by where it applies, with why a key is off right now. */
export function HelpOverlay({ ctx, top, width, height, theme }: HelpOverlayProps) {
  const lines = helpRows(ctx, theme.isAscii, width);
  const visible = Math.max(1, height - 1);
  const start = Math.min(top, Math.max(0, lines.length - visible));
  const keyW = KEY_W;
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneTitle title="Keys" note={`${start + 1}-${Math.min(lines.length, start + visible)}/${lines.length}`} isFocused width={width} theme={theme} />
      {lines.slice(start, start + visible).map((l, k) => (l.kind === 'heading'
        ? <Line key={k} width={width} segs={[{ text: l.text, style: theme.title(false) }]} />
        : <Line key={k} width={width} segs={[
            { text: fit(`  ${l.keys}`, keyW), style: theme.key(!l.isOff) },
            { text: ` ${l.text}`, style: l.isOff ? theme.muted() : undefined },
          ]} />))}
    </Box>
  );
}
