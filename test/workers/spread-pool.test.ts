import { describe, expect, test } from 'vitest';
import { runSpread } from '../../src/engine/spread';
import { runSpreadParallel, SpreadPool } from '../../src/workers/spread-pool';
import { eightStepDesign, fourStepDesign } from '../helpers/designs';
import { smallFeedbackDesign } from '../helpers/spread-designs';
import { buildSpreadWorker } from '../helpers/spread-worker';

const design = () => ({ ...fourStepDesign(470e3), part: smallFeedbackDesign().part });

describe('spread worker pool', () => {
  test('one, two and three worker threads give the same report as one thread in-process', async () => {
    const workerUrl = await buildSpreadWorker();
    const base = runSpread(design(), { trials: 600, seed: 3 });
    for (const threads of [1, 2, 3]) {
      // This thread works alongside from the start; workers join as they come up.
      const run = await runSpreadParallel(design(), { trials: 600, seed: 3, threads, chunk: 70, workerUrl });
      expect(run.threads).toBeLessThanOrEqual(threads);
      expect(run.report).toEqual(base);
      const only = await runSpreadParallel(design(), { trials: 600, seed: 3, threads, chunk: 70, workerUrl, helpHere: false });
      expect(only.threads).toBe(threads);
      expect(only.report).toEqual(base);
    }
  });

  test('a one-off run does not wait for its workers: this thread starts at once and they join', async () => {
    const workerUrl = await buildSpreadWorker();
    // Enough trials that this thread is still busy when the worker comes up (about 0.1 s).
    const base = runSpread(design(), { trials: 16_000, seed: 5 });
    const run = await runSpreadParallel(design(), { trials: 16_000, seed: 5, threads: 1, chunk: 100, workerUrl });
    expect(run.threads).toBe(1);
    expect(run.report).toEqual(base);
  });

  test('without a worker script it runs in this thread and still gives the same report', async () => {
    const base = runSpread(design(), { trials: 200, seed: 4 });
    const run = await runSpreadParallel(design(), { trials: 200, seed: 4, threads: 2, workerUrl: new URL('file:///nonexistent/spread-worker.mjs') });
    expect(run.threads).toBe(0);
    expect(run.report).toEqual(base);
  });

  test('progress reaches the trial count and only grows', async () => {
    const workerUrl = await buildSpreadWorker();
    const seen: number[] = [];
    await runSpreadParallel(design(), { trials: 500, threads: 2, chunk: 100, workerUrl, onProgress: (done, total) => seen.push(done / total) });
    expect(seen.at(-1)).toBe(1);
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
  });

  test('aborting rejects with an AbortError', async () => {
    const workerUrl = await buildSpreadWorker();
    const controller = new AbortController();
    const run = runSpreadParallel(design(), {
      trials: 100_000,
      threads: 2,
      chunk: 50,
      workerUrl,
      signal: controller.signal,
      onProgress: () => controller.abort(),
    });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
  });

  test('aborting in-process rejects with an AbortError too', async () => {
    const controller = new AbortController();
    const run = runSpreadParallel(design(), { trials: 100_000, threads: 0, chunk: 50, signal: controller.signal, onProgress: () => controller.abort() });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
  });
});

// Reference for every check below: the single-thread, in-process engine (`runSpread`), which the
// parallel runs must match exactly (each trial's random stream depends on (seed, trial) only).
/** Runs `body` with a two-worker pool, closed afterwards whatever happens. */
async function withPool(body: (pool: SpreadPool) => Promise<void>): Promise<void> {
  const pool = new SpreadPool({ threads: 2, workerUrl: await buildSpreadWorker() });
  try {
    await body(pool);
  } finally {
    await pool.close();
  }
}

describe('reusable spread pool', () => {
  test('two runs on different designs in one pool give the same reports as the engine in-process', async () => {
    await withPool(async (pool) => {
      const first = await pool.run(design(), { trials: 300, seed: 5, chunk: 40 });
      const second = await pool.run(eightStepDesign(), { trials: 200, seed: 6, chunk: 40 });
      expect(first.threads).toBe(2);
      expect(first.report).toEqual(runSpread(design(), { trials: 300, seed: 5 }));
      expect(second.report).toEqual(runSpread(eightStepDesign(), { trials: 200, seed: 6 }));
    });
  });

  test('runs of one design keep its model until the design or a model option changes', async () => {
    await withPool(async (pool) => {
      const a = await pool.run(design(), { trials: 120, seed: 5, chunk: 40 });
      const wider = await pool.run(design(), { trials: 120, seed: 5, chunk: 40, resistorTolerance: 0.05 });
      const edited = { ...design(), resistorTolerance: 0.02 };
      const b = await pool.run(edited, { trials: 120, seed: 5, chunk: 40 });
      const again = await pool.run(design(), { trials: 120, seed: 5, chunk: 40 });
      expect(a.report).toEqual(runSpread(design(), { trials: 120, seed: 5 }));
      expect(wider.report).toEqual(runSpread(design(), { trials: 120, seed: 5, resistorTolerance: 0.05 }));
      expect(wider.report).not.toEqual(a.report);
      expect(b.report).toEqual(runSpread(edited, { trials: 120, seed: 5 }));
      expect(again.report).toEqual(a.report);
    });
  });

  test('a cancelled run rejects at once and the next run on the same pool is complete and exact', async () => {
    await withPool(async (pool) => {
      const controller = new AbortController();
      const cancelled = pool.run(design(), { trials: 100_000, chunk: 50, signal: controller.signal, onProgress: () => controller.abort() });
      await expect(cancelled).rejects.toMatchObject({ name: 'AbortError' });
      const after = await pool.run(design(), { trials: 250, seed: 7, chunk: 50 });
      expect(after.report).toEqual(runSpread(design(), { trials: 250, seed: 7 }));
      expect(pool.liveWorkers).toBe(2);
    });
  });

  test('a run cancelled while the workers start rejects, and the next run is exact', async () => {
    await withPool(async (pool) => {
      const controller = new AbortController();
      const cancelled = pool.run(design(), { trials: 5000, signal: controller.signal });
      setTimeout(() => controller.abort(), 1);
      await expect(cancelled).rejects.toMatchObject({ name: 'AbortError' });
      const after = await pool.run(design(), { trials: 100, seed: 13 });
      expect(after.report).toEqual(runSpread(design(), { trials: 100, seed: 13 }));
    });
  });

  test('runs queued behind each other each get their own numbers', async () => {
    await withPool(async (pool) => {
      const [a, b] = await Promise.all([pool.run(design(), { trials: 150, seed: 8, chunk: 30 }), pool.run(design(), { trials: 150, seed: 9, chunk: 30 })]);
      expect(a.report).toEqual(runSpread(design(), { trials: 150, seed: 8 }));
      expect(b.report).toEqual(runSpread(design(), { trials: 150, seed: 9 }));
    });
  });

  test('pools of one and two threads give the same report', async () => {
    const workerUrl = await buildSpreadWorker();
    const reports = [];
    for (const threads of [1, 2]) {
      const pool = new SpreadPool({ threads, workerUrl });
      try {
        reports.push((await pool.run(eightStepDesign(), { trials: 120, seed: 10, chunk: 25 })).report);
      } finally {
        await pool.close();
      }
    }
    expect(reports[1]).toEqual(reports[0]);
  });

  test('closing ends every worker, and a run after closing rejects with a message', async () => {
    const pool = new SpreadPool({ threads: 2, workerUrl: await buildSpreadWorker() });
    expect(await pool.start()).toBe(2);
    expect(pool.liveWorkers).toBe(2);
    await pool.close();
    expect(pool.liveWorkers).toBe(0);
    await expect(pool.run(design(), { trials: 10 })).rejects.toThrow(/closed/);
  });

  test('without a worker script the pool runs in this thread, run after run', async () => {
    const pool = new SpreadPool({ threads: 2, workerUrl: new URL('file:///nonexistent/spread-worker.mjs') });
    try {
      for (const seed of [11, 12]) {
        const run = await pool.run(design(), { trials: 100, seed });
        expect(run.threads).toBe(0);
        expect(run.report).toEqual(runSpread(design(), { trials: 100, seed }));
      }
      expect(pool.liveWorkers).toBe(0);
    } finally {
      await pool.close();
    }
  });
});
