import { describe, expect, test } from 'vitest';
import { runSpread } from '../../src/engine/spread';
import { runSpreadParallel } from '../../src/workers/spread-pool';
import { fourStepDesign } from '../helpers/designs';
import { smallFeedbackDesign } from '../helpers/spread-designs';
import { buildSpreadWorker } from '../helpers/spread-worker';

const design = () => ({ ...fourStepDesign(470e3), part: smallFeedbackDesign().part });

describe('spread worker pool', () => {
  test('one, two and three worker threads give the same report as one thread in-process', async () => {
    const workerUrl = await buildSpreadWorker();
    const base = runSpread(design(), { trials: 600, seed: 3 });
    for (const threads of [1, 2, 3]) {
      const run = await runSpreadParallel(design(), { trials: 600, seed: 3, threads, chunk: 70, workerUrl });
      expect(run.threads).toBe(threads);
      expect(run.report).toEqual(base);
    }
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
