/**
 * Spread benchmark: 10 000 Monte Carlo trials of the eight-channel, two-package design (no worst
 * case), median of `repeats` runs per figure. Three figures:
 * - one core: the trials in this thread, code already warm. Limit 500 ms.
 * - n cores, warm pool: a `SpreadPool` started and warmed by one untimed run (as the screen keeps
 *   it), then whole runs timed (hand-out, joining and summary included). Limit 500/n ms: strictly
 *   proportional, nothing allowed for start-up.
 * - one-off run: as `tapline spread` does it, with its default threads (one worker per
 *   TRIALS_PER_WORKER trials, so none for 10 000: fresh workers would cost more than they give),
 *   this thread starting at once, workers joining as they come up, the pool closed at the end.
 *   Limit 500/n + 150 ms, the 150 ms for start-up and warm-up.
 */
import { availableParallelism } from 'node:os';
import { buildSpreadModel, runTrials } from '../../src/engine/spread';
import { runSpreadParallel, SpreadPool, TRIALS_PER_WORKER } from '../../src/workers/spread-pool';
import { eightStepDesign } from '../helpers/designs';
import { type BenchResult, median } from './measure';

const TRIALS = 10_000;

async function timeRuns(repeats: number, run: (r: number) => Promise<unknown> | unknown): Promise<number> {
  const times: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    await run(r);
    times.push(performance.now() - t0);
  }
  return median(times);
}

/** The worker script: dist/spread-worker.js beside the bundle, else built from sources on the fly. */
async function workerUrl(): Promise<string | URL | undefined> {
  const probe = new SpreadPool({ threads: 1 });
  const ready = await probe.start();
  await probe.close();
  return ready > 0 ? undefined : (await import('../helpers/spread-worker')).buildSpreadWorker();
}

/** Runs the spread benchmark and returns its three figures. */
export async function benchSpread(repeats = 5): Promise<BenchResult[]> {
  const design = eightStepDesign();
  const model = buildSpreadModel(design);
  runTrials(model, 1, 0, 500);
  const one = await timeRuns(repeats, (r) => runTrials(model, r + 1, 0, TRIALS));

  const cores = availableParallelism();
  const url = await workerUrl();
  // The pool's own chunk size, as the screen and the batch command use it.
  const options = { trials: TRIALS, worstCase: false };
  const pool = new SpreadPool({ threads: cores, workerUrl: url });
  let warm: number;
  try {
    await pool.run(design, { ...options, seed: 100 });
    warm = await timeRuns(repeats, (r) => pool.run(design, { ...options, seed: r + 1 }));
  } finally {
    await pool.close();
  }
  // As `tapline spread` runs: this thread starts at once, its default workers join as they come up.
  const cold = await timeRuns(repeats, (r) => runSpreadParallel(design, { ...options, seed: r + 1, workerUrl: url }));
  const oneOffWorkers = Math.min(cores - 1, Math.floor(TRIALS / TRIALS_PER_WORKER));

  return [
    { name: 'spread: 10k trials, 8 channels, one core', medianMs: one, limitMs: 500 },
    { name: `spread: 10k trials, 8 channels, ${cores} cores, warm pool`, medianMs: warm, limitMs: 500 / cores },
    { name: `spread: 10k trials, one-off run, ${oneOffWorkers} workers`, medianMs: cold, limitMs: 500 / cores + 150 },
  ];
}
