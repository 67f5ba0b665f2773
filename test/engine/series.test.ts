import { describe, expect, test } from 'vitest';
import type { SeriesName } from '../../src/engine/design/types.js';
import {
  SERIES, isInSeries, nearestInSeries, parseSeriesName, seriesNeighbours, stepInSeries,
} from '../../src/engine/series.js';
import { iecTable } from '../helpers/iec-60063.js';

const NAMES: SeriesName[] = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'];

/** The generating formula 10^(i/n), rounded as the standard rounds it (handbook formula). */
function formula(n: number, i: number): number {
  return Number((10 ** (i / n)).toFixed(n <= 24 ? 1 : 2));
}

describe('SERIES tables', () => {
  // IEC 60063: series En has n values per decade.
  test.each(NAMES)('%s has n values per decade', (name) => {
    expect(SERIES[name]).toHaveLength(Number(name.slice(1)));
  });

  // IEC 60063:2015 tables, from memory (test/helpers/iec-60063.ts); exact equality.
  test.each(NAMES)('%s equals the IEC 60063 table', (name) => {
    expect([...SERIES[name]]).toEqual(iecTable(name));
  });

  // IEC 60063: mantissas lie in [1, 10), strictly ascending.
  test.each(NAMES)('%s is ascending within [1, 10)', (name) => {
    const t = SERIES[name];
    expect(t[0]).toBe(1);
    expect(t[t.length - 1]).toBeLessThan(10);
    for (let i = 1; i < t.length; i += 1) expect(t[i]).toBeGreaterThan(t[i - 1]);
  });

  // Formula 10^(i/24) rounded to 2 digits vs the E24 table: the historic values differ
  // (IEC 60063, from memory: 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2; the formula gives 2.6 2.9 3.2 3.5 3.8 4.2 4.6 8.3).
  test('E24 departs from the rounding formula exactly at its historic values', () => {
    const diffs = SERIES.E24.map((v, i) => [v, formula(24, i)]).filter(([v, f]) => v !== f);
    expect(diffs).toEqual([
      [2.7, 2.6], [3.0, 2.9], [3.3, 3.2], [3.6, 3.5], [3.9, 3.8], [4.3, 4.2], [4.7, 4.6], [8.2, 8.3],
    ]);
  });

  // IEC 60063, from memory: E48 and E96 follow 10^(i/n) rounded to 3 digits with no exception.
  test.each(['E48', 'E96'] as SeriesName[])('%s follows the rounding formula', (name) => {
    const t = SERIES[name];
    expect(t.map((_, i) => formula(t.length, i))).toEqual([...t]);
  });

  // IEC 60063, from memory: E192's only departure from the formula is 9.20 (formula 9.19).
  test('E192 departs from the rounding formula only at 9.20', () => {
    const diffs = SERIES.E192.map((v, i) => [v, formula(192, i)]).filter(([v, f]) => v !== f);
    expect(diffs).toEqual([[9.2, 9.19]]);
  });

  // Property of the standard: each series holds every value of the next coarser one.
  test.each([['E3', 'E6'], ['E6', 'E12'], ['E12', 'E24'], ['E48', 'E96'], ['E96', 'E192']] as const)(
    'every %s value is in %s', (coarse, fine) => {
      for (const v of SERIES[coarse]) expect(SERIES[fine]).toContain(v);
    },
  );

  // Property of the standard: E96 is every second E192 value, E48 every second E96 value.
  test.each([['E48', 'E96'], ['E96', 'E192']] as const)('%s is every second value of %s', (coarse, fine) => {
    expect(SERIES[fine].filter((_, i) => i % 2 === 0)).toEqual([...SERIES[coarse]]);
  });

  // IEC 60063, from memory: the two families are separate; 2.7 (E12) is 2.74 in E96 and 2.71 in E192.
  test('E24 is not contained in E192', () => {
    expect(SERIES.E192).not.toContain(2.7);
  });
});

describe('nearestInSeries', () => {
  // Log-scale midpoints computed by hand: sqrt(3900·4700) = 4281 Ω, sqrt(8.2·10) = 9.055.
  test.each([
    [4500, 'E12', 4700], [4281, 'E12', 3900], [4282, 'E12', 4700], [9.1, 'E12', 10], [9.0, 'E12', 8.2],
    [0.95, 'E6', 1], [4.69e3, 'E24', 4700], [9.19e5, 'E192', 9.2e5], [123456, 'E96', 124000],
  ] as const)('%d in %s is %d (exact)', (value, series, expected) => {
    expect(nearestInSeries(value, series)).toBe(expected);
  });

  // Exactness requirement: values come out as the decimal number, not 0.1·47-style binary noise.
  test('results are exact decimals in every decade from 1 mΩ to 1 GΩ', () => {
    for (let d = -3; d <= 9; d += 1) {
      for (const m of SERIES.E96) {
        const v = nearestInSeries(m * 10 ** d * 1.0004, 'E96');
        expect(v).toBe(Number(`${m}e${d}`));
      }
    }
  });

  test('a value that is not positive is a RangeError', () => {
    expect(() => nearestInSeries(0, 'E12')).toThrow(RangeError);
    expect(() => nearestInSeries(Number.NaN, 'E12')).toThrow(RangeError);
  });
});

describe('stepInSeries', () => {
  // E12 table (IEC 60063): ... 3.3 3.9 4.7 5.6 6.8 8.2 | 10 ...
  test.each([
    [4700, 1, 5600], [4700, -1, 3900], [8200, 1, 10000], [10000, -1, 8200], [1, -1, 0.82],
    [4700, 3, 8200], [4700, 4, 10000], [0.47, 1, 0.56],
  ])('E12: %d stepped by %d is %d (exact)', (value, steps, expected) => {
    expect(stepInSeries(value, 'E12', steps)).toBe(expected);
  });

  // Off-series start: the first step lands on the series value just above or below.
  test.each([[4500, 1, 4700], [4500, -1, 3900], [4500, 2, 5600], [4500, -2, 3300], [4500, 0, 4700]])(
    'E12: off-series %d stepped by %d is %d', (value, steps, expected) => {
      expect(stepInSeries(value, 'E12', steps)).toBe(expected);
    },
  );

  test('a fractional step count is a RangeError', () => {
    expect(() => stepInSeries(4700, 'E12', 0.5)).toThrow(RangeError);
  });
});

describe('seriesNeighbours', () => {
  // E12 table (IEC 60063).
  test('a series value is included with k values on each side', () => {
    expect(seriesNeighbours(4700, 'E12', 2)).toEqual([3300, 3900, 4700, 5600, 6800]);
  });

  test('an off-series value gives k below and k above', () => {
    expect(seriesNeighbours(4500, 'E12', 2)).toEqual([3300, 3900, 4700, 5600]);
  });

  test('neighbours cross decades', () => {
    expect(seriesNeighbours(1000, 'E6', 1)).toEqual([680, 1000, 1500]);
  });
});

describe('isInSeries', () => {
  // E192 has 9.20, not 9.19; E12 has 4.7 (IEC 60063 tables, from memory).
  test.each([
    [4700, 'E12', true], [0.47 * 10000, 'E12', true], [4750, 'E12', false], [9.2e3, 'E192', true],
    [9.19e3, 'E192', false], [2700, 'E192', false], [0, 'E12', false], [Number.NaN, 'E12', false],
  ] as const)('%d in %s: %s', (value, series, expected) => {
    expect(isInSeries(value, series)).toBe(expected);
  });
});

describe('parseSeriesName', () => {
  test.each([['E24', 'E24'], ['e96', 'E96'], [' E 12 ', 'E12'], ['192', 'E192']])('%j reads as %s', (text, name) => {
    expect(parseSeriesName(text)).toBe(name);
  });

  test.each(['E25', 'E', 'x24', ''])('%j is not a series', (text) => {
    expect(parseSeriesName(text)).toBeNull();
  });
});
