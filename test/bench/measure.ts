import { spawnSync } from 'node:child_process';

/** One benchmark figure with its limit. */
export interface BenchResult {
  name: string;
  /** Median in milliseconds (time figures). */
  medianMs?: number;
  limitMs?: number;
  /** Other figures (memory): value, unit, limit. */
  value?: number;
  unit?: string;
  limit?: number;
}

/** Median of a list of numbers. */
export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/**
 * Median time per call of `fn` (ms): `samples` batches of `batch` calls after a warm-up, so timer
 * resolution and JIT warm-up do not colour the figure.
 */
export function timePerCall(fn: () => void, batch: number, samples: number): number {
  for (let k = 0; k < batch * 3; k++) fn();
  const times: number[] = [];
  for (let s = 0; s < samples; s++) {
    const t0 = performance.now();
    for (let k = 0; k < batch; k++) fn();
    times.push((performance.now() - t0) / batch);
  }
  return median(times);
}

/** Median wall time of `node -e 0` on this machine (ms): the floor any start-up figure stands on. */
export function nodeStartMs(runs = 7): number {
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    spawnSync(process.execPath, ['-e', '0']);
    times.push(performance.now() - t0);
  }
  return median(times);
}
