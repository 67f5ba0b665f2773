/** The rows of the settings overlay and how each one changes. Pure. */
import type { SeriesName } from '../../engine/design/types';
import { BUILTIN_PARTS } from '../../engine/parts';
import type { Settings } from '../../store/settings';
import { cycleSeries } from '../state/fields';

/** One setting row. */
export interface SettingRow {
  key: 'series' | 'tolerance' | 'partClass' | 'ascii' | 'recent';
  label: string;
  value: string;
  /** The settings with this row moved one choice forward (+1) or back (-1); null when it has no choices. */
  change(s: Settings, delta: number): Partial<Settings> | null;
}

/** Tolerance choices offered (relative). */
export const TOLERANCES = [0.001, 0.005, 0.01, 0.02, 0.05, 0.1];

function cycle<T>(list: readonly T[], cur: T, delta: number): T {
  const k = Math.max(0, list.indexOf(cur));
  return list[(((k + delta) % list.length) + list.length) % list.length];
}

/** Rows for the current settings. */
export function settingRows(s: Settings): SettingRow[] {
  const parts = Object.keys(BUILTIN_PARTS);
  return [
    { key: 'series', label: 'default series for plans', value: s.series, change: (c, d) => ({ series: cycleSeries(c.series, d) as SeriesName }) },
    { key: 'tolerance', label: 'default resistor tolerance', value: `${+(s.tolerance * 100).toPrecision(3)} %`, change: (c, d) => ({ tolerance: cycle(TOLERANCES, c.tolerance, d) }) },
    { key: 'partClass', label: 'default part class', value: s.partClass, change: (c, d) => ({ partClass: cycle(parts, c.partClass, d) }) },
    { key: 'ascii', label: 'ASCII-only drawing', value: s.ascii ? 'on' : 'off', change: (c) => ({ ascii: !c.ascii }) },
    { key: 'recent', label: 'recent files', value: s.recent.length ? `${s.recent.length} (change clears)` : 'none', change: () => ({ recent: [] }) },
  ];
}
