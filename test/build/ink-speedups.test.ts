import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, test } from 'vitest';
import { inkSpeedups, ONE_CELL_CLASS, PATCHES } from '../../src/build/ink-speedups.mjs';

type Width = (text: string, options?: object) => number;
type Tokenize = (text: string, endChar?: number) => unknown[];
type Slice = (text: string, start: number, end?: number) => string;
type Styled = { styles: unknown[] };
type Diff = (from: unknown[], to: unknown[]) => unknown[];

const here = createRequire(import.meta.url);
const inkDir = dirname(dirname(here.resolve('ink')));

/** A file of package `name` as Ink finds it: under Ink's own node_modules first, else hoisted. */
function inkDependency(name: string, file: string): string {
  const own = join(inkDir, 'node_modules', name, file);
  return existsSync(own) ? own : join(dirname(inkDir), name, file);
}

/** Every installed copy of string-width that the bundle uses (Ink's own and the one under wrap-ansi). */
const widthFiles = [here.resolve('string-width'), join(dirname(here.resolve('wrap-ansi')), 'node_modules', 'string-width', 'index.js')];
const tokenizeIndex = inkDependency('@alcalzone/ansi-tokenize', 'build/index.js');
const sliceIndex = inkDependency('slice-ansi', 'index.js');
const confIndex = join(dirname(here.resolve('conf')), 'index.js');
/** The installed file each patch is written for. */
const patchedFiles = [...widthFiles, join(dirname(tokenizeIndex), 'tokenize.js'), join(dirname(tokenizeIndex), 'diff.js'), join(dirname(sliceIndex), 'tokenize-ansi.js'), confIndex, join(dirname(here.resolve('ink')), 'output.js')];

/** Screen-like samples: styled text (SGR codes), wide, emoji, combining and control characters, a link. */
const SAMPLES = [
  '', 'abc', 'RS1 ─ 3k09 ├ 12.68 V', '\u001B[1m\u001B[36mTaps\u001B[39m\u001B[22m ───', '\u001B[7m▸ Channels\u001B[27m',
  '\u001B[38;5;208mS1\u001B[39m ●S2 ○S3', '漢字 and ASCII', '\u001B[1m漢\u001B[22m', '😀 smile', 'e\u0301', 'tab\there', 'cr\r\nlf',
  '\u001B]8;;https://example.org\u0007link\u001B]8;;\u0007', '©↔▶', 'Ω µ ± ° ≥ ≤ █ ▀ ▄',
];

async function load<T>(file: string, name = 'default'): Promise<T> {
  return (await import(pathToFileURL(file).href))[name] as T;
}

/** `file` bundled on its own with the build's patches applied, as the screen's bundle has it. */
async function patched<T>(file: string, name = 'default'): Promise<T> {
  const esbuild = await import('esbuild');
  const outfile = join(mkdtempSync(join(tmpdir(), 'tapline-patched-')), 'module.mjs');
  await esbuild.build({ entryPoints: [file], bundle: true, platform: 'node', format: 'esm', outfile, logLevel: 'silent', plugins: [inkSpeedups() as never] });
  return load<T>(outfile, name);
}

/** Every code point the one-cell class admits. */
function oneCellCodePoints(): number[] {
  const re = new RegExp(`^[${ONE_CELL_CLASS}]$`, 'u');
  const out: number[] = [];
  for (let c = 0; c <= 0xffff; c++) if (re.test(String.fromCodePoint(c))) out.push(c);
  return out;
}

describe('one-cell characters', () => {
  // Reference: the string-width library itself (npm), both installed versions, default options.
  test.each(widthFiles)('each is one cell wide in %s', async (file) => {
    const width = await load<Width>(file);
    expect(oneCellCodePoints().filter((c) => width(String.fromCodePoint(c)) !== 1).map((c) => c.toString(16))).toEqual([]);
  });

  test('characters that may take two cells or none are not admitted', () => {
    const re = new RegExp(`^[${ONE_CELL_CLASS}]*$`, 'u');
    // Wide CJK, emoji, a combining accent, an escape, text-default emoji that some terminals draw
    // wide (copyright sign, left-right arrow, play triangle).
    for (const text of ['漢字', '😀', 'e\u0301', '\u001B', '©', '↔', '▶']) expect(re.test(text)).toBe(false);
  });
});

describe('patched modules agree with the originals', () => {
  test.each(widthFiles)('string-width in %s, with each option that changes the count', async (file) => {
    const [real, fast] = [await load<Width>(file), await patched<Width>(file)];
    for (const options of [undefined, { ambiguousIsNarrow: false }, { countAnsiEscapeCodes: true }]) {
      for (const text of SAMPLES) expect([text, options, fast(text, options)]).toEqual([text, options, real(text, options)]);
    }
  });

  test('the styled-text tokenizer', async () => {
    const [real, fast] = [await load<Tokenize>(tokenizeIndex, 'tokenize'), await patched<Tokenize>(tokenizeIndex, 'tokenize')];
    for (const text of SAMPLES) {
      expect([text, fast(text)]).toEqual([text, real(text)]);
      expect([text, fast(text, 3)]).toEqual([text, real(text, 3)]);
    }
  });

  test('the style differ, on the styles of every pair of sample characters', async () => {
    const tokenize = await load<Tokenize>(tokenizeIndex, 'tokenize');
    const toStyled = await load<(tokens: unknown[]) => Styled[]>(tokenizeIndex, 'styledCharsFromTokens');
    const styles = SAMPLES.flatMap((text) => toStyled(tokenize(text)).map((c) => c.styles));
    const [real, fast] = [await load<Diff>(tokenizeIndex, 'diffAnsiCodes'), await patched<Diff>(tokenizeIndex, 'diffAnsiCodes')];
    expect(styles.some((s) => s.length > 1)).toBe(true);
    for (const from of styles) for (const to of styles) expect(fast(from, to)).toEqual(real(from, to));
  });

  test('slice-ansi', async () => {
    const [real, fast] = [await load<Slice>(sliceIndex), await patched<Slice>(sliceIndex)];
    for (const text of SAMPLES) expect([text, fast(text, 1, 6)]).toEqual([text, real(text, 1, 6)]);
  });
});

describe("Ink's Output with caches and row texts kept across frames", () => {
  type Output = { write(x: number, y: number, text: string, options: { transformers: unknown[] }): void; get(): { output: string; height: number } };
  type OutputClass = new (size: { width: number; height: number }) => Output;
  const outputFile = join(dirname(here.resolve('ink')), 'output.js');

  test('draws every frame of a sequence exactly as the original', async () => {
    const [Real, Fast] = [await load<OutputClass>(outputFile), await patched<OutputClass>(outputFile)];
    // Frames that keep some lines, change others, move text and mix styles, wide and plain text.
    const frames: [number, number, string][][] = [
      [[0, 0, SAMPLES[3]], [2, 1, 'RS1 3k09'], [0, 3, SAMPLES[7]]],
      [[0, 0, SAMPLES[3]], [2, 1, 'RS1 3k16'], [0, 3, SAMPLES[7]]],
      [[1, 0, SAMPLES[3]], [2, 1, 'RS1 3k16'], [0, 2, SAMPLES[4]]],
      [[0, 0, SAMPLES[2]], [0, 1, SAMPLES[13]], [0, 2, '\u001B[1m漢\u001B[22m ok'], [3, 3, SAMPLES[5]]],
      [[0, 0, SAMPLES[2]], [0, 1, SAMPLES[13]], [0, 2, '\u001B[1m漢\u001B[22m ok'], [3, 3, SAMPLES[5]]],
      [],
    ];
    for (const frame of frames) {
      const [a, b] = [new Real({ width: 24, height: 4 }), new Fast({ width: 24, height: 4 })];
      for (const [x, y, text] of frame) {
        a.write(x, y, text, { transformers: [] });
        b.write(x, y, text, { transformers: [] });
      }
      expect(b.get()).toEqual(a.get());
    }
  });
});

describe('conf with its validator loaded on first use', () => {
  type Store = { get(key: string): unknown; set(key: string, value: unknown): void };
  type ConfClass = new (options: object) => Store;

  test('keeps values, and a schema still refuses a wrong type', async () => {
    const Conf = await patched<ConfClass>(confIndex);
    const cwd = mkdtempSync(join(tmpdir(), 'tapline-conf-'));
    const plain = new Conf({ cwd, configName: 'plain', projectVersion: '1.0.0', migrations: { '1.0.0': (store: Store) => store.set('migrated', true) } });
    plain.set('series', 'E96');
    expect(plain.get('series')).toBe('E96');
    expect(plain.get('migrated')).toBe(true);
    const checked = new Conf({ cwd, configName: 'checked', schema: { trials: { type: 'number' } } });
    expect(() => checked.set('trials', 'many')).toThrow(/trials/);
  });
});

describe('patches', () => {
  test.each(patchedFiles)('apply to the installed %s', (file) => {
    const patch = PATCHES.find((p) => p.file.test(file));
    expect(patch).toBeDefined();
    expect(patch!.apply(readFileSync(file, 'utf8'))).not.toBeNull();
  });

  test('a changed file is refused, not silently skipped', () => {
    for (const p of PATCHES) expect(p.apply('export default function somethingElse() {}')).toBeNull();
  });
});
