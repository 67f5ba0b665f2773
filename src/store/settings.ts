import Conf from 'conf';
import { BUILTIN_PARTS } from '../engine/parts';
import { parseSeriesName } from '../engine/series';
import type { SeriesName } from '../engine/design/types';
import { configDir } from './config-dir';

/** Preferences that outlive a session. */
export interface Settings {
  /** Resistor series new plans snap to. */
  series: SeriesName;
  /** Resistor tolerance new plans assume (relative, 0.01 = 1 %). */
  tolerance: number;
  /** Comparator part class id new plans start from. */
  partClass: string;
  /** Draw with plain ASCII only (no box-drawing, block or arrow characters). */
  ascii: boolean;
  /** Recently opened or saved design files, newest first (absolute paths). */
  recent: string[];
}

/** Settings a fresh install starts with. */
export const DEFAULT_SETTINGS: Settings = { series: 'E96', tolerance: 0.01, partClass: 'bipolar-oc-quad', ascii: false, recent: [] };

/** How many recent files are remembered. */
export const RECENT_LIMIT = 10;

/** Reading and updating the persisted settings. */
export interface SettingsStore {
  /** The current settings; a hand-edited file with bad values falls back to defaults field by field. */
  get(): Settings;
  /** Merges `patch` in, writes it, and returns the result. */
  set(patch: Partial<Settings>): Settings;
  /** Puts `path` (absolute) at the front of the recent files and returns the result. */
  addRecent(path: string): Settings;
  /** Where the settings file lives. */
  readonly path: string;
}

/** Keeps only valid fields of stored settings; anything else takes its default. */
export function sanitizeSettings(raw: unknown): Settings {
  const r = (raw && typeof raw === 'object' ? raw : {}) as Record<string, unknown>;
  const series = typeof r.series === 'string' ? parseSeriesName(r.series) : null;
  const tol = typeof r.tolerance === 'number' && r.tolerance > 0 && r.tolerance < 0.5 ? r.tolerance : null;
  const part = typeof r.partClass === 'string' && Object.hasOwn(BUILTIN_PARTS, r.partClass) ? r.partClass : null;
  const recent = Array.isArray(r.recent) ? r.recent.filter((p): p is string => typeof p === 'string').slice(0, RECENT_LIMIT) : [];
  return {
    series: series ?? DEFAULT_SETTINGS.series,
    tolerance: tol ?? DEFAULT_SETTINGS.tolerance,
    partClass: part ?? DEFAULT_SETTINGS.partClass,
    ascii: typeof r.ascii === 'boolean' ? r.ascii : DEFAULT_SETTINGS.ascii,
    recent,
  };
}

/**
 * Opens the settings store (conf, file `settings.json`) in `$XDG_CONFIG_HOME/tapline` when set.
 * Never throws on a corrupt file: conf starts over with defaults.
 */
export function openSettings(env: Record<string, string | undefined>): SettingsStore {
  const conf = new Conf<Record<string, unknown>>({
    projectName: 'tapline', projectSuffix: '', cwd: configDir(env), configName: 'settings', clearInvalidConfig: true,
  });
  const get = () => sanitizeSettings(conf.store);
  const set = (patch: Partial<Settings>) => {
    const next = sanitizeSettings({ ...get(), ...patch });
    conf.store = { ...next };
    return next;
  };
  return {
    get,
    set,
    addRecent: (path) => set({ recent: [path, ...get().recent.filter((p) => p !== path)].slice(0, RECENT_LIMIT) }),
    path: conf.path,
  };
}
