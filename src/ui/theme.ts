/**
 * The look of the screen as functions from meaning to Ink text props and glyphs. Components never
 * name a colour or a box-drawing character: they ask the theme, which honours NO_COLOR (no colour at
 * all, emphasis by bold and inverse only) and ASCII-only mode (no box, block or arrow characters).
 */
import type { Severity } from '../engine/analysis-types';

/** Props Ink's <Text> accepts that the theme may set. */
export interface TextStyle {
  color?: string;
  bold?: boolean;
  inverse?: boolean;
  dimColor?: boolean;
  underline?: boolean;
}

/** Characters that differ between Unicode and ASCII mode. */
export interface Glyphs {
  /** Horizontal rule under pane titles. */
  rule: string;
  /** Marks the focused pane's title. */
  focus: string;
  /** String drawing: top of the string, a resistor body, a tap, the bottom. */
  top: string;
  wire: string;
  tap: string;
  bottom: string;
  /** Rising and falling arrows. */
  up: string;
  down: string;
  /** LED indicators: lit, faint (conducting a little), dark. */
  ledOn: string;
  ledFaint: string;
  ledOff: string;
  /** Sweep cells: on both ways, on rising only, on falling only, off, no stable state. */
  cellBoth: string;
  cellUp: string;
  cellDown: string;
  cellOff: string;
  cellChatter: string;
  /** The probe cursor under the sweep axis. */
  cursor: string;
  /** Ellipsis for cut text. */
  more: string;
  /** Ohm sign. */
  ohm: string;
}

const UNICODE: Glyphs = {
  rule: '─', focus: '▸', top: '┬', wire: '│', tap: '├', bottom: '┴', up: '↑', down: '↓',
  ledOn: '●', ledFaint: '◍', ledOff: '○', cellBoth: '█', cellUp: '▀', cellDown: '▄', cellOff: ' ', cellChatter: '!',
  cursor: '▲', more: '…', ohm: 'Ω',
};

const ASCII: Glyphs = {
  rule: '-', focus: '>', top: '+', wire: '|', tap: '+', bottom: '+', up: '^', down: 'v',
  ledOn: '[#]', ledFaint: '[~]', ledOff: '[ ]', cellBoth: '#', cellUp: '^', cellDown: 'v', cellOff: '.', cellChatter: '!',
  cursor: '^', more: '~', ohm: 'ohm',
};

/** The theme every component reads. */
export interface Theme {
  /** ASCII-only mode is on. */
  isAscii: boolean;
  /** Colour is allowed (NO_COLOR unset). */
  hasColor: boolean;
  glyphs: Glyphs;
  /** Pane title; `isFocused` marks the pane keys act on. */
  title(isFocused: boolean): TextStyle;
  /** The selected value or row. */
  selected(isFocused: boolean): TextStyle;
  /** Secondary text: units, legends, column heads. */
  muted(): TextStyle;
  /** A finding's severity tag. */
  severity(severity: Severity): TextStyle;
  /** A channel's on state in the sweep and the LED row. */
  on(): TextStyle;
  /** An error message (prompt errors, failed saves). */
  error(): TextStyle;
  /** A positive note (saved, restored). */
  ok(): TextStyle;
  /** A key name in hints and help; `isEnabled` false greys it out. */
  key(isEnabled: boolean): TextStyle;
  /** The unsaved-changes marker in the title bar. */
  modified(): TextStyle;
}

/** Whether the NO_COLOR convention asks for no colour: the variable is set and not empty. */
export function noColorRequested(env: Record<string, string | undefined>): boolean {
  return (env.NO_COLOR ?? '') !== '';
}

/** Builds the theme for the given modes. */
export function makeTheme(opts: { ascii: boolean; color: boolean }): Theme {
  const c = (color: string): TextStyle => (opts.color ? { color } : {});
  return {
    isAscii: opts.ascii,
    hasColor: opts.color,
    glyphs: opts.ascii ? ASCII : UNICODE,
    title: (isFocused) => (isFocused ? { bold: true, ...c('cyan') } : { bold: true }),
    selected: (isFocused) => (isFocused ? { inverse: true } : { underline: true }),
    muted: () => (opts.color ? { dimColor: true } : {}),
    severity: (s) => (s === 'error' ? { bold: true, ...c('red') } : s === 'warning' ? { bold: true, ...c('yellow') } : c('blue')),
    on: () => c('green'),
    error: () => ({ bold: true, ...c('red') }),
    ok: () => c('green'),
    key: (isEnabled) => (isEnabled ? { bold: true } : opts.color ? { dimColor: true } : {}),
    modified: () => ({ bold: true, ...c('yellow') }),
  };
}
