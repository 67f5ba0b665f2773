import { mkdtempSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, test } from 'vitest';
import { inkSpeedups, ONE_CELL_CLASS, PATCHES } from '../../src/build/ink-speedups.mjs';

type Width = (text: string, options?: object) => number;

const here = createRequire(import.meta.url);
/** Every installed copy of string-width that the bundle uses (Ink's own and the one under wrap-ansi). */
const widthFiles = [
  here.resolve('string-width'),
  join(dirname(here.resolve('wrap-ansi')), 'node_modules', 'string-width', 'index.js'),
];
const inkOutput = join(dirname(here.resolve('ink')), 'output.js');

async function widthOf(file: string): Promise<Width> {
  return (await import(pathToFileURL(file).href)).default as Width;
}

/** Every code point the one-cell class admits. */
function oneCellCodePoints(): number[] {
  const re = new RegExp(`^[${ONE_CELL_CLASS}]$`, 'u');
  const out: number[] = [];
  for (let c = 0; c <= 0xffff; c++) if (re.test(String.fromCodePoint(c))) out.push(c);
  return out;
}

describe('one-cell fast path', () => {
  // Reference: the string-width library itself (npm), both installed versions, default options.
  test.each(widthFiles)('every admitted character is one cell wide in %s', async (file) => {
    const width = await widthOf(file);
    const wrong = oneCellCodePoints().filter((c) => width(String.fromCodePoint(c)) !== 1);
    expect(wrong.map((c) => c.toString(16))).toEqual([]);
  });

  test.each(widthFiles)('lines of admitted characters measure their length in %s', async (file) => {
    const width = await widthOf(file);
    for (const line of ['RS1 ─ 3k09 ├ 12.68 V ↑ ↓ µA Ω ±2 % ° ≥ ≤ ▸ █ ░', '  ┬ │ ┴ ─────', 'plain ASCII']) {
      expect(width(line)).toBe(line.length);
    }
  });

  test('characters that may take two cells or none are left to the library', () => {
    const re = new RegExp(`^[${ONE_CELL_CLASS}]*$`, 'u');
    // Wide CJK, emoji, a combining accent, an escape sequence, text-default emoji that some
    // terminals draw wide (copyright sign, left-right arrow, play triangle).
    for (const text of ['漢字', '😀', 'e\u0301', '\u001B[1mX\u001B[22m', '©', '↔', '▶']) expect(re.test(text)).toBe(false);
  });
});

/** `file` bundled on its own with the build's patches applied, as the screen's bundle has it. */
async function patchedWidthOf(file: string): Promise<Width> {
  const esbuild = await import('esbuild');
  const outfile = join(mkdtempSync(join(tmpdir(), 'tapline-width-')), 'width.mjs');
  await esbuild.build({ entryPoints: [file], bundle: true, platform: 'node', format: 'esm', outfile, logLevel: 'silent', plugins: [inkSpeedups() as never] });
  return (await import(pathToFileURL(outfile).href)).default as Width;
}

describe('patched string-width', () => {
  // Reference: the unpatched library. Styled text (SGR codes), wide, emoji, combining and control
  // characters, and both options that change the count.
  const samples = [
    '', 'abc', 'RS1 ─ 3k09 ├ 12.68 V', '\u001B[1m\u001B[36mTaps\u001B[39m\u001B[22m ───', '\u001B[7m▸ Channels\u001B[27m',
    '漢字 and ASCII', '\u001B[1m漢\u001B[22m', '😀 smile', 'e\u0301', 'tab\there', '\u001B]8;;https://x\u0007link\u001B]8;;\u0007', '©↔▶', 'Ω µ ± °',
  ];
  test.each(widthFiles)('agrees with the library in %s', async (file) => {
    const [real, patched] = [await widthOf(file), await patchedWidthOf(file)];
    for (const text of samples) {
      expect([text, patched(text)]).toEqual([text, real(text)]);
      expect([text, patched(text, { ambiguousIsNarrow: false })]).toEqual([text, real(text, { ambiguousIsNarrow: false })]);
      expect([text, patched(text, { countAnsiEscapeCodes: true })]).toEqual([text, real(text, { countAnsiEscapeCodes: true })]);
    }
  });
});

describe('patches', () => {
  test.each([...widthFiles, inkOutput])('apply to the installed %s', (file) => {
    const patch = PATCHES.find((p) => p.file.test(file));
    expect(patch).toBeDefined();
    expect(patch!.apply(readFileSync(file, 'utf8'))).not.toBeNull();
  });

  test('a changed file is refused, not silently skipped', () => {
    for (const p of PATCHES) expect(p.apply('export default function somethingElse() {}')).toBeNull();
  });
});
