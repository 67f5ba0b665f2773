import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, test } from 'vitest';

/** Every source file under `dir`, with its text. */
function sources(dir: string): { file: string; text: string }[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sources(path);
    return /\.(ts|tsx)$/.test(name) ? [{ file: relative(process.cwd(), path), text: readFileSync(path, 'utf8') }] : [];
  });
}

const imports = (text: string) => [...text.matchAll(/from\s+'([^']+)'|import\(\s*'([^']+)'\s*\)/g)].map((m) => m[1] ?? m[2]);

// The layering rule of DEVELOPERS.md: cli -> ui -> engine, store and workers beside; the engine is pure.
describe('layering', () => {
  test('the engine imports no UI, CLI, store, worker, Ink, React, conf or Node I/O module', () => {
    for (const { file, text } of sources('src/engine')) {
      for (const spec of imports(text)) {
        expect(`${file}: ${spec}`).not.toMatch(/: (\.\.\/)+(ui|cli|store|workers)\b|: (ink|react|conf)$|: node:(fs|child_process|worker_threads|process)/);
      }
    }
  });

  test('the engine reads no clock, randomness or process state', () => {
    for (const { file, text } of sources('src/engine')) {
      expect(`${file}: ${/Math\.random|Date\.now|new Date\(|process\./.test(text)}`).toBe(`${file}: false`);
    }
  });

  test('mathjs is imported by src/engine/unit-reader.ts only, and that only by values.ts on first need', () => {
    const users = sources('src').filter(({ text }) => imports(text).includes('mathjs')).map((s) => s.file);
    expect(users).toEqual(['src/engine/unit-reader.ts']);
    const readers = sources('src').filter(({ text }) => imports(text).some((spec) => spec.endsWith('/unit-reader'))).map((s) => s.file);
    expect(readers).toEqual(['src/engine/values.ts']);
    // A static import would put mathjs back on every start-up path.
    expect(sources('src').find((s) => s.file === 'src/engine/values.ts')?.text).toMatch(/import\('\.\/unit-reader'\)/);
  });

  test('the UI never imports the CLI, and the store never imports the UI or the CLI', () => {
    for (const { file, text } of sources('src/ui')) for (const spec of imports(text)) expect(`${file}: ${spec}`).not.toMatch(/\/cli\//);
    for (const { file, text } of sources('src/store')) for (const spec of imports(text)) expect(`${file}: ${spec}`).not.toMatch(/\/(ui|cli)\//);
  });

  test('only the store touches conf and the file system (workers and the CLI entry aside)', () => {
    for (const dir of ['src/ui', 'src/engine']) {
      for (const { file, text } of sources(dir)) {
        for (const spec of imports(text)) expect(`${file}: ${spec}`).not.toMatch(/: (conf|node:fs|node:fs\/promises)$/);
      }
    }
  });
});
