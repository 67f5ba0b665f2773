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
    // Left to Node at run time (from node_modules), as they are needed rarely or never: Ink's
    // developer-tools bridge (only with DEV=true), esbuild (test helpers only), and conf's schema
    // validator and version comparer (only with a schema or migrations, which tapline does not use;
    // see ink-speedups.mjs). Bundled, they would be parsed at every start for nothing.
    external: ['react-devtools-core', 'esbuild', 'ajv/dist/2020.js', 'ajv-formats', 'semver'],
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
