import { Box } from 'ink';
import type { Analysis } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import type { Seg } from '../common/line';
import { PaneText } from '../common/pane-title';
import { fmtX, right } from '../format';
import { scrollStart } from '../layout';
import { type Cell, columnOf, sweepCells } from '../state/sweep-cells';
import type { Theme } from '../theme';

/** Props of SweepPane. */
export interface SweepPaneProps {
  design: Design;
  analysis: Analysis;
  probeX: number;
  selectedChannel: string | undefined;
  width: number;
  height: number;
  theme: Theme;
}

/** Width of the channel-id column of the chart. */
export function sweepLabelWidth(d: Design): number {
  return Math.max(2, ...d.channels.map((c) => c.id.length)) + 1;
}

/** Columns of x the chart has for a pane `width` wide. */
export function sweepPlotWidth(d: Design, width: number): number {
  return Math.max(10, width - sweepLabelWidth(d));
}

/**
 * The sweep pane: x across, one row per channel; each cell shows whether the output is asserted
 * on the rising sweep, the falling sweep, both or neither, so hysteresis bands read as half cells.
 * The probe column is shown inverted and marked under the axis.
 */
export function SweepPane({ design, analysis, probeX, selectedChannel, width, height, theme }: SweepPaneProps) {
  const g = theme.glyphs;
  const q = design.quantity;
  const labelW = sweepLabelWidth(design);
  const plotW = sweepPlotWidth(design, width);
  const cells = sweepCells(analysis, plotW, q.min, q.max);
  const cursor = columnOf(probeX, plotW, q.min, q.max);
  const glyph: Record<Cell, string> = { both: g.cellBoth, up: g.cellUp, down: g.cellDown, off: g.cellOff, chatter: g.cellChatter };
  const rowsFree = Math.max(1, height - 2);
  const ids = analysis.channels.map((c) => c.id);
  const start = scrollStart(Math.max(0, ids.indexOf(selectedChannel ?? '')), ids.length, rowsFree);
  const shown = ids.slice(start, start + rowsFree);
  const lo = fmtX(q.min, design, theme.isAscii);
  const hi = fmtX(q.max, design, theme.isAscii);
  const axis = [...' '.repeat(plotW)];
  axis[cursor] = g.cursor;
  const axisText = axis.join('');
  const legend = `${g.cellBoth} on ${g.cellUp} rising ${g.cellDown} falling`;
  const lines = shown.map((id): Seg[] => {
    const row = cells[id];
    const text = row.map((c) => glyph[c]).join('');
    return [
      { text: right(`${id} `, labelW), style: id === selectedChannel ? theme.title(false) : theme.muted() },
      { text: text.slice(0, cursor), style: theme.on() },
      { text: glyph[row[cursor]], style: { ...theme.on(), inverse: true } },
      { text: text.slice(cursor + 1), style: theme.on() },
    ];
  });
  lines.push([{ text: ' '.repeat(labelW) }, { text: axisText, style: theme.title(false) }]);
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'Sweep', note: `${lo}..${hi}  ${legend}`, isFocused: false, width, theme }} rows={lines} />
    </Box>
  );
}
