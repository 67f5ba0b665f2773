/**
 * The app reducer: every change to the screen's state, pure and testable without rendering. Edits
 * push the previous design on the undo stack (unbounded) and clear redo; moving the probe, the
 * selection or the focus is not an edit.
 */
import type { Design, SeriesName } from '../../engine/design/types';
import { parseSeriesName, stepInSeries } from '../../engine/series';
import { formatEng, formatRkm, parseValue } from '../../engine/values';
import type { AppAction, AppState } from './app-state';
import { cycleSeries, type Field, PANES, type PaneId, paneFields, xValueUnit } from './fields';

/** The starting state for `design` opened from `file` (absolute path or null for the demo). */
export function initialState(design: Design, file: string | null, name: string): AppState {
  return {
    design,
    saved: design,
    file,
    name,
    undo: [],
    redo: [],
    pane: 'string',
    selected: { string: firstResistor(design), channels: 0, targets: 0, findings: 0 },
    probe: { x: midRange(design), direction: 'up' },
    prompt: null,
    question: null,
    overlay: null,
    overlayIndex: 0,
    message: null,
    spread: { state: 'idle' },
  };
}

function firstResistor(d: Design): number {
  return Math.max(0, paneFields(d, 'string').findIndex((f) => f.id === 'string.0'));
}

function midRange(d: Design): number {
  return (d.quantity.min + d.quantity.max) / 2;
}

/** Whether the design differs from what was last opened or saved. */
export function isModified(s: AppState): boolean {
  return s.design !== s.saved;
}

/** The field selected in the focused pane, if that pane has editable values. */
export function selectedField(s: AppState): Field | undefined {
  const fields = paneFields(s.design, s.pane);
  if (fields.length === 0) return undefined;
  return fields[clampIndex(s.selected[s.pane], fields.length)];
}

function clampIndex(i: number, n: number): number {
  return Math.min(Math.max(0, i), Math.max(0, n - 1));
}

/** Formats a field's value the way the user would type it back. */
export function fieldText(f: Field, d: Design): string {
  const v = f.get(d);
  if (f.kind === 'series') return String(v);
  if (f.kind === 'resistor') return formatRkm(v as number, 4);
  return formatEng(v as number, f.symbol, { digits: 4 });
}

function edit(s: AppState, design: Design, message: string | null): AppState {
  if (design === s.design) return s;
  return { ...s, design, undo: [...s.undo, s.design], redo: [], message: message ? { text: message, tone: 'info' } : null, spread: staleSpread(s) };
}

/** A finished spread stays on screen until the design changes; a running one keeps running. */
function staleSpread(s: AppState): AppState['spread'] {
  return s.spread.state === 'running' ? s.spread : { state: 'idle' };
}

function step(s: AppState, delta: number): AppState {
  const f = selectedField(s);
  if (!f) return s;
  if (f.kind === 'series') {
    const next = cycleSeries(f.get(s.design) as SeriesName, delta);
    return edit(s, f.set(s.design, next), `series ${next}`);
  }
  if (f.kind !== 'resistor') {
    return { ...s, message: { text: `${f.label} is not a resistor: press Enter to type a value`, tone: 'error' } };
  }
  const old = f.get(s.design) as number;
  const next = stepInSeries(old, s.design.series, delta);
  return edit(s, f.set(s.design, next), `${f.label} ${formatRkm(old, 4)} -> ${formatRkm(next, 4)} (${s.design.series})`);
}

function submitValue(s: AppState): AppState {
  const p = s.prompt;
  if (!p) return s;
  const f = paneFields(s.design, s.pane).find((q) => q.id === p.fieldId);
  if (!f) return { ...s, prompt: null };
  if (f.kind === 'series') {
    const name = parseSeriesName(p.text);
    if (!name) return { ...s, prompt: { ...p, error: `${f.label}: "${p.text}" is not a series: write E3, E6, E12, E24, E48, E96 or E192` } };
    return { ...edit(s, f.set(s.design, name), `${f.label} ${name}`), prompt: null };
  }
  const read = parseValue(p.text, f.unit);
  if (!read.ok && read.needsUnitReader) return { ...s, prompt: { ...p, awaitingUnits: true } };
  if (!read.ok) return { ...s, prompt: { ...p, error: `${f.label}: ${read.message}` } };
  const before = fieldText(f, s.design);
  const next = f.set(s.design, read.value);
  return { ...edit(s, next, `${f.label} ${before} -> ${fieldText(f, next)}`), prompt: null };
}

function submitProbe(s: AppState): AppState {
  const p = s.prompt;
  if (!p) return s;
  const q = s.design.quantity;
  const read = parseValue(p.text, xValueUnit(q.unit));
  if (!read.ok && read.needsUnitReader) return { ...s, prompt: { ...p, awaitingUnits: true } };
  if (!read.ok) return { ...s, prompt: { ...p, error: `probe: ${read.message}` } };
  if (read.value < q.min || read.value > q.max) {
    const range = `${formatEng(q.min, q.unit, { digits: 4 })} to ${formatEng(q.max, q.unit, { digits: 4 })}`;
    return { ...s, prompt: { ...p, error: `probe: "${p.text}" is outside the ${q.name} range: write a value from ${range}` } };
  }
  return { ...s, prompt: null, probe: { ...s.probe, x: read.value } };
}

function moveProbe(s: AppState, x: number): AppState {
  const q = s.design.quantity;
  return { ...s, probe: { ...s.probe, x: Math.min(q.max, Math.max(q.min, x)) } };
}

/** The reducer. Unknown or inapplicable actions return the state unchanged. */
export function appReducer(s: AppState, a: AppAction): AppState {
  switch (a.type) {
    case 'select': {
      const n = s.pane === 'findings' ? Number.MAX_SAFE_INTEGER : paneFields(s.design, s.pane).length;
      const i = clampIndex(clampIndex(s.selected[s.pane], n) + a.delta, n);
      return { ...s, selected: { ...s.selected, [s.pane]: i } };
    }
    case 'pane': {
      const k = PANES.indexOf(s.pane);
      const pane = PANES[(k + a.delta + PANES.length) % PANES.length] as PaneId;
      return { ...s, pane };
    }
    case 'step':
      return step(s, a.delta);
    case 'edit-start': {
      const f = selectedField(s);
      if (!f) return s;
      const text = fieldText(f, s.design);
      return { ...s, prompt: { kind: 'value', fieldId: f.id, label: `${f.label} =`, text, error: null, recentIndex: -1, offered: text !== '' } };
    }
    case 'prompt-open':
      return { ...s, prompt: { kind: a.kind, label: a.label, text: a.text ?? '', error: null, recentIndex: -1, offered: !!a.text, ...(a.format ? { format: a.format } : {}) } };
    case 'prompt-type':
      return s.prompt ? { ...s, prompt: { ...s.prompt, text: (s.prompt.offered ? '' : s.prompt.text) + a.text, error: null, offered: false } } : s;
    case 'prompt-erase':
      return s.prompt ? { ...s, prompt: { ...s.prompt, text: [...s.prompt.text].slice(0, -1).join(''), error: null, offered: false } } : s;
    case 'prompt-clear':
      return s.prompt ? { ...s, prompt: { ...s.prompt, text: '', error: null, offered: false } } : s;
    case 'prompt-recent': {
      if (!s.prompt || a.recent.length === 0) return s;
      const i = Math.min(a.recent.length - 1, Math.max(-1, s.prompt.recentIndex + a.delta));
      return { ...s, prompt: { ...s.prompt, recentIndex: i, text: i >= 0 ? a.recent[i] : s.prompt.text, error: null, offered: false } };
    }
    case 'prompt-error':
      return s.prompt ? { ...s, prompt: { ...s.prompt, error: a.message } } : s;
    case 'prompt-cancel':
      return { ...s, prompt: null };
    case 'prompt-submit':
      if (s.prompt?.kind === 'value') return submitValue(s);
      if (s.prompt?.kind === 'probe') return submitProbe(s);
      return s;
    case 'probe-move':
      return moveProbe(s, s.probe.x + a.dx);
    case 'probe-set':
      return moveProbe(s, a.x);
    case 'probe-direction':
      return { ...s, probe: { ...s.probe, direction: s.probe.direction === 'up' ? 'down' : 'up' } };
    case 'undo': {
      if (s.undo.length === 0) return { ...s, message: { text: 'nothing to undo', tone: 'info' } };
      const design = s.undo[s.undo.length - 1];
      return { ...s, design, undo: s.undo.slice(0, -1), redo: [...s.redo, s.design], message: { text: `undone (${s.undo.length - 1} more)`, tone: 'info' }, spread: staleSpread(s) };
    }
    case 'redo': {
      if (s.redo.length === 0) return { ...s, message: { text: 'nothing to redo', tone: 'info' } };
      const design = s.redo[s.redo.length - 1];
      return { ...s, design, redo: s.redo.slice(0, -1), undo: [...s.undo, s.design], message: { text: `redone (${s.redo.length - 1} more)`, tone: 'info' }, spread: staleSpread(s) };
    }
    case 'replace-design':
      return edit(s, a.design, a.message);
    case 'loaded':
      return { ...initialState(a.design, a.file, a.name), overlay: null, message: a.message ?? null };
    case 'restore-draft':
      return { ...edit(s, a.design, null), question: null, message: { text: 'draft restored: the unsaved edits are back (u undoes the restore)', tone: 'ok' } };
    case 'saved':
      return { ...s, saved: a.design, file: a.file, name: a.name, prompt: null, message: { text: `saved ${a.file}`, tone: 'ok' } };
    case 'message':
      return { ...s, message: a.message };
    case 'overlay':
      return { ...s, overlay: a.overlay, overlayIndex: 0 };
    case 'overlay-move':
      return { ...s, overlayIndex: clampIndex(s.overlayIndex + a.delta, a.count) };
    case 'ask':
      return { ...s, question: a.question };
    case 'spread':
      return { ...s, spread: a.status };
  }
}
