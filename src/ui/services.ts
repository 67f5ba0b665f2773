/**
 * What the screen needs from outside the UI: the stores, the clock, file reading and writing, and the
 * optional capabilities (planner, spread, export). Injected so tests run the whole app in memory.
 */
import type { Design } from '../engine/design/types';
import type { ExportFormat } from '../engine/export/export-text';
import type { SpreadReport } from '../engine/spread';
import type { DraftStore } from '../store/drafts';
import type { PresetInfo } from '../store/presets';
import type { ReadResult } from '../store/files';
import type { SettingsStore } from '../store/settings';
import type { SpreadSummary } from './state/app-state';

/** Outcome of re-planning a design from its targets. */
export type PlanOutcome = { ok: true; design: Design; summary: string } | { ok: false; message: string };

/** A running spread analysis: progress through `onProgress`, cancel with `cancel`. */
export interface SpreadJob {
  /** Resolves with the summary, or null when cancelled. */
  result: Promise<SpreadSummary | null>;
  cancel(): void;
}

/** Services the app uses. */
export interface Services {
  settings: SettingsStore;
  drafts: DraftStore;
  /** The clock (ms since the epoch), read here only. */
  now(): number;
  /** Folder relative paths resolve against. */
  cwd: string;
  readDesign(path: string): Promise<ReadResult>;
  /** Writes the design file atomically (temporary file, then rename). */
  writeDesign(path: string, design: Design): Promise<void>;
  fileExists(path: string): boolean;
  /** The built-in example designs the open prompt offers; absent when the build has none. */
  presets?: () => Promise<PresetInfo[]>;
  /** Re-plans from targets; absent until the planner is part of the build. */
  plan?: (design: Design) => PlanOutcome;
  /** Starts the spread analysis; absent until spread is part of the build. */
  spread?: (design: Design, onProgress: (done: number, total: number) => void) => SpreadJob;
  /**
   * Writes the design to `path` (absolute) in `format`, atomically. `spread` is the spread of this
   * very design when it was run on screen; without it the report and JSON run their own.
   */
  exportDesign?: (path: string, design: Design, format: ExportFormat, spread: SpreadReport | undefined) => Promise<void>;
}
