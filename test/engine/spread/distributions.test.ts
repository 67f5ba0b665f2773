import { describe, expect, test } from 'vitest';
import { createRng, drawUnit, unitStandardDeviation } from '../../../src/engine/spread/distributions';

describe('seeded generator', () => {
  test('the same (seed, stream) gives the same sequence, bit for bit', () => {
    const a = createRng(42, 7);
    const b = createRng(42, 7);
    for (let i = 0; i < 100; i++) expect(a.next()).toBe(b.next());
  });

  test('neighbouring streams differ from their first draw', () => {
    expect(createRng(42, 7).next()).not.toBe(createRng(42, 8).next());
  });

  test('draws are uniform on [0, 1): mean 1/2 and variance 1/12 within 5 standard errors', () => {
    // Moments of the uniform distribution (JCGM 100:2008, 4.3.7); N = 100 000.
    const rng = createRng(1);
    const n = 100_000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const v = rng.next();
      if (v < 0 || v >= 1) throw new Error(`draw ${v} outside [0, 1)`);
      s += v;
      s2 += v * v;
    }
    const mean = s / n;
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(s2 / n - mean * mean - 1 / 12)).toBeLessThan(5 * Math.sqrt(1 / 180 / n));
  });
});

describe('unit draws', () => {
  test('a truncated normal draw never leaves [-1, 1]', () => {
    const rng = createRng(3);
    let worst = 0;
    for (let i = 0; i < 50_000; i++) worst = Math.max(worst, Math.abs(drawUnit(rng, 'normal')));
    expect(worst).toBeLessThanOrEqual(1);
  });

  test.each(['uniform', 'normal'] as const)('%s draws have the stated standard deviation within 2 %', (kind) => {
    // Uniform: a/sqrt(3) (JCGM 100:2008, 4.3.7); normal: 1/3 truncated at 3 sigma, whose variance
    // is 1 − 2·3·φ(3)/(2Φ(3) − 1) (textbook truncated-normal moments). N = 100 000.
    const rng = createRng(11);
    const n = 100_000;
    let s2 = 0;
    for (let i = 0; i < n; i++) s2 += drawUnit(rng, kind) ** 2;
    expect(Math.sqrt(s2 / n) / unitStandardDeviation(kind)).toBeCloseTo(1, 1.6);
  });

  test('the truncated normal sigma is just under 1/3 (0.32886, by the truncated-normal formula)', () => {
    expect(unitStandardDeviation('normal')).toBeCloseTo(0.32886, 5);
  });
});
