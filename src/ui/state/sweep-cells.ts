/**
 * The sweep chart as data: for each channel and each column of x, whether the output is asserted
 * (sinking) on the rising sweep, on the falling sweep, both or neither, from the analysis segments.
 */
import type { Analysis } from '../../engine/analysis-types';

/** State of one chart cell. */
export type Cell = 'both' | 'up' | 'down' | 'off' | 'chatter';

/** x at the centre of column `i` of `width` columns over [min, max]. */
export function columnX(i: number, width: number, min: number, max: number): number {
  return min + ((i + 0.5) * (max - min)) / width;
}

/** The column holding x (clamped to the chart). */
export function columnOf(x: number, width: number, min: number, max: number): number {
  if (max <= min) return 0;
  return Math.min(width - 1, Math.max(0, Math.floor(((x - min) / (max - min)) * width)));
}

function lowAt(a: Analysis, id: string, x: number, dir: 'up' | 'down'): boolean | null {
  const seg = a.segments.find((s) => s.direction === dir && x >= s.from && x <= s.to);
  return seg ? !!seg.low[id] : null;
}

/** Cells for every channel (keyed by id), `width` columns over [min, max]. */
export function sweepCells(a: Analysis, width: number, min: number, max: number): Record<string, Cell[]> {
  const out: Record<string, Cell[]> = {};
  for (const c of a.channels) {
    const row: Cell[] = [];
    for (let i = 0; i < width; i++) {
      const x = columnX(i, width, min, max);
      if (a.chatter.some((b) => x >= b.from && x <= b.to && b.elements.includes(c.id))) {
        row.push('chatter');
        continue;
      }
      const up = lowAt(a, c.id, x, 'up');
      const down = lowAt(a, c.id, x, 'down');
      row.push(up && down ? 'both' : up ? 'up' : down ? 'down' : 'off');
    }
    out[c.id] = row;
  }
  return out;
}
