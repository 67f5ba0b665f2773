import { describe, expect, test } from 'vitest';
import { main } from '../../src/cli/main';
import { fakeIo } from '../helpers/io';

const DEMO = 'presets/lead-acid-12v-gauge.tapline.json';

describe('tapline spread', () => {
  test('prints nominal, worst-case and Monte Carlo columns per edge, and the battery cautions', async () => {
    const io = fakeIo();
    const code = await main(['spread', DEMO, '--trials', '300', '--threads', '0'], io);
    expect([0, 1]).toContain(code);
    expect(io.stdout()).toMatch(/worst min\s+worst max\s+MC min\s+MC max/);
    expect(io.stdout()).toMatch(/S1\s+rising/);
    expect(io.stdout()).toMatch(/from memory, check your datasheet/);
    expect(io.stdout()).toMatch(/Fuse the sense lead/);
  });

  test('--json gives per-edge statistics, histograms and the seed; the same seed gives the same document', async () => {
    const run = async () => {
      const io = fakeIo();
      await main(['spread', DEMO, '--trials', '200', '--seed', '9', '--threads', '0', '--json'], io);
      return io.stdout();
    };
    const text = await run();
    const doc = JSON.parse(text);
    expect(doc).toMatchObject({ format: 'tapline-spread/1', trials: 200, seed: 9 });
    const rising = doc.channels[0].rising;
    expect(rising.stats).toMatchObject({ min: expect.any(Number), max: expect.any(Number), mean: expect.any(Number), std: expect.any(Number) });
    expect(rising.histogram.counts.reduce((a: number, b: number) => a + b, 0)).toBe(200);
    expect(await run()).toBe(text);
  });

  test('a bad --trials exits 2 naming the option, the value and the fix', async () => {
    const io = fakeIo();
    expect(await main(['spread', DEMO, '--trials', 'many'], io)).toBe(2);
    expect(io.stderr()).toMatch(/--trials: "many" is not a whole number from 1 to 10000000; for example --trials 10000/);
  });

  test('a missing file exits 2 with a message naming it', async () => {
    const io = fakeIo();
    expect(await main(['spread', 'nope.tapline.json'], io)).toBe(2);
    expect(io.stderr()).toMatch(/nope\.tapline\.json: cannot read the design file/);
  });

  test('on a terminal a progress bar reaches 100 % on standard error', async () => {
    const io = { ...fakeIo(), isTty: true };
    let err = '';
    io.err = (t: string) => void (err += t);
    await main(['spread', DEMO, '--trials', '100', '--threads', '0', '--ascii'], io);
    expect(err).toMatch(/Monte Carlo \[#{30}\] 100 %/);
  });
});
