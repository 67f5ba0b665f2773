/** Actions on files: saving, opening a file or preset, the path prompts, and exporting. */
import { basename, resolve } from 'node:path';
import type { Design } from '../../engine/design/types';
import { type ExportFormat, exportNeedsSpread } from '../../engine/export/export-text';
import type { PresetInfo } from '../../store/presets';
import { isModified } from '../state/app-reducer';
import { exportPathSuggestion } from '../state/export-path';
import type { ActionContext } from './action-context';

/** Same design, ignoring object identity. */
export function sameDesign(a: Design, b: Design): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The file actions the key table reaches, bound to one render's context. */
export interface FileActions {
  /** Writes the design to `path` (absolute); a failure is shown, never thrown. */
  saveTo(path: string): Promise<void>;
  /** Enter in an open, save-as or export prompt. */
  submitPath(): void;
  /** Opens the export prompt for `format` with a path suggested beside the design. */
  startExport(format: ExportFormat): void;
  /** The file name a save-as prompt starts with. */
  suggestion(): string;
}

/** Binds the file actions to `c`. */
export function fileActions(c: ActionContext): FileActions {
  const { s, dispatch, services } = c;

  const saveTo = async (path: string) => {
    try {
      await services.writeDesign(path, s.design);
    } catch (e) {
      const msg = `cannot save ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}. Choose another folder or name (S).`;
      if (s.prompt) dispatch({ type: 'prompt-error', message: msg });
      else c.say(msg, 'error');
      c.quitAfterSave.current = false;
      return;
    }
    if (s.file !== path) services.drafts.clear(s.file);
    services.drafts.clear(path);
    c.setSettings(services.settings.addRecent(path));
    dispatch({ type: 'saved', design: s.design, file: path, name: basename(path) });
    if (c.quitAfterSave.current) c.exit(0);
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
    c.setSettings(services.settings.addRecent(path));
    dispatch({ type: 'loaded', design: read.design, file: path, name: basename(path), message: { text: `opened ${path}${read.warnings.length ? ` (${read.warnings[0]})` : ''}`, tone: 'ok' } });
    const draft = services.drafts.load(path);
    if (draft && !sameDesign(draft.design, read.design)) dispatch({ type: 'ask', question: { kind: 'draft', draft } });
  };

  /** Writes the export; the prompt closes at once and the message line follows the work. */
  const exportTo = (path: string, format: ExportFormat, shown: string) => {
    if (!services.exportDesign) return;
    const spread = s.spread.state === 'done' && s.spread.design === s.design ? s.spread.result.report : undefined;
    dispatch({ type: 'prompt-cancel' });
    c.say(exportNeedsSpread(format) && !spread ? `exporting ${format}: running the spread first (m shows it on screen)...` : `exporting ${format}...`);
    services.exportDesign(path, s.design, format, spread).then(
      () => c.say(`exported ${format} to ${shown}`, 'ok'),
      (e: NodeJS.ErrnoException) => c.say(`export: cannot write ${shown}: ${e.code ?? e.message}. Check the folder exists and is writable, then x again.`, 'error'),
    );
  };

  const submitPath = () => {
    const p = s.prompt;
    if (!p) return;
    const text = p.text.trim();
    if (text === '') {
      const n = c.presets.current.length;
      dispatch({ type: 'prompt-error', message: p.kind === 'open'
        ? `open: type a file path${n ? `, or ↑/↓ to pick one of ${n} preset${n === 1 ? '' : 's'}` : ' such as gauge.tapline.json'}`
        : 'save as: no file name: type a path such as gauge.tapline.json' });
      return;
    }
    const path = resolve(services.cwd, text);
    if (p.kind === 'open') {
      const preset = services.fileExists(path) ? undefined : c.presets.current.find((x) => x.id === text || `${x.id}.tapline.json` === text);
      if (isModified(s) && c.armed.current !== path) {
        c.armed.current = path;
        dispatch({ type: 'prompt-error', message: 'open: this design has unsaved changes (kept as a draft): press Enter again to open anyway, Esc to go back and save' });
        return;
      }
      c.armed.current = null;
      void (preset ? openPreset(preset) : openFile(path));
      return;
    }
    if (p.kind === 'export' && path === s.file) {
      dispatch({ type: 'prompt-error', message: `export: ${path} is the design file itself: choose another name` });
      return;
    }
    if (p.kind === 'save-as' || p.kind === 'export') {
      if (path !== s.file && services.fileExists(path) && c.armed.current !== path) {
        c.armed.current = path;
        dispatch({ type: 'prompt-error', message: `${p.kind === 'export' ? 'export' : 'save as'}: ${path} exists: press Enter again to replace it, or change the name` });
        return;
      }
      c.armed.current = null;
      if (p.kind === 'save-as') void saveTo(path);
      else if (p.format) exportTo(path, p.format, text);
    }
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

  return { saveTo, submitPath, startExport, suggestion };
}
