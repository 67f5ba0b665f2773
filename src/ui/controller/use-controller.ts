/**
 * Runs key-table actions: pure ones through the reducer, the rest (files, drafts, settings, planner,
 * spread, quitting) through the injected services. Keys never reach the reducer directly. File and
 * analysis actions live beside this file; this one keeps the refs and maps each action to its work.
 */
import { type Dispatch, useEffect, useRef } from 'react';
import { loadUnitReader } from '../../engine/values';
import type { PresetInfo } from '../../store/presets';
import type { Settings } from '../../store/settings';
import type { ActionName } from '../keymap';
import type { Services, SpreadJob } from '../services';
import { isModified } from '../state/app-reducer';
import type { AppAction, AppState } from '../state/app-state';
import { settingRows } from '../settings/settings-rows';
import type { ActionContext } from './action-context';
import { analysisActions } from './analysis-actions';
import { fileActions } from './file-actions';

export { sameDesign } from './file-actions';

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
  /** Help lines on screen at once: PgUp and PgDn move by this many. */
  helpPage: number;
  /** Writes any pending draft now. */
  flushDraft: () => void;
  /** Leaves the app with an exit code. */
  exit: (code: number) => void;
}

/** What the key hook calls. */
export interface Controller {
  run(action: ActionName): void;
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
  // Text with a unit name ("3 volts") needs the unit reader, loaded on first need; Enter then counts.
  const awaitingUnits = s.prompt?.awaitingUnits === true;
  useEffect(() => {
    if (!awaitingUnits) return;
    loadUnitReader().then(
      () => dispatch({ type: 'prompt-submit' }),
      () => dispatch({ type: 'prompt-error', message: 'unit names cannot be read here: write the value as 4k7, 4.7k or 4700' }),
    );
  }, [awaitingUnits, dispatch]);
  const say = (text: string, tone: 'info' | 'ok' | 'error' = 'info') => dispatch({ type: 'message', message: { text, tone } });
  const c: ActionContext = { s, dispatch, services, setSettings: o.setSettings, exit: o.exit, armed, quitAfterSave, spreadJob, presets, say };
  const { saveTo, submitPath, startExport, suggestion } = fileActions(c);
  const { plan, startSpread, cancelSpread } = analysisActions(c);
  const span = s.design.quantity.max - s.design.quantity.min;

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
      case 'plan': return plan();
      case 'spread': return startSpread();
      case 'spread-cancel': return cancelSpread();
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
      case 'overlay-page-up': return dispatch({ type: 'overlay-move', delta: -o.helpPage, count: o.helpLength });
      case 'overlay-page-down': return dispatch({ type: 'overlay-move', delta: o.helpPage, count: o.helpLength });
      case 'overlay-close': return dispatch({ type: 'overlay', overlay: null });
      case 'setting-next': return changeSetting(1);
      case 'setting-prev': return changeSetting(-1);
    }
  };
  return { run };
}
