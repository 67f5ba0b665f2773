import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { main } from '../../src/cli/main';
import { fakeIo } from '../helpers/io';

const DEMO = 'presets/lead-acid-12v-gauge.tapline.json';

describe('tapline check', () => {
  test('prints the trip table of the demo and exits 0 when clean', async () => {
    const io = fakeIo();
    expect(await main(['check', DEMO], io)).toBe(0);
    expect(io.stdout()).toMatch(/rising \(V\)/);
    expect(io.stdout()).toMatch(/Supply current/);
  });

  test('--json gives package, channel, both trip points, hysteresis, supply current and findings', async () => {
    const io = fakeIo();
    await main(['check', DEMO, '--json'], io);
    const doc = JSON.parse(io.stdout());
    expect(doc.format).toBe('tapline-check/1');
    for (const c of doc.channels) {
      expect(c).toMatchObject({ package: expect.any(Number), channel: expect.any(Number), hysteresis: expect.any(Number) });
      expect(c.rising).toMatchObject({ x: expect.any(Number), pinPlus: expect.any(Number), pinMinus: expect.any(Number) });
      expect(c.falling).toMatchObject({ x: expect.any(Number) });
    }
    expect(doc.supplyCurrent).toMatchObject({ min: expect.any(Number), max: expect.any(Number) });
    expect(Array.isArray(doc.findings)).toBe(true);
  });

  test('a missing file exits 2 with a message naming it', async () => {
    const io = fakeIo();
    expect(await main(['check', 'nope.tapline.json'], io)).toBe(2);
    expect(io.stderr()).toMatch(/nope\.tapline\.json: cannot read the design file: no such file/);
  });

  test('broken JSON exits 2 and says so, without a stack trace', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tapline-'));
    writeFileSync(join(dir, 'bad.tapline.json'), '{ "format": 1, }');
    const io = fakeIo(dir);
    expect(await main(['check', 'bad.tapline.json'], io)).toBe(2);
    expect(io.stderr()).toMatch(/not valid JSON/);
    expect(io.stderr()).not.toMatch(/at .*\.ts:\d+/);
  });

  test('an error-level finding exits 1', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tapline-'));
    const demo = JSON.parse(await import('node:fs').then((fs) => fs.readFileSync(DEMO, 'utf8')));
    demo.channels[0].led.resistor = '10R'; // sinks far beyond the part's rating
    writeFileSync(join(dir, 'hot.tapline.json'), JSON.stringify(demo));
    const io = fakeIo(dir);
    expect(await main(['check', 'hot.tapline.json'], io)).toBe(1);
    expect(io.stdout()).toMatch(/sink-current/);
  });

  test('unknown options exit 2 with usage', async () => {
    const io = fakeIo();
    expect(await main(['check', DEMO, '--frobnicate'], io)).toBe(2);
    expect(io.stderr()).toMatch(/Usage: tapline check/);
  });

  test('--version and --help answer and exit 0', async () => {
    const io = fakeIo();
    expect(await main(['--version'], io)).toBe(0);
    expect(io.stdout()).toMatch(/^\d+\.\d+\.\d+/);
    expect(await main(['--help'], io)).toBe(0);
    expect(io.stdout()).toMatch(/tapline check FILE/);
  });
});
