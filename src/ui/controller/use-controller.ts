/**
 * Runs key-table actions: pure ones through the reducer, the rest (files, drafts, settings, planner,
 * spread, quitting) through the injected services. Keys never reach the reducer directly.
 */
import { basename, resolve } from 'node:path';
import { type Dispatch, useEffect, useRef } from 'react';
import type { Design } from '../../engine/design/types';
import { type ExportFormat, exportNeedsSpread } from '../../engine/export/export-text';
import type { PresetInfo } from '../../store/presets';
import type { Settings } from '../../store/settings';
import type { ActionName } from '../keymap';
import type { Services, SpreadJob } from '../services';
import { isModified } from '../state/app-reducer';
import type { AppAction, AppState } from '../state/app-state';
import { exportPathSuggestion } from '../state/export-path';
import { settingRows } from '../settings/settings-rows';

/** Inputs of useController. */
export interface ControllerOptions {
  state: AppState;
  dispatch: Dispatch<AppAction>;
  services: Services;
  settings: Settings;
  setSettings: (s: Settings) => void;
  /** Columns of the sweep chart: the probe moves one column per arrow key. */
  plotWidth: number;
  /** Scroll positions of the help overlay (its rows less those on screen, plus one). */
  helpLength: number;
  /** Writes any pending draft now. */
  flushDraft: () => void;
  /** Leaves the app with an exit code. */
  exit: (code: number) => void;
}

/** What the key hook calls. */
export interface Controller {
  run(action: ActionName): void;
}

/** Same design, ignoring object identity. */
export function sameDesign(a: Design, b: Design): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The action runner. */
export function useController(o: ControllerOptions): Controller {
  const { state: s, dispatch, services } = o;
  const armed = useRef<string | null>(null);
  const quitAfterSave = useRef(false);
  const spreadJob = useRef<SpreadJob | null>(null);
  const presets = useRef<PresetInfo[]>([]);
  useEffect(() => {
    services.presets?.().then((list) => (presets.current = list), () => undefined);
  }, [services]);
  const say = (text: string, tone: 'info' | 'ok' | 'error' = 'info') => dispatch({ type: 'message', message: { text, tone } });
  const span = s.design.quantity.max - s.design.quantity.min;

  const saveTo = async (path: string) => {
    try {
      await services.writeDesign(path, s.design);
    } catch (e) {
      const msg = `cannot save ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}. Choose another folder or name (S).`;
      if (s.prompt) dispatch({ type: 'prompt-error', message: msg });
      else say(msg, 'error');
      quitAfterSave.current = false;
      return;
    }
    if (s.file !== path) services.drafts.clear(s.file);
    services.drafts.clear(path);
    o.setSettings(services.settings.addRecent(path));
    dispatch({ type: 'saved', design: s.design, file: path, name: basename(path) });
    if (quitAfterSave.current) o.exit(0);
  };

  const openPreset = async (preset: PresetInfo) => {
    const read = await services.readDesign(preset.path);
    if (!read.ok) {
      dispatch({ type: 'prompt-error', message: read.message.split('\n').slice(0, 2).join(' ') });
      return;
    }
    // A preset opens as a new design: s asks for a name, so the built-in file is never overwritten.
    dispatch({ type: 'loaded', design: read.design, file: null, name: `${preset.id}.tapline.json (preset)`, message: { text: `opened preset ${preset.id}: ${read.design.name}. s saves a copy under a name you choose`, tone: 'ok' } });
  };

  const openFile = async (path: string) => {
    const read = await services.readDesign(path);
    if (!read.ok) {
      dispatch({ type: 'prompt-error', message: read.message.split('\n').slice(0, 2).join(' ') });
      return;
    }
    o.setSettings(services.settings.addRecent(path));
    dispatch({ type: 'loaded', design: read.design, file: path, name: basename(path), message: { text: `opened ${path}${read.warnings.length ? ` (${read.warnings[0]})` : ''}`, tone: 'ok' } });
    const draft = services.drafts.load(path);
    if (draft && !sameDesign(draft.design, read.design)) dispatch({ type: 'ask', question: { kind: 'draft', draft } });
  };

  const submitPath = () => {
    const p = s.prompt;
    if (!p) return;
    const text = p.text.trim();
    if (text === '') {
      const n = presets.current.length;
      dispatch({ type: 'prompt-error', message: p.kind === 'open'
        ? `open: type a file path${n ? `, or ↑/↓ to pick one of ${n} preset${n === 1 ? '' : 's'}` : ' such as gauge.tapline.json'}`
        : 'save as: no file name: type a path such as gauge.tapline.json' });
      return;
    }
    const path = resolve(services.cwd, text);
    if (p.kind === 'open') {
      const preset = services.fileExists(path) ? undefined : presets.current.find((x) => x.id === text || `${x.id}.tapline.json` === text);
      if (isModified(s) && armed.current !== path) {
        armed.current = path;
        dispatch({ type: 'prompt-error', message: 'open: this design has unsaved changes (kept as a draft): press Enter again to open anyway, Esc to go back and save' });
        return;
      }
      armed.current = null;
      void (preset ? openPreset(preset) : openFile(path));
      return;
    }
    if (p.kind === 'export' && path === s.file) {
      dispatch({ type: 'prompt-error', message: `export: ${path} is the design file itself: choose another name` });
      return;
    }
    if (p.kind === 'save-as' || p.kind === 'export') {
      if (path !== s.file && services.fileExists(path) && armed.current !== path) {
        armed.current = path;
        dispatch({ type: 'prompt-error', message: `${p.kind === 'export' ? 'export' : 'save as'}: ${path} exists: press Enter again to replace it, or change the name` });
        return;
      }
      armed.current = null;
      if (p.kind === 'save-as') void saveTo(path);
      else if (p.format) exportTo(path, p.format, text);
    }
  };

  /** Writes the export; the prompt closes at once and the message line follows the work. */
  const exportTo = (path: string, format: ExportFormat, shown: string) => {
    if (!services.exportDesign) return;
    const spread = s.spread.state === 'done' && s.spread.design === s.design ? s.spread.result.report : undefined;
    dispatch({ type: 'prompt-cancel' });
    say(exportNeedsSpread(format) && !spread ? `exporting ${format}: running the spread first (m shows it on screen)...` : `exporting ${format}...`);
    services.exportDesign(path, s.design, format, spread).then(
      () => say(`exported ${format} to ${shown}`, 'ok'),
      (e: NodeJS.ErrnoException) => say(`export: cannot write ${shown}: ${e.code ?? e.message}. Check the folder exists and is writable, then x again.`, 'error'),
    );
  };

  const startExport = (format: ExportFormat) => {
    dispatch({ type: 'ask', question: null });
    const label = { spice: 'SPICE netlist', bom: 'parts CSV', report: 'report', json: 'JSON' }[format];
    dispatch({ type: 'prompt-open', kind: 'export', format, label: `export ${label} to`, text: exportPathSuggestion(s.file, s.name, services.cwd, format) });
  };

  const suggestion = () => {
    if (s.file) return basename(s.file);
    const bare = s.name.replace(/ \((demo|preset)\)$/, '');
    return bare.endsWith('.json') ? bare : `${bare}.tapline.json`;
  };

  const startSpread = () => {
    if (!services.spread) return;
    const design = s.design;
    const job = services.spread(design, (done, total) => dispatch({ type: 'spread', status: { state: 'running', done, total } }));
    spreadJob.current = job;
    dispatch({ type: 'spread', status: { state: 'running', done: 0, total: 1 } });
    job.result.then(
      (result) => {
        if (spreadJob.current !== job) return;
        spreadJob.current = null;
        dispatch({ type: 'spread', status: result ? { state: 'done', design, result } : { state: 'idle' } });
        say(result ? `spread done: ${result.trials} trials (see Findings)` : 'spread cancelled');
      },
      (e: Error) => {
        spreadJob.current = null;
        dispatch({ type: 'spread', status: { state: 'failed', message: e.message } });
      },
    );
  };

  const changeSetting = (delta: number) => {
    const row = settingRows(o.settings)[s.overlayIndex];
    const patch = row?.change(o.settings, delta);
    if (patch) o.setSettings(services.settings.set(patch));
  };

  const quit = () => {
    if (isModified(s)) dispatch({ type: 'ask', question: { kind: 'quit' } });
    else o.exit(0);
  };

  const run = (action: ActionName): void => {
    armed.current = action === 'prompt-accept' ? armed.current : null;
    switch (action) {
      case 'select-prev': return dispatch({ type: 'select', delta: -1 });
      case 'select-next': return dispatch({ type: 'select', delta: 1 });
      case 'pane-next': return dispatch({ type: 'pane', delta: 1 });
      case 'pane-prev': return dispatch({ type: 'pane', delta: -1 });
      case 'edit': return dispatch({ type: 'edit-start' });
      case 'step-up': return dispatch({ type: 'step', delta: 1 });
      case 'step-down': return dispatch({ type: 'step', delta: -1 });
      case 'probe-left': return dispatch({ type: 'probe-move', dx: -span / o.plotWidth });
      case 'probe-right': return dispatch({ type: 'probe-move', dx: span / o.plotWidth });
      case 'probe-jump-left': return dispatch({ type: 'probe-move', dx: -span / 10 });
      case 'probe-jump-right': return dispatch({ type: 'probe-move', dx: span / 10 });
      case 'probe-min': return dispatch({ type: 'probe-set', x: s.design.quantity.min });
      case 'probe-max': return dispatch({ type: 'probe-set', x: s.design.quantity.max });
      case 'probe-goto': return dispatch({ type: 'prompt-open', kind: 'probe', label: `probe ${s.design.quantity.name} =` });
      case 'probe-direction': return dispatch({ type: 'probe-direction' });
      case 'undo': return dispatch({ type: 'undo' });
      case 'redo': return dispatch({ type: 'redo' });
      case 'save':
        if (s.file) return void saveTo(s.file);
        return dispatch({ type: 'prompt-open', kind: 'save-as', label: 'save as', text: suggestion() });
      case 'save-as': return dispatch({ type: 'prompt-open', kind: 'save-as', label: 'save as', text: suggestion() });
      case 'open': return dispatch({ type: 'prompt-open', kind: 'open', label: presets.current.length ? 'open file or preset' : 'open' });
      case 'export': return dispatch({ type: 'ask', question: { kind: 'export' } });
      case 'export-spice': return startExport('spice');
      case 'export-bom': return startExport('bom');
      case 'export-report': return startExport('report');
      case 'export-json': return startExport('json');
      case 'export-cancel': return dispatch({ type: 'ask', question: null });
      case 'plan': {
        if (!services.plan) return;
        const out = services.plan(s.design);
        if (out.ok) return dispatch({ type: 'replace-design', design: out.design, message: `re-planned: ${out.summary} (u undoes)` });
        return say(`plan: ${out.message}`, 'error');
      }
      case 'spread': return startSpread();
      case 'spread-cancel':
        spreadJob.current?.cancel();
        spreadJob.current = null;
        dispatch({ type: 'spread', status: { state: 'idle' } });
        return say('spread cancelled');
      case 'settings': return dispatch({ type: 'overlay', overlay: 'settings' });
      case 'help': return dispatch({ type: 'overlay', overlay: 'help' });
      case 'quit': return quit();
      case 'interrupt':
        if (s.question?.kind === 'quit') {
          o.flushDraft();
          return o.exit(isModified(s) ? 130 : 0);
        }
        return quit();
      case 'prompt-accept':
        if (s.prompt?.kind === 'value' || s.prompt?.kind === 'probe') return dispatch({ type: 'prompt-submit' });
        return submitPath();
      case 'prompt-cancel':
        quitAfterSave.current = false;
        return dispatch({ type: 'prompt-cancel' });
      case 'prompt-erase': return dispatch({ type: 'prompt-erase' });
      case 'prompt-clear': return dispatch({ type: 'prompt-clear' });
      case 'prompt-older':
      case 'prompt-newer':
        if (s.prompt?.kind !== 'open' && s.prompt?.kind !== 'save-as') return undefined;
        return dispatch({ type: 'prompt-recent', delta: action === 'prompt-older' ? 1 : -1,
          recent: s.prompt.kind === 'open' ? [...o.settings.recent, ...presets.current.map((x) => x.id)] : o.settings.recent });
      case 'quit-save':
        dispatch({ type: 'ask', question: null });
        quitAfterSave.current = true;
        if (s.file) return void saveTo(s.file);
        return dispatch({ type: 'prompt-open', kind: 'save-as', label: 'save as (then quit)', text: suggestion() });
      case 'quit-discard':
        services.drafts.clear(s.file);
        return o.exit(0);
      case 'quit-stay': return dispatch({ type: 'ask', question: null });
      case 'draft-restore':
        if (s.question?.kind === 'draft') dispatch({ type: 'restore-draft', design: s.question.draft.design });
        return undefined;
      case 'draft-discard':
        services.drafts.clear(s.file);
        dispatch({ type: 'ask', question: null });
        return say('draft dropped; the file is as saved');
      case 'draft-later':
        dispatch({ type: 'ask', question: null });
        return say('draft kept for now; your next edit replaces it');
      case 'overlay-up': return dispatch({ type: 'overlay-move', delta: -1, count: s.overlay === 'help' ? o.helpLength : settingRows(o.settings).length });
      case 'overlay-down': return dispatch({ type: 'overlay-move', delta: 1, count: s.overlay === 'help' ? o.helpLength : settingRows(o.settings).length });
      case 'overlay-close': return dispatch({ type: 'overlay', overlay: null });
      case 'setting-next': return changeSetting(1);
      case 'setting-prev': return changeSetting(-1);
    }
  };
  return { run };
}
