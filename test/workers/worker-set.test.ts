import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, test } from 'vitest';
import { SpreadPool } from '../../src/workers/spread-pool';
import { fourStepDesign } from '../helpers/designs';
import { buildSpreadWorker } from '../helpers/spread-worker';

/** Writes a stand-in worker script that says ready and then misbehaves on its first job. */
function fakeWorker(onJob: string): string {
  const file = join(mkdtempSync(join(tmpdir(), 'tapline-fake-worker-')), 'worker.mjs');
  writeFileSync(
    file,
    `import { parentPort } from 'node:worker_threads';
parentPort.on('message', (m) => { if (m.kind !== 'model') { ${onJob} } });
parentPort.postMessage({ kind: 'ready' });
`,
  );
  return file;
}

describe('spread worker threads', () => {
  test('a worker that throws after start rejects the run with the reason, and the pool recovers', async () => {
    const pool = new SpreadPool({ threads: 2, workerUrl: fakeWorker("throw new Error('boom in the worker');") });
    try {
      await expect(pool.run(fourStepDesign(), { trials: 100, chunk: 10 })).rejects.toThrow(/worker thread stopped.*boom in the worker/);
      await expect(pool.run(fourStepDesign(), { trials: 100, chunk: 10 })).rejects.toThrow(/boom in the worker/);
    } finally {
      await pool.close();
    }
    expect(pool.liveWorkers).toBe(0);
  });

  test('a worker that exits during a job rejects the run with its exit code', async () => {
    const pool = new SpreadPool({ threads: 1, workerUrl: fakeWorker('process.exit(3);') });
    try {
      await expect(pool.run(fourStepDesign(), { trials: 100, worstCase: false })).rejects.toThrow(/exit code 3/);
    } finally {
      await pool.close();
    }
  });

  test('a failure reported by a worker rejects the run with its message', async () => {
    const reply = "parentPort.postMessage({ kind: 'failed', model: m.model, job: m.job, message: 'no such part class' });";
    const pool = new SpreadPool({ threads: 2, workerUrl: fakeWorker(reply) });
    try {
      await expect(pool.run(fourStepDesign(), { trials: 100 })).rejects.toThrow(/failed in a worker thread: no such part class/);
    } finally {
      await pool.close();
    }
  });

  test('idle workers of a pool that is never closed do not keep the process alive', async () => {
    const workerUrl = await buildSpreadWorker();
    const esbuild = await import('esbuild');
    const dir = mkdtempSync(join(tmpdir(), 'tapline-idle-'));
    const pool = fileURLToPath(new URL('../../src/workers/spread-pool.ts', import.meta.url));
    const designs = fileURLToPath(new URL('../helpers/designs.ts', import.meta.url));
    esbuild.buildSync({
      stdin: {
        contents: `import { SpreadPool } from ${JSON.stringify(pool)};
import { fourStepDesign } from ${JSON.stringify(designs)};
const pool = new SpreadPool({ threads: 2, workerUrl: process.argv[2] });
const run = await pool.run(fourStepDesign(), { trials: 50 });
process.stdout.write('done ' + run.threads);`,
        resolveDir: dir,
        loader: 'ts',
      },
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      outfile: join(dir, 'idle.mjs'),
      logLevel: 'silent',
    });
    const child = spawnSync(process.execPath, [join(dir, 'idle.mjs'), workerUrl], { timeout: 10_000, encoding: 'utf8' });
    expect(child.signal).toBeNull();
    expect(child.status).toBe(0);
    expect(child.stdout).toBe('done 2');
  });
});
