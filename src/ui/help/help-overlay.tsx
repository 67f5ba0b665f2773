import { Box } from 'ink';
import { Line } from '../common/line';
import { PaneTitle } from '../common/pane-title';
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

/** Number of lines the help has, for scrolling. */
export function helpLength(ctx: KeyContext, ascii: boolean): number {
  return helpLines(ctx, ascii).reduce((n, l) => n + (l.kind === 'binding' && l.why ? 2 : 1), 0);
}

/** The help overlay: every key, grouped by where it applies, with why a key is off right now. */
export function HelpOverlay({ ctx, top, width, height, theme }: HelpOverlayProps) {
  const lines = helpLines(ctx, theme.isAscii).flatMap((l) => (l.kind === 'binding' && l.why
    ? [{ ...l, why: null, isOff: true }, { kind: 'binding' as const, keys: '', text: `off now: ${l.why}`, why: null, isOff: true }]
    : [{ ...l, isOff: false }]));
  const visible = Math.max(1, height - 1);
  const start = Math.min(top, Math.max(0, lines.length - visible));
  const keyW = 14;
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
