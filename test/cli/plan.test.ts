import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, expect, test } from 'vitest';
import preset from '../../presets/lead-acid-12v-gauge.tapline.json';
import { main } from '../../src/cli/main';
import type { CliIo } from '../../src/io';
import { parseDesignText } from '../../src/store/files';

let dir: string;
let out: string;
let err: string;
const io = (): CliIo => ({ out: (t) => (out += t), err: (t) => (err += t), isTty: false, cwd: dir, env: {} });

beforeEach(async () => {
  dir = await mkdtemp(join(tmpdir(), 'tapline-plan-'));
  out = '';
  err = '';
  await writeFile(join(dir, 'gauge.tapline.json'), JSON.stringify(preset));
});

test('plans the preset, writes FILE.planned.tapline.json that reads back, exit 0', async () => {
  const code = await main(['plan', 'gauge.tapline.json'], io());
  expect(err).toBe('');
  expect(code).toBe(0);
  expect(out).toMatch(/Packages and channels/);
  expect(out).toMatch(/Target vs realised/);
  const text = await readFile(join(dir, 'gauge.planned.tapline.json'), 'utf8');
  const back = await parseDesignText(text, 'gauge.planned.tapline.json');
  expect(back.ok).toBe(true);
});

test('the input file is left alone', async () => {
  const before = await readFile(join(dir, 'gauge.tapline.json'), 'utf8');
  await main(['plan', 'gauge.tapline.json'], io());
  expect(await readFile(join(dir, 'gauge.tapline.json'), 'utf8')).toBe(before);
});

test('--out naming the input is refused without --in-place (exit 2)', async () => {
  expect(await main(['plan', 'gauge.tapline.json', '--out', 'gauge.tapline.json'], io())).toBe(2);
  expect(err).toMatch(/--in-place/);
});

test('--in-place overwrites the input', async () => {
  expect(await main(['plan', 'gauge.tapline.json', '--in-place'], io())).toBe(0);
  const back = await parseDesignText(await readFile(join(dir, 'gauge.tapline.json'), 'utf8'), 'x');
  expect(back.ok && back.design.channels[0].id).toBe('charge-1');
});

test('--json prints rows and problems', async () => {
  expect(await main(['plan', 'gauge.tapline.json', '--json', '--out', 'o.json'], io())).toBe(0);
  const doc = JSON.parse(out);
  expect(doc.rows).toHaveLength(8);
  expect(doc.output).toBe(join(dir, 'o.json'));
});

test('an unmet target exits 1 and says which and why', async () => {
  const bad = structuredClone(preset) as typeof preset;
  bad.targets.functions[0].thresholds = ['12 V', '12.05 V'];
  await writeFile(join(dir, 'bad.tapline.json'), JSON.stringify(bad));
  expect(await main(['plan', 'bad.tapline.json'], io())).toBe(1);
  expect(out).toMatch(/charge: steps .* not more than the hysteresis/);
});

test('an unreadable file exits 2', async () => {
  expect(await main(['plan', 'missing.tapline.json'], io())).toBe(2);
  expect(err).toMatch(/no such file/);
});
