import { Box } from 'ink';
import type { ChannelResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import type { Seg } from '../common/line';
import { PaneText } from '../common/pane-title';
import { fit, right } from '../format';
import { scrollStart } from '../layout';
import type { TargetMatch } from '../state/target-match';
import type { Theme } from '../theme';
import { allColumns, type Column, fitColumns } from './channel-table';

/** Props of ChannelsPane. */
export interface ChannelsPaneProps {
  design: Design;
  channels: ChannelResult[];
  targets: Record<string, TargetMatch>;
  selectedId: string | undefined;
  /** Channel whose row holds the selected field (kept visible). */
  selectedChannel: string | undefined;
  isFocused: boolean;
  width: number;
  height: number;
  isWide: boolean;
  theme: Theme;
}

function cellSegs(col: Column, c: ChannelResult, selectedId: string | undefined, isFocused: boolean, theme: Theme): Seg[] {
  const parts = col.cell(c);
  const text = parts.map((p) => p.text).join('');
  const padded = col.align === 'right' ? right(text, col.width) : fit(text, col.width, theme.glyphs.more);
  if (padded.length !== text.length || !parts.some((p) => p.fieldId)) {
    const isSel = parts.some((p) => p.fieldId && p.fieldId === selectedId);
    return [{ text: padded, style: isSel ? theme.selected(isFocused) : undefined }];
  }
  return parts.map((p) => ({ text: p.text, style: p.fieldId && p.fieldId === selectedId ? theme.selected(isFocused) : undefined }));
}

/** The channels pane: one row per channel with trip points, hysteresis, target, feedback, load and sink current. */
export function ChannelsPane(props: ChannelsPaneProps) {
  const { design, channels, targets, selectedId, selectedChannel, isFocused, width, height, isWide, theme } = props;
  const cols = fitColumns(allColumns({ design, channels, targets, ascii: theme.isAscii, hasUnits: isWide }), width);
  const visible = Math.max(1, height - 2);
  const at = Math.max(0, channels.findIndex((c) => c.id === selectedChannel));
  const start = scrollStart(at, channels.length, visible);
  const rows = channels.slice(start, start + visible);
  const unitNote = isWide ? '' : `x in ${design.quantity.unit}, sink in A`;
  const more = channels.length > visible ? ` ${start + 1}-${start + rows.length}/${channels.length}` : '';
  const head: Seg[] = [{ text: ' ' }, ...cols.map((c) => ({ text: `${c.align === 'right' ? right(c.head, c.width) : fit(c.head, c.width)} `, style: theme.muted() }))];
  const lines = rows.map((c) => {
    const mark = c.id === selectedChannel && isFocused ? theme.glyphs.focus.slice(0, 1) : ' ';
    const segs: Seg[] = [{ text: mark }];
    for (const col of cols) segs.push(...cellSegs(col, c, selectedId, isFocused, theme), { text: ' ' });
    return segs;
  });
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'Channels', note: `${unitNote}${more}`.trim() || undefined, isFocused, width, theme }} rows={[head, ...lines]} />
    </Box>
  );
}
