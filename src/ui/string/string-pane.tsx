import { Box } from 'ink';
import type { ProbeResult } from '../../engine/analysis-types';
import type { Design } from '../../engine/design/types';
import { PaneText } from '../common/pane-title';
import type { Field } from '../state/fields';
import { scrollStart } from '../layout';
import type { Theme } from '../theme';
import { stringLines } from './string-lines';

/** Props of StringPane. */
export interface StringPaneProps {
  design: Design;
  fields: Field[];
  /** Id of the selected field of this pane. */
  selectedId: string | undefined;
  probe: ProbeResult | null;
  isFocused: boolean;
  width: number;
  /** Height in rows including the title. */
  height: number;
  theme: Theme;
}

/** The string pane: the ladder as wired, with values and tap voltages at the probe. */
export function StringPane({ design, fields, selectedId, probe, isFocused, width, height, theme }: StringPaneProps) {
  const lines = stringLines(design, fields, probe, theme.glyphs, theme.isAscii);
  const visible = Math.max(1, height - 1);
  const at = lines.findIndex((l) => selectedId !== undefined && l.fieldIds.includes(selectedId));
  const start = scrollStart(Math.max(0, at), lines.length, visible);
  const shown = lines.slice(start, start + visible);
  const note = lines.length > visible ? `${start + 1}-${start + shown.length}/${lines.length}` : undefined;
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneText width={width} title={{ title: 'String', note, isFocused, width, theme }} rows={shown.map((l) => l.segs.map((s) => ({
        text: s.text,
        style: s.fieldId && s.fieldId === selectedId ? theme.selected(isFocused) : s.isMuted ? theme.muted() : undefined,
      })))} />
    </Box>
  );
}
