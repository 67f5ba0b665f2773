import { Box } from 'ink';
import type { Finding } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { Line, type Seg } from '../common/line';
import { PaneTitle } from '../common/pane-title';
import { scrollStart } from '../layout';
import type { SpreadStatus } from '../state/app-state';
import type { Theme } from '../theme';
import { findingLines, type FindingLine } from './findings-lines';

/** Props of FindingsPane. */
export interface FindingsPaneProps {
  design: Design;
  findings: Finding[];
  spread: SpreadStatus;
  /** Selected entry (its fix is shown under it). */
  selected: number;
  isFocused: boolean;
  width: number;
  height: number;
  theme: Theme;
}

const TAGS: Record<FindingLine['tag'], string> = { error: 'ERR ', warning: 'WARN', info: 'info', caution: 'CARE', spread: 'sprd' };

/** The findings pane: checks, cautions and spread, one line each; the selected one also shows what to do. */
export function FindingsPane({ design, findings, spread, selected, isFocused, width, height, theme }: FindingsPaneProps) {
  const lines = findingLines(findings, design, spread, theme.isAscii);
  const errors = findings.filter((f) => f.severity === 'error').length;
  const warnings = findings.filter((f) => f.severity === 'warning').length;
  const note = `${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}`;
  const sel = Math.min(selected, Math.max(0, lines.length - 1));
  const rows: { segs: Seg[]; key: string }[] = [];
  if (findings.length === 0) rows.push({ key: 'none', segs: [{ text: 'no findings: every check passes', style: theme.ok() }] });
  lines.forEach((l, k) => {
    const tagStyle = l.tag === 'error' || l.tag === 'warning' || l.tag === 'info' ? theme.severity(l.tag) : l.tag === 'caution' ? theme.severity('warning') : theme.muted();
    const isSel = isFocused && k === sel;
    rows.push({ key: `l${k}`, segs: [{ text: TAGS[l.tag], style: tagStyle }, { text: ` ${l.text}`, style: isSel ? theme.selected(true) : undefined }] });
    if (l.detail && (isSel || (width >= 100 && l.tag !== 'spread'))) rows.push({ key: `d${k}`, segs: [{ text: `     ${l.detail}`, style: theme.muted() }] });
  });
  const visible = Math.max(1, height - 1);
  const selRow = Math.max(0, rows.findIndex((r) => r.key === `l${sel}`));
  const start = scrollStart(selRow, rows.length, visible);
  const shown = rows.slice(start, start + visible);
  const more = rows.length > visible ? ` ${start + 1}-${start + shown.length}/${rows.length}` : '';
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneTitle title="Findings" note={`${note}${more}`} isFocused={isFocused} width={width} theme={theme} />
      {shown.map((r) => <Line key={r.key} width={width} segs={r.segs} />)}
    </Box>
  );
}
