import { Box } from 'ink';
import type { Settings } from '../../store/settings';
import { Line } from '../common/line';
import { PaneTitle } from '../common/pane-title';
import { fit } from '../format';
import type { Theme } from '../theme';
import { settingRows } from './settings-rows';

/** Props of SettingsOverlay. */
export interface SettingsOverlayProps {
  settings: Settings;
  selected: number;
  /** Where they are stored, shown so the user can find the file. */
  path: string;
  width: number;
  height: number;
  theme: Theme;
}

/** The settings overlay: each setting with its value; changes are saved at once. */
export function SettingsOverlay({ settings, selected, path, width, height, theme }: SettingsOverlayProps) {
  const rows = settingRows(settings);
  return (
    <Box flexDirection="column" width={width} height={height}>
      <PaneTitle title="Settings" note="saved as you change them" isFocused width={width} theme={theme} />
      {rows.map((r, k) => (
        <Line key={r.key} width={width} segs={[{ text: fit(`  ${r.label}`, 30) }, { text: r.value, style: k === selected ? theme.selected(true) : undefined }]} />
      ))}
      <Line width={width} segs={[{ text: '' }]} />
      {settings.recent.slice(0, Math.max(0, height - rows.length - 4)).map((p, k) => <Line key={p} width={width} segs={[{ text: `  ${k + 1}. ${p}`, style: theme.muted() }]} />)}
      <Line width={width} segs={[{ text: `  file: ${path}`, style: theme.muted() }]} />
    </Box>
  );
}
