/**
 * Target against realised trip points for the exports: each target step, window edge or single
 * threshold is matched with the channel whose realised trip points lie nearest to it.
 */
import type { Analysis } from '../analysis-types';
import type { Design } from '../design/types';
import { expandFunctions } from '../planner/allocate';

/** One trip point of one channel, with its target when the design states one. */
export interface TripRow {
  /** Channel id. */
  channel: string;
  /** Target function id, or null when no target matched this channel. */
  fn: string | null;
  /** Target label, e.g. "12.1 V step", or the channel label. */
  label: string;
  edge: 'rising' | 'falling';
  /** Target trip (unit of x), or null. */
  target: number | null;
  /** Realised trip (unit of x), or null when the channel never changes that way. */
  realised: number | null;
  /** realised − target (unit of x), when both exist. */
  error: number | null;
}

/**
 * The rows of the trip table: every channel, rising then falling. Targets are matched greedily,
 * closest pair first, by the summed distance of rising and falling trip points; each channel takes
 * at most one target.
 */
export function tripRows(design: Design, a: Analysis): TripRow[] {
  const units = design.targets ? expandFunctions(design.targets.functions, design.quantity.unit) : [];
  const pairs: { u: number; c: number; cost: number }[] = [];
  units.forEach((u, ui) =>
    a.channels.forEach((c, ci) => {
      const r = c.rising?.x ?? null;
      const f = c.falling?.x ?? null;
      if (r === null && f === null) return;
      const cost = (r === null ? 0 : Math.abs(r - u.rising)) + (f === null ? 0 : Math.abs(f - u.falling));
      pairs.push({ u: ui, c: ci, cost });
    }),
  );
  pairs.sort((p, q) => p.cost - q.cost);
  const unitOf = new Map<number, number>();
  const usedUnits = new Set<number>();
  for (const p of pairs) {
    if (unitOf.has(p.c) || usedUnits.has(p.u)) continue;
    unitOf.set(p.c, p.u);
    usedUnits.add(p.u);
  }
  const rows: TripRow[] = [];
  a.channels.forEach((c, ci) => {
    const ui = unitOf.get(ci);
    const u = ui === undefined ? null : units[ui];
    for (const edge of ['rising', 'falling'] as const) {
      const realised = c[edge]?.x ?? null;
      const target = u ? u[edge] : null;
      rows.push({
        channel: c.id,
        fn: u ? u.fn.id : null,
        label: u ? u.label : c.label,
        edge,
        target,
        realised,
        error: realised !== null && target !== null ? realised - target : null,
      });
    }
  });
  return rows;
}
