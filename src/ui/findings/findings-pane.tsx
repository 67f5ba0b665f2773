import { Box } from 'ink';
import type { Finding } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import type { Seg } from '../common/line';
import { PaneText } from '../common/pane-title';
import type { SpreadStatus } from '../state/app-state';
import type { Theme } from '../theme';
import { type FindingLine, findingLines } from './findings-lines';
import { type FindingRow, findingsView, TAG_W } from './findings-rows';

/** Props of FindingsPane. */
export interface FindingsPaneProps {
  design: Design;
  findings: Finding[];
  spread: SpreadStatus;
  /** Selected stop (an entry, or a further pane-full of a tall entry) when focused. */
  selected: number;
  isFocused: boolean;
  width: number;
  height: number;
  theme: Theme;
}

const TAGS: Record<FindingLine['tag'], string> = { error: 'ERR ', warning: 'WARN', info: 'info', caution: 'CARE', spread: 'sprd' };

function tagStyle(tag: FindingLine['tag'], theme: Theme) {
  return tag === 'error' || tag === 'warning' || tag === 'info' ? theme.severity(tag) : tag === 'caution' ? theme.severity('warning') : theme.muted();
}

function rowSegs(r: FindingRow, isSelected: boolean, theme: Theme): Seg[] {
  if (r.part === 'note') return [{ text: r.text, style: r.key === 'none' ? theme.ok() : theme.muted() }];
  const head: Seg = r.tag ? { text: `${TAGS[r.tag]} `, style: tagStyle(r.tag, theme) } : { text: ' '.repeat(TAG_W) };
  const style = r.part === 'detail' ? theme.muted() : isSelected ? theme.selected(true) : undefined;
  return [head, { text: r.text, style }];
}

/** The findings pane: checks, cautions and spread, wrapped so no caution is ever cut; focused, it reads them one by one with their fixes. */
export function FindingsPane({ design, findings, spread, selected, isFocused, width, height, theme }: FindingsPaneProps) {
  const lines = findingLines(findings, design, spread, theme.isAscii);
  const errors = findings.filter((f) => f.severity === 'error').length;
  const warnings = findings.filter((f) => f.severity === 'warning').length;
  const note = `${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}`;
  const view = findingsView(lines, { isClean: findings.length === 0, selected, isFocused, width, visible: Math.max(1, height - 1), isWide: width >= 100 });
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'Findings', note: view.position ? `${note} ${view.position}` : note, isFocused, width, theme }} rows={view.rows.map((r) => rowSegs(r, r.entry === view.selectedEntry && r.part === 'text', theme))} />
    </Box>
  );
}
