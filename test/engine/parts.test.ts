import { describe, expect, test } from 'vitest';
import { BUILTIN_PARTS, resolvePart } from '../../src/engine/parts';

describe('resolvePart', () => {
  test('returns the built-in class when there are no overrides', () => {
    expect(resolvePart('bipolar-oc-quad')).toEqual(BUILTIN_PARTS['bipolar-oc-quad']);
  });

  test('applies overrides without changing the built-in class', () => {
    const part = resolvePart('bipolar-oc-quad', { sinkMax: 16e-3 });
    expect([part?.sinkMax, BUILTIN_PARTS['bipolar-oc-quad'].sinkMax]).toEqual([16e-3, 6e-3]);
  });

  test('gives undefined for an unknown class', () => {
    expect(resolvePart('toString')).toBeUndefined();
  });

  test('the bipolar class saturates near 0.35 V at 4 mA', () => {
    // From memory, check your datasheet: about 0.35 V output low at 4 mA sink.
    const p = BUILTIN_PARTS['bipolar-oc-quad'];
    expect(p.vsat0 + 4e-3 * p.rsat).toBeCloseTo(0.34, 2);
  });
});
