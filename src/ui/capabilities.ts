/**
 * Optional capabilities wired into the screen: the planner, the spread analysis (worker threads,
 * cancellable) and export (the same texts as `tapline export`, written atomically). Spread runs share
 * one worker pool for the screen's lifetime, so later runs start on warm workers.
 */
import { EXPORT_SEED, EXPORT_TRIALS, exportNeedsSpread, exportText } from '../engine/export/export-text';
import { plan } from '../engine/planner';
import { writeFileAtomic } from '../store/files';
import type { QuantitySpread, SpreadReport } from '../engine/spread';
import { SpreadPool } from '../workers/spread-pool';
import type { PlanOutcome, Services } from './services';
import type { Range, SpreadSummary } from './state/app-state';
import type { Design } from '../engine/design/types';

/**
 * Monte Carlo trials the screen runs: enough for stable ±3 sigma points, quick enough to wait for;
 * the same run as the exports make (seed 1), so a report can reuse it.
 */
export const SCREEN_TRIALS = EXPORT_TRIALS;

function toRange(q: QuantitySpread): Range | null {
  if (!q.stats) return null;
  return { min: q.stats.min, max: q.stats.max, lo: q.stats.p00135, hi: q.stats.p99865, worstMin: q.bound?.min ?? null, worstMax: q.bound?.max ?? null };
}

/** The screen's summary of a spread report. */
export function summarizeSpread(r: SpreadReport): SpreadSummary {
  return { trials: r.trials, report: r, channels: r.channels.map((c) => ({ id: c.id, rising: toRange(c.rising), falling: toRange(c.falling) })) };
}

/** Re-plans `design` from its targets; a plan that misses some target is still applied, with the reason. */
export function planDesign(design: Design): PlanOutcome {
  const r = plan(design);
  const met = r.rows.filter((row) => row.ok).length;
  const problems = r.problems.map((p) => `${p.target}: ${p.message} ${p.fix}`).join(' ');
  if (r.ok) return { ok: true, design: r.design, summary: `${met} of ${r.rows.length} trip points within the allowance` };
  if (r.rows.length > 0 && r.design !== design) return { ok: true, design: r.design, summary: `${met} of ${r.rows.length} trip points met; ${problems}` };
  return { ok: false, message: problems || 'the targets cannot be planned' };
}

/** The capability services of this build, and `close` to end their worker threads when the screen ends. */
export type Capabilities = Pick<Services, 'plan' | 'spread' | 'exportDesign'> & { close(): Promise<void> };

/** The capability services available in this build; the spread pool starts with the first run. */
export function capabilities(): Capabilities {
  let pool: SpreadPool | null = null;
  let running: AbortController | null = null;
  const spreadPool = () => (pool ??= new SpreadPool());
  return {
    plan: planDesign,
    exportDesign: async (path, design, format, spread) => {
      // Without a spread at hand the report's run goes to the worker threads, so the screen stays live.
      const report = spread ?? (exportNeedsSpread(format) ? (await spreadPool().run(design, { trials: EXPORT_TRIALS, seed: EXPORT_SEED })).report : null);
      await writeFileAtomic(path, exportText({ design, format, spread: report }));
    },
    spread: (design, onProgress) => {
      // A newer run replaces the one in progress (whose result the screen no longer wants): the pool runs one at a time.
      running?.abort();
      const abort = new AbortController();
      running = abort;
      const result = spreadPool().run(design, { trials: SCREEN_TRIALS, seed: EXPORT_SEED, signal: abort.signal, onProgress }).then(
        (out) => summarizeSpread(out.report),
        (e: Error) => {
          if (e.name === 'AbortError') return null;
          throw e;
        },
      );
      return { result, cancel: () => abort.abort() };
    },
    close: async () => {
      running?.abort();
      await pool?.close();
    },
  };
}
