/** Shared helpers for screen tests: the demo design, in-memory stores, key sequences, waiting for frames. */
import { render } from 'ink-testing-library';
import { DEMO_DESIGN_FILE } from '../../src/engine/design/demo';
import { parseDesign } from '../../src/engine/design/load';
import type { Design } from '../../src/engine/design/types';
import type { Draft, DraftStore } from '../../src/store/drafts';
import { DEFAULT_SETTINGS, type Settings, type SettingsStore } from '../../src/store/settings';
import { App } from '../../src/ui/app';
import type { Services } from '../../src/ui/services';
import { initialState } from '../../src/ui/state/app-reducer';
import type { AppState } from '../../src/ui/state/app-state';

/** Terminal escape sequences of the keys tests press. */
export const KEYS = {
  up: '\u001B[A', down: '\u001B[B', right: '\u001B[C', left: '\u001B[D', enter: '\r', escape: '\u001B',
  tab: '\t', shiftTab: '\u001B[Z', backspace: '\u007F', ctrlC: '\u0003', home: '\u001B[H', end: '\u001B[F',
  pageUp: '\u001B[5~', pageDown: '\u001B[6~',
} as const;

/** The built-in demo design, resolved. */
export function demoDesign(): Design {
  const r = parseDesign(DEMO_DESIGN_FILE);
  if (!r.ok) throw new Error('demo does not load');
  return r.design;
}

/** A settings store kept in memory. */
export function memorySettings(start: Partial<Settings> = {}): SettingsStore {
  let s: Settings = { ...DEFAULT_SETTINGS, ...start };
  return {
    get: () => s,
    set: (p) => (s = { ...s, ...p }),
    addRecent: (path) => (s = { ...s, recent: [path, ...s.recent.filter((x) => x !== path)] }),
    path: '(memory)',
  };
}

/** A draft store kept in memory; `saved` lists every write for assertions. */
export function memoryDrafts(): DraftStore & { map: Map<string, Draft>; saved: Draft[] } {
  const map = new Map<string, Draft>();
  const saved: Draft[] = [];
  return {
    map,
    saved,
    load: (file) => map.get(file ?? '(demo)') ?? null,
    save: (file, design, now) => {
      const d = { file, design, savedAt: now };
      map.set(file ?? '(demo)', d);
      saved.push(d);
    },
    clear: (file) => void map.delete(file ?? '(demo)'),
    path: '(memory)',
  };
}

/** In-memory services; `files` is the pretend file system (path -> text). */
export function memoryServices(over: Partial<Services> = {}): Services & { files: Map<string, Design> } {
  const files = new Map<string, Design>();
  return {
    files,
    settings: memorySettings(),
    drafts: memoryDrafts(),
    now: () => 1_000_000,
    cwd: '/work',
    readDesign: async (path) => {
      const d = files.get(path);
      return d ? { ok: true, design: d, warnings: [] } : { ok: false, message: `${path}: cannot read the design file: no such file.` };
    },
    writeDesign: async (path, design) => void files.set(path, design),
    fileExists: (path) => files.has(path),
    ...over,
  };
}

/** Waits for pending renders (React batches; Ink throttles). */
export async function settle(ms = 30): Promise<void> {
  await new Promise((r) => setTimeout(r, ms));
}

/** Renders the whole app at `columns` x `rows` on the demo (or `state`). */
export function renderApp(opts: { services?: Services; state?: AppState; columns?: number; rows?: number; noColor?: boolean } = {}) {
  const services = opts.services ?? memoryServices();
  const state = opts.state ?? initialState(demoDesign(), null, 'demo.tapline.json (demo)');
  const exits: number[] = [];
  const r = render(
    <App initial={state} services={services} noColor={opts.noColor ?? true} onExit={(c) => exits.push(c)} size={{ columns: opts.columns ?? 80, rows: opts.rows ?? 24 }} />,
  );
  const press = async (...keys: string[]) => {
    for (const k of keys) {
      r.stdin.write(k);
      await settle();
    }
  };
  const frame = () => r.lastFrame() ?? '';
  /** Waits until the frame contains `text` (for work that finishes later, such as a module load). */
  const waitFor = async (text: string, timeoutMs = 10_000) => {
    for (const end = Date.now() + timeoutMs; !frame().includes(text) && Date.now() < end; ) await settle(20);
  };
  return { ...r, services, exits, press, frame, waitFor };
}
