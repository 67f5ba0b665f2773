/** The whole state of the interactive screen and the actions that change it. */
import type { Design } from '../../engine/design/types';
import type { ExportFormat } from '../../engine/export/export-text';
import type { SpreadReport } from '../../engine/spread';
import type { Draft } from '../../store/drafts';
import type { PaneId } from './fields';

/** Sweep direction the probe reads the circuit on. */
export type ProbeDirection = 'up' | 'down';

/** What the one-line prompt is asking for. */
export type PromptKind = 'value' | 'probe' | 'open' | 'save-as' | 'export';

/** The inline prompt: what is typed so far and, after a refused Enter, why. */
export interface PromptState {
  kind: PromptKind;
  /** Field id for `value` prompts. */
  fieldId?: string;
  /** Words before the input, e.g. "RS1 =". */
  label: string;
  text: string;
  error: string | null;
  /** Position in the recent-files list while browsing it (-1 = own text). */
  recentIndex: number;
  /** Format of an `export` prompt. */
  format?: ExportFormat;
  /** True while Enter waits for the unit reader to load (the text names a unit beyond its symbol). */
  awaitingUnits?: boolean;
  /**
   * The text is the one offered on opening (the current value, a suggested path), shown selected:
   * the first typed character replaces it; Backspace or Ctrl+U edits it instead.
   */
  offered?: boolean;
}

/** A question that takes one key: quit with unsaved work, restore a draft, or which format to export. */
export type Question = { kind: 'quit' } | { kind: 'draft'; draft: Draft } | { kind: 'export' };

/** Full-screen layers over the main screen. */
export type Overlay = 'help' | 'settings' | null;

/** Progress and outcome of the spread analysis. */
export type SpreadStatus =
  | { state: 'idle' }
  | { state: 'running'; done: number; total: number }
  | { state: 'done'; design: Design; result: SpreadSummary }
  | { state: 'failed'; message: string };

/** Per channel spread of the trip points (unit of x). */
export interface SpreadSummary {
  trials: number;
  /** The whole report, reused by the report and JSON exports of the same design. */
  report?: SpreadReport;
  channels: { id: string; rising: Range | null; falling: Range | null }[];
}

/** Spread of one trip point (unit of x): Monte Carlo extremes and ±3 sigma points, worst-case bounds. */
export interface Range {
  min: number;
  max: number;
  /** 0.135th and 99.865th percentiles. */
  lo: number;
  hi: number;
  /** Worst-case bounds when computed. */
  worstMin: number | null;
  worstMax: number | null;
}

/** A transient line under the panes. */
export interface Message {
  text: string;
  tone: 'info' | 'ok' | 'error';
}

/** The state the app reducer keeps. */
export interface AppState {
  design: Design;
  /** The design as last opened or saved: the screen is modified while `design` is another object. */
  saved: Design;
  /** File the design came from or was saved to (absolute), null for the demo or a new design. */
  file: string | null;
  /** Display name: the file's base name or the demo's. */
  name: string;
  undo: Design[];
  redo: Design[];
  pane: PaneId;
  /** Selected index per pane. */
  selected: Record<PaneId, number>;
  probe: { x: number; direction: ProbeDirection };
  prompt: PromptState | null;
  question: Question | null;
  overlay: Overlay;
  /** Selected row of the settings overlay; first visible line of the help overlay. */
  overlayIndex: number;
  message: Message | null;
  spread: SpreadStatus;
}

/** Everything that can happen to the state. */
export type AppAction =
  | { type: 'select'; delta: number }
  | { type: 'pane'; delta: number }
  | { type: 'step'; delta: number }
  | { type: 'edit-start' }
  | { type: 'prompt-open'; kind: Exclude<PromptKind, 'value'>; label: string; text?: string; format?: ExportFormat }
  | { type: 'prompt-type'; text: string }
  | { type: 'prompt-erase' }
  | { type: 'prompt-clear' }
  | { type: 'prompt-recent'; delta: number; recent: string[] }
  | { type: 'prompt-error'; message: string }
  | { type: 'prompt-cancel' }
  | { type: 'prompt-submit' }
  | { type: 'probe-move'; dx: number }
  | { type: 'probe-set'; x: number }
  | { type: 'probe-direction' }
  | { type: 'undo' }
  | { type: 'redo' }
  | { type: 'replace-design'; design: Design; message: string }
  | { type: 'loaded'; design: Design; file: string | null; name: string; message?: Message }
  | { type: 'restore-draft'; design: Design }
  | { type: 'saved'; design: Design; file: string; name: string }
  | { type: 'message'; message: Message | null }
  | { type: 'overlay'; overlay: Overlay }
  | { type: 'overlay-move'; delta: number; count: number }
  | { type: 'ask'; question: Question | null }
  | { type: 'spread'; status: SpreadStatus };
