/**
 * Spread benchmark: 10 000 Monte Carlo trials of the eight-channel, two-package design, on one core
 * (in-process) and on every core (worker pool). Limits: 500 ms median on one core; on n cores
 * 500/n ms plus 100 ms for starting the workers.
 */
import { availableParallelism } from 'node:os';
import { buildSpreadModel, runTrials } from '../../src/engine/spread';
import { runSpreadParallel } from '../../src/workers/spread-pool';
import { eightStepDesign } from '../helpers/designs';

/** One benchmark figure (milliseconds). */
export interface BenchFigure {
  name: string;
  medianMs: number;
  limitMs: number;
}

const TRIALS = 10_000;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Runs the spread benchmark `repeats` times (default 5) per figure and returns the medians. */
export async function benchSpread(repeats = 5): Promise<BenchFigure[]> {
  const design = eightStepDesign();
  const model = buildSpreadModel(design);
  runTrials(model, 1, 0, 500);
  const one: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    runTrials(model, r + 1, 0, TRIALS);
    one.push(performance.now() - t0);
  }
  const cores = availableParallelism();
  // The bundle finds dist/spread-worker.js beside itself; from sources the worker is built on the fly.
  let workerUrl: string | URL | undefined;
  const probe = await runSpreadParallel(design, { trials: 10, threads: 1, worstCase: false });
  if (probe.threads === 0) workerUrl = await (await import('../helpers/spread-worker')).buildSpreadWorker();
  const all: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    await runSpreadParallel(design, { trials: TRIALS, seed: r + 1, threads: cores, worstCase: false, chunk: 500, workerUrl });
    all.push(performance.now() - t0);
  }
  return [
    { name: 'spread: 10k trials, 8 channels, one core', medianMs: median(one), limitMs: 500 },
    { name: `spread: 10k trials, 8 channels, ${cores} cores`, medianMs: median(all), limitMs: 500 / cores + 100 },
  ];
}
