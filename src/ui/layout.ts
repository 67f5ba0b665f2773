/**
 * How the terminal is divided. Pure: from the terminal size and the design's counts to the size of
 * every pane, so components only fill the boxes they are given. Below 60x20 there is no layout and
 * the screen asks for a larger window instead.
 */

/** Smallest terminal the screen draws in (columns, rows). */
export const MIN_COLUMNS = 60;
export const MIN_ROWS = 20;

/** Sizes of the panes in character cells. */
export interface Layout {
  columns: number;
  rows: number;
  /** Width of the string pane on the left of the middle band; the right column gets the rest. */
  leftWidth: number;
  rightWidth: number;
  /** Heights including each pane's title line; the sweep's is 0 while it gives its rows to the lower pane. */
  channelsHeight: number;
  middleHeight: number;
  sweepHeight: number;
  probeHeight: number;
  lowerHeight: number;
  /** A wide terminal: tables add columns, findings show their fix. */
  isWide: boolean;
}

/**
 * The layout for a terminal of `columns` x `rows` and a design with `channels` channels, or null
 * when too small. With `lowerFocused` (the targets or findings pane has the focus) the lower pane
 * takes the sweep's rows too: on 80x24 findings and spread results would otherwise show one or two
 * lines at a time.
 */
export function computeLayout(columns: number, rows: number, channels: number, lowerFocused = false): Layout | null {
  if (columns < MIN_COLUMNS || rows < MIN_ROWS) return null;
  // Title bar, message or prompt line, hint bar.
  const body = rows - 3;
  const n = Math.max(1, channels);
  const channelsHeight = 2 + Math.min(n, Math.max(2, Math.floor(body * 0.4) - 2));
  const middleHeight = body - channelsHeight;
  const leftWidth = columns >= 120 ? 36 : columns >= 100 ? 32 : columns >= 80 ? 28 : 24;
  const probeHeight = columns - leftWidth >= 70 && middleHeight >= 16 ? 4 : 3;
  const sweepHeight = Math.min(2 + n + (middleHeight >= 18 ? 1 : 0), Math.max(3, middleHeight - probeHeight - 2));
  const lowerHeight = middleHeight - sweepHeight - probeHeight;
  return {
    columns, rows, leftWidth, rightWidth: columns - leftWidth - 1, channelsHeight, middleHeight,
    sweepHeight: lowerFocused ? 0 : sweepHeight, probeHeight, lowerHeight: lowerFocused ? lowerHeight + sweepHeight : lowerHeight,
    isWide: columns >= 100,
  };
}

/** First row to show so that `selected` is visible in a window of `visible` rows over `count`. */
export function scrollStart(selected: number, count: number, visible: number): number {
  if (count <= visible) return 0;
  return Math.min(Math.max(0, selected - Math.floor(visible / 2)), count - visible);
}
