import { Box } from 'ink';
import type { ChannelResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { PaneText } from '../common/pane-title';
import { fit, fmtDx, fmtX } from '../format';
import { scrollStart } from '../layout';
import { fieldText } from '../state/app-reducer';
import type { Field } from '../state/fields';
import type { TargetMatch } from '../state/target-match';
import type { Theme } from '../theme';

/** Props of TargetsPane. */
export interface TargetsPaneProps {
  design: Design;
  fields: Field[];
  channels: ChannelResult[];
  matches: Record<string, TargetMatch>;
  selectedId: string | undefined;
  isFocused: boolean;
  /** Why re-planning is unavailable, or null when the plan key works. */
  planDisabled: string | null;
  width: number;
  height: number;
  theme: Theme;
}

/** The targets pane: each stated threshold and hysteresis, editable, with the channel that realises it. */
export function TargetsPane({ design, fields, matches, selectedId, isFocused, planDisabled, width, height, theme }: TargetsPaneProps) {
  const ascii = theme.isAscii;
  const realisedBy = new Map(Object.entries(matches).map(([ch, m]) => [`${m.target.functionId}|${m.target.label}`, { ch, m }]));
  const rows = fields.map((f) => {
    const labelW = Math.min(22, Math.max(10, width - 34));
    const value = fieldText(f, design);
    const fid = f.functionId ?? '';
    const point = f.role.startsWith('t') && f.role !== 'threshold' ? `${fid} step ${Number(f.role.slice(1)) + 1}` : f.role === 'threshold' ? fid : `${fid} ${f.role}`;
    const hit = realisedBy.get(`${fid}|${point}`);
    const realised = f.role === 'hysteresis' ? '' : hit ? `${hit.ch} ${fmtX(hit.m.realised, design, ascii)} (${fmtDx(hit.m.error, design, ascii)})` : 'no channel';
    return { id: f.id, segs: [
      { text: fit(` ${f.label}`, labelW) },
      { text: value, style: f.id === selectedId ? theme.selected(isFocused) : undefined },
      { text: `  ${realised}`, style: theme.muted() },
    ] };
  });
  const visible = Math.max(1, height - 1);
  const at = Math.max(0, rows.findIndex((r) => r.id === selectedId));
  const start = scrollStart(at, rows.length, visible);
  const note = planDisabled ? `plan: ${planDisabled}` : 'p re-plans';
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'Targets', note, isFocused, width, theme }} rows={rows.length === 0 ? [[{ text: 'this design states no targets', style: theme.muted() }]] : rows.slice(start, start + visible).map((r) => r.segs)} />
    </Box>
  );
}
