import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

let built: string | null = null;

/** The worker's TypeScript source: beside this helper when run from sources, else under the cwd. */
function workerSource(): string {
  const near = fileURLToPath(new URL('../../src/workers/spread-worker.ts', import.meta.url));
  return existsSync(near) ? near : join(process.cwd(), 'src', 'workers', 'spread-worker.ts');
}

/**
 * Bundles src/workers/spread-worker.ts with esbuild into a temporary ES module and returns its path,
 * so worker threads can run from the TypeScript sources under vitest. Built once per process.
 */
export async function buildSpreadWorker(): Promise<string> {
  if (built) return built;
  const esbuild = await import('esbuild');
  const outfile = join(mkdtempSync(join(tmpdir(), 'tapline-worker-')), 'spread-worker.mjs');
  esbuild.buildSync({
    entryPoints: [workerSource()],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile,
    logLevel: 'silent',
  });
  built = outfile;
  return outfile;
}
