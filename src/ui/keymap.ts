/**
 * Every key binding as data: action, keys, scope, description, and why it is disabled right now.
 * The hint bar, the help overlay and the key handler all read this one table, so what the screen
 * says a key does is what it does.
 *
 * Focus is routed here, not through Ink's focus manager: no component registers with `useFocus`,
 * so Ink's own Tab / Shift+Tab / Esc handling has nothing to act on and those keys reach this table.
 * Ctrl+C does not exit through Ink (`exitOnCtrlC: false`); it is bound to the quit action so
 * unsaved work is asked about first.
 */
import type { Key } from 'ink';
import type { AppState } from './state/app-state';
import { isModified, selectedField } from './state/app-reducer';

/** Where a binding applies: the main screen, or the layer on top of it. */
export type Scope = 'main' | 'prompt' | 'quit' | 'draft' | 'export' | 'help' | 'settings';

/** Scope titles used by the help overlay. */
export const SCOPE_TITLES: Record<Scope, string> = {
  main: 'Main screen', prompt: 'While typing a value or path', quit: 'Quit with unsaved changes',
  draft: 'Unsaved draft found', export: 'Export: choose the format', help: 'This help', settings: 'Settings',
};

/** Named keys Ink reports as flags. */
export type NamedKey = 'up' | 'down' | 'left' | 'right' | 'pageUp' | 'pageDown' | 'home' | 'end' | 'return' | 'escape' | 'tab' | 'backspace';

/** One key: a printable character, a named key (optionally with Shift), or Ctrl plus a letter. */
export type KeySpec = { char: string } | { name: NamedKey; shift?: boolean } | { ctrl: string };

/** Every action a key can trigger. */
export type ActionName =
  | 'pane-next' | 'pane-prev' | 'select-prev' | 'select-next' | 'edit' | 'step-up' | 'step-down'
  | 'probe-left' | 'probe-right' | 'probe-jump-left' | 'probe-jump-right' | 'probe-min' | 'probe-max' | 'probe-goto' | 'probe-direction'
  | 'undo' | 'redo' | 'save' | 'save-as' | 'open' | 'export' | 'plan' | 'spread' | 'spread-cancel'
  | 'settings' | 'help' | 'quit' | 'interrupt'
  | 'prompt-accept' | 'prompt-cancel' | 'prompt-erase' | 'prompt-clear' | 'prompt-older' | 'prompt-newer'
  | 'quit-save' | 'quit-discard' | 'quit-stay'
  | 'draft-restore' | 'draft-discard' | 'draft-later'
  | 'export-spice' | 'export-bom' | 'export-report' | 'export-json' | 'export-cancel'
  | 'overlay-up' | 'overlay-down' | 'overlay-page-up' | 'overlay-page-down' | 'overlay-close' | 'setting-next' | 'setting-prev';

/** What `whyDisabled` may look at. */
export interface KeyContext {
  state: AppState;
  /** Optional capabilities present in this build. */
  hasPlanner: boolean;
  hasSpread: boolean;
  hasExport: boolean;
}

/** One row of the table. */
export interface Binding {
  action: ActionName;
  keys: KeySpec[];
  scope: Scope;
  /** What it does, for the help overlay. */
  description: string;
  /** One or two words for the hint bar; bindings without it are listed in help only. */
  hint?: string;
  /** A second action whose first key is shown beside this one in the hint bar ("↑/↓ value"). */
  pairedWith?: ActionName;
  /** Why the action cannot run now, or null when it can. */
  whyDisabled?: (ctx: KeyContext) => string | null;
}

const ch = (c: string): KeySpec => ({ char: c });
const named = (name: NamedKey, shift = false): KeySpec => ({ name, shift });

const notResistor = ({ state }: KeyContext): string | null => {
  const f = selectedField(state);
  if (!f) return state.pane === 'findings' ? 'findings hold no values: Tab to a pane with values' : 'this pane has no values';
  return f.kind === 'number' ? `${f.label} is not a resistor: press Enter to type a value` : null;
};

/** The key table. Key names and wording are tapline's own. */
export const KEYMAP: readonly Binding[] = [
  { action: 'select-prev', keys: [named('up')], scope: 'main', description: 'select the previous value in the pane', hint: 'value', pairedWith: 'select-next' },
  { action: 'select-next', keys: [named('down')], scope: 'main', description: 'select the next value in the pane' },
  { action: 'pane-next', keys: [named('tab')], scope: 'main', description: 'next pane (string, channels, targets, findings)', hint: 'pane' },
  { action: 'pane-prev', keys: [named('tab', true)], scope: 'main', description: 'previous pane' },
  { action: 'edit', keys: [named('return')], scope: 'main', description: 'type a new value for the selected one (4k7, 4.7k, 4.7 kohm, 2.5 V)', hint: 'type',
    whyDisabled: ({ state }) => (selectedField(state) ? null : 'nothing to type here: Tab to a pane with values') },
  { action: 'step-up', keys: [ch('+'), ch('=')], scope: 'main', description: 'step the selected resistor to the next value of the series', hint: 'step', pairedWith: 'step-down', whyDisabled: notResistor },
  { action: 'step-down', keys: [ch('-'), ch('_')], scope: 'main', description: 'step the selected resistor to the previous value of the series', whyDisabled: notResistor },
  { action: 'probe-left', keys: [named('left')], scope: 'main', description: 'move the probe down by one sweep column', hint: 'probe', pairedWith: 'probe-right' },
  { action: 'probe-right', keys: [named('right')], scope: 'main', description: 'move the probe up by one sweep column' },
  { action: 'probe-jump-left', keys: [ch('[')], scope: 'main', description: 'move the probe down by a tenth of the range' },
  { action: 'probe-jump-right', keys: [ch(']')], scope: 'main', description: 'move the probe up by a tenth of the range' },
  { action: 'probe-min', keys: [named('home')], scope: 'main', description: 'probe at the bottom of the range' },
  { action: 'probe-max', keys: [named('end')], scope: 'main', description: 'probe at the top of the range' },
  { action: 'probe-goto', keys: [ch('g')], scope: 'main', description: 'go: type the probe value' },
  { action: 'probe-direction', keys: [ch('d')], scope: 'main', description: 'read the probe on the rising or the falling sweep' },
  { action: 'undo', keys: [ch('u')], scope: 'main', description: 'undo the last edit (no limit)', hint: 'undo',
    whyDisabled: ({ state }) => (state.undo.length ? null : 'no edits to undo') },
  { action: 'redo', keys: [ch('r')], scope: 'main', description: 'redo the edit last undone', hint: 'redo',
    whyDisabled: ({ state }) => (state.redo.length ? null : 'nothing undone to redo') },
  { action: 'plan', keys: [ch('p')], scope: 'main', description: 're-plan the circuit from the targets, in place (undoable)', hint: 'plan',
    whyDisabled: ({ state, hasPlanner }) => (!hasPlanner ? 'the planner is not part of this build yet' : state.design.targets ? null : 'this design has no targets to plan from') },
  { action: 'spread', keys: [ch('m')], scope: 'main', description: 'run the spread of every trip point (tolerances, offsets); the screen stays live', hint: 'spread',
    whyDisabled: ({ state, hasSpread }) => (!hasSpread ? 'the spread analysis is not part of this build yet' : state.spread.state === 'running' ? 'already running: Esc cancels' : null) },
  { action: 'spread-cancel', keys: [named('escape')], scope: 'main', description: 'cancel a running spread analysis',
    whyDisabled: ({ state }) => (state.spread.state === 'running' ? null : 'no spread analysis is running') },
  { action: 'save', keys: [ch('s')], scope: 'main', description: 'save to the open file (asks for a name the first time)', hint: 'save' },
  { action: 'save-as', keys: [ch('S')], scope: 'main', description: 'save under a new name' },
  { action: 'open', keys: [ch('o')], scope: 'main', description: 'open a design file or a built-in preset (Up/Down in the prompt list recent files, then presets)', hint: 'open' },
  { action: 'export', keys: [ch('x')], scope: 'main', description: 'export: SPICE netlist, bill of materials, report or JSON, to a file beside the design', hint: 'export',
    whyDisabled: ({ hasExport }) => (hasExport ? null : 'export is not part of this build yet') },
  { action: 'settings', keys: [ch('c')], scope: 'main', description: 'settings: series, tolerance, part class, ASCII mode' },
  { action: 'help', keys: [ch('?')], scope: 'main', description: 'this list of keys', hint: 'keys' },
  { action: 'quit', keys: [ch('q')], scope: 'main', description: 'quit (asks first when there are unsaved changes)', hint: 'quit' },
  { action: 'interrupt', keys: [{ ctrl: 'c' }], scope: 'main', description: 'quit, as q; pressed again while asked, quits and keeps a draft' },

  { action: 'prompt-accept', keys: [named('return')], scope: 'prompt', description: 'accept', hint: 'accept' },
  { action: 'prompt-cancel', keys: [named('escape')], scope: 'prompt', description: 'cancel, nothing changes', hint: 'cancel' },
  { action: 'prompt-erase', keys: [named('backspace')], scope: 'prompt', description: 'erase the last character' },
  { action: 'prompt-clear', keys: [{ ctrl: 'u' }], scope: 'prompt', description: 'erase everything typed' },
  { action: 'prompt-older', keys: [named('up')], scope: 'prompt', description: 'older recent file, then the presets (open and save-as prompts)', hint: 'list', pairedWith: 'prompt-newer',
    whyDisabled: ({ state }) => (state.prompt?.kind === 'open' || state.prompt?.kind === 'save-as' ? null : 'only the open and save-as prompts keep a list') },
  { action: 'prompt-newer', keys: [named('down')], scope: 'prompt', description: 'newer recent file' },

  { action: 'quit-save', keys: [ch('s')], scope: 'quit', description: 'save, then quit', hint: 'save and quit' },
  { action: 'quit-discard', keys: [ch('y')], scope: 'quit', description: 'quit without saving (the draft is dropped)', hint: 'quit, drop changes' },
  { action: 'quit-stay', keys: [ch('n'), named('escape')], scope: 'quit', description: 'stay and keep editing', hint: 'stay' },
  { action: 'interrupt', keys: [{ ctrl: 'c' }], scope: 'quit', description: 'quit now and keep the draft for next time' },

  { action: 'draft-restore', keys: [ch('y')], scope: 'draft', description: 'restore the unsaved edits', hint: 'restore' },
  { action: 'draft-discard', keys: [ch('n')], scope: 'draft', description: 'drop the draft, keep the file as saved', hint: 'drop draft' },
  { action: 'draft-later', keys: [named('escape')], scope: 'draft', description: 'decide later (the draft is kept until the next edit)', hint: 'later' },

  { action: 'export-spice', keys: [ch('s')], scope: 'export', description: 'SPICE netlist that sweeps the input and measures each trip point (.cir)', hint: 'SPICE' },
  { action: 'export-bom', keys: [ch('b')], scope: 'export', description: 'bill of materials as CSV (.bom.csv)', hint: 'parts CSV' },
  { action: 'export-report', keys: [ch('r')], scope: 'export', description: 'Markdown report with the spread and the cautions (.report.md)', hint: 'report' },
  { action: 'export-json', keys: [ch('j')], scope: 'export', description: 'the design plus every figure of the report, as JSON (.json)', hint: 'JSON' },
  { action: 'export-cancel', keys: [named('escape'), ch('q')], scope: 'export', description: 'do not export', hint: 'cancel' },

  { action: 'overlay-up', keys: [named('up')], scope: 'help', description: 'scroll up' },
  { action: 'overlay-down', keys: [named('down')], scope: 'help', description: 'scroll down' },
  { action: 'overlay-page-up', keys: [named('pageUp')], scope: 'help', description: 'scroll up a page' },
  { action: 'overlay-page-down', keys: [named('pageDown')], scope: 'help', description: 'scroll down a page' },
  { action: 'overlay-close', keys: [named('escape'), ch('?'), ch('q')], scope: 'help', description: 'close the help', hint: 'close' },

  { action: 'overlay-up', keys: [named('up')], scope: 'settings', description: 'previous setting', hint: 'setting', pairedWith: 'overlay-down' },
  { action: 'overlay-down', keys: [named('down')], scope: 'settings', description: 'next setting' },
  { action: 'setting-next', keys: [ch('+'), ch('='), named('return'), named('right')], scope: 'settings', description: 'next choice for the setting', hint: 'change', pairedWith: 'setting-prev' },
  { action: 'setting-prev', keys: [ch('-'), ch('_'), named('left')], scope: 'settings', description: 'previous choice for the setting' },
  { action: 'overlay-close', keys: [named('escape'), ch('c'), ch('q')], scope: 'settings', description: 'close settings (they are saved at once)', hint: 'close' },
];

/** Whether Ink's (input, key) pair is the key `spec`. */
export function keyMatches(spec: KeySpec, input: string, key: Key): boolean {
  if ('ctrl' in spec) return key.ctrl && input === spec.ctrl;
  if ('char' in spec) return !key.ctrl && !key.meta && input === spec.char;
  const flag: Record<NamedKey, boolean> = {
    up: key.upArrow, down: key.downArrow, left: key.leftArrow, right: key.rightArrow, pageUp: key.pageUp,
    pageDown: key.pageDown, home: key.home, end: key.end, return: key.return || input === '\r' || input === '\n',
    escape: key.escape, tab: key.tab, backspace: key.backspace || key.delete,
  };
  return flag[spec.name] && (spec.name !== 'tab' || !!spec.shift === key.shift);
}

/** The binding of `scope` that the key triggers, if any. */
export function findBinding(scope: Scope, input: string, key: Key): Binding | undefined {
  return KEYMAP.find((b) => b.scope === scope && b.keys.some((k) => keyMatches(k, input, key)));
}

/** Why `binding` cannot run now, or null. */
export function whyDisabled(binding: Binding, ctx: KeyContext): string | null {
  return binding.whyDisabled ? binding.whyDisabled(ctx) : null;
}

const NAMES: Record<NamedKey, [string, string]> = {
  up: ['↑', 'Up'], down: ['↓', 'Down'], left: ['←', 'Left'], right: ['→', 'Right'], pageUp: ['PgUp', 'PgUp'],
  pageDown: ['PgDn', 'PgDn'], home: ['Home', 'Home'], end: ['End', 'End'], return: ['Enter', 'Enter'],
  escape: ['Esc', 'Esc'], tab: ['Tab', 'Tab'], backspace: ['Bksp', 'Bksp'],
};

/** Printable name of one key; `ascii` avoids arrow characters. */
export function keyName(spec: KeySpec, ascii: boolean): string {
  if ('ctrl' in spec) return `Ctrl+${spec.ctrl.toUpperCase()}`;
  if ('char' in spec) return spec.char === ' ' ? 'Space' : spec.char;
  const base = NAMES[spec.name][ascii ? 1 : 0];
  return spec.shift ? `Shift+${base}` : base;
}

/** The keys of a binding joined for display, e.g. "+ =". */
export function keysLabel(b: Binding, ascii: boolean): string {
  return b.keys.map((k) => keyName(k, ascii)).join(' ');
}

/** The scope keys go to in `state`: the topmost layer wins. */
export function activeScope(state: AppState): Scope {
  if (state.question) return state.question.kind;
  if (state.prompt) return 'prompt';
  if (state.overlay) return state.overlay;
  return 'main';
}

/** Whether quitting needs a question first. */
export function needsQuitQuestion(state: AppState): boolean {
  return isModified(state);
}
