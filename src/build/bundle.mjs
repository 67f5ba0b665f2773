/**
 * `npm run build`: bundles the CLI, the spread worker and the benchmark runner into dist/ with
 * esbuild (ES modules, split chunks so the screen and the unit reader load only when used,
 * minified), applying the screen speed-ups of ink-speedups.mjs.
 */
import { rmSync } from 'node:fs';
import { build } from 'esbuild';
import { inkSpeedups } from './ink-speedups.mjs';

rmSync('dist', { recursive: true, force: true });
try {
  await build({
    entryPoints: { tapline: 'src/cli/bin.ts', 'spread-worker': 'src/workers/spread-worker.ts', bench: 'test/bench/run.ts' },
    bundle: true,
    splitting: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outdir: 'dist',
    chunkNames: 'chunks/[name]-[hash]',
    // Ink's developer-tools bridge is only loaded with DEV=true; esbuild is only used by test helpers.
    external: ['react-devtools-core', 'esbuild'],
    define: { 'process.env.NODE_ENV': '"production"' },
    minify: true,
    legalComments: 'none',
    logLevel: 'warning',
    // Bundled CommonJS dependencies call require(); ES modules have none of their own.
    banner: { js: "import {createRequire as __cr} from 'node:module'; const require = __cr(import.meta.url);" },
    plugins: [inkSpeedups()],
  });
} catch {
  // esbuild has printed the errors.
  process.exitCode = 1;
}
