/**
 * Which stated target each channel realises, for the target-vs-realised columns. The design does not
 * record the pairing, so each channel is paired with the nearest unpaired target threshold, nearest
 * pairs first (a greedy match over |realised − target|, read on the edge the target anchors).
 */
import type { ChannelResult } from '../../engine/analysis-types';
import type { Anchor, Design } from '../../engine/design/types';

/** One threshold a target function asks for (unit of x). */
export interface TargetPoint {
  functionId: string;
  /** Readable name, e.g. "charge step 2" or "window low". */
  label: string;
  x: number;
  hysteresis: number;
  anchor: Anchor;
}

/** A channel's target and how far its realised trip point is from it (unit of x). */
export interface TargetMatch {
  target: TargetPoint;
  realised: number;
  /** realised − target. */
  error: number;
}

/** Every threshold the design's targets state, in file order. */
export function targetPoints(d: Design): TargetPoint[] {
  const out: TargetPoint[] = [];
  for (const f of d.targets?.functions ?? []) {
    const base = { functionId: f.id, hysteresis: f.hysteresis, anchor: f.anchor };
    if (f.kind === 'bar') f.thresholds.forEach((x, k) => out.push({ ...base, label: `${f.id} step ${k + 1}`, x }));
    else if (f.kind === 'window') out.push({ ...base, label: `${f.id} low`, x: f.low }, { ...base, label: `${f.id} high`, x: f.high });
    else out.push({ ...base, label: f.id, x: f.threshold });
  }
  return out;
}

/** The trip point of `c` a target anchored at `anchor` is compared with, or null when it is missing. */
export function realisedAt(c: ChannelResult, anchor: Anchor): number | null {
  if (anchor === 'rising') return c.rising?.x ?? null;
  if (anchor === 'falling') return c.falling?.x ?? null;
  return c.rising && c.falling ? (c.rising.x + c.falling.x) / 2 : null;
}

/** The target of each channel id that has one. */
export function matchTargets(d: Design, channels: ChannelResult[]): Record<string, TargetMatch> {
  const points = targetPoints(d);
  const pairs: { ch: string; k: number; realised: number; gap: number }[] = [];
  for (const c of channels) {
    points.forEach((p, k) => {
      const realised = realisedAt(c, p.anchor);
      if (realised !== null) pairs.push({ ch: c.id, k, realised, gap: Math.abs(realised - p.x) });
    });
  }
  pairs.sort((a, b) => a.gap - b.gap);
  const out: Record<string, TargetMatch> = {};
  const used = new Set<number>();
  for (const p of pairs) {
    if (out[p.ch] || used.has(p.k)) continue;
    used.add(p.k);
    out[p.ch] = { target: points[p.k], realised: p.realised, error: p.realised - points[p.k].x };
  }
  return out;
}
