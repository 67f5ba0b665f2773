import { describe, expect, test } from 'vitest';
import { runSpread } from '../../../src/engine/spread';
import { percentileSorted } from '../../../src/engine/spread/statistics';
import { idealPart, makeDesign, stepChannel } from '../../helpers/designs';
import { dividerDesign } from '../../helpers/spread-designs';

describe('spread summary', () => {
  test('percentiles interpolate between order statistics (Hyndman and Fan definition 7)', () => {
    // NumPy's default linear method on [1, 2, 3, 4]: the 10th percentile is 1.3, the 99.865th 3.99595.
    expect(percentileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12);
    expect(percentileSorted([1, 2, 3, 4], 0.99865)).toBeCloseTo(3.99595, 12);
  });

  test('two channels on one tap that differ only by offset swap order half the time (symmetry, ±3 % at N = 4000)', () => {
    const design = makeDesign({
      part: idealPart({ vosMax: 5e-3 }),
      reference: { kind: 'external', volts: 5, tolerance: 0 },
      resistorTolerance: 0,
      string: [10e3, 10e3],
      channels: [stepChannel('A', 1, 'T1'), stepChannel('B', 2, 'T1')],
    });
    const r = runSpread(design, { trials: 4000, worstCase: false });
    expect(r.order).toHaveLength(1);
    expect(Math.abs(r.order[0].probability - 0.5)).toBeLessThan(0.03);
  });

  test('well separated steps never swap', () => {
    const design = makeDesign({ string: [10e3, 10e3, 10e3], channels: [stepChannel('A', 1, 'T1'), stepChannel('B', 2, 'T2')] });
    expect(runSpread(design, { trials: 500, worstCase: false }).order[0].probability).toBe(0);
  });

  test('yield counts trials within the allowance of nominal; histogram holds every trial', () => {
    // Divider tap 2.5 V, ±1 % resistors uniform: |Δ| ≤ 25 mV always (worst case 2.5 V · 1 %), so an
    // allowance of 25 mV gives 100 % and 1 µV gives almost none.
    const d = dividerDesign();
    const wide = runSpread(d, { trials: 1000, allowance: 0.025, distributions: { resistor: 'uniform' } });
    const narrow = runSpread(d, { trials: 1000, allowance: 1e-6, distributions: { resistor: 'uniform' } });
    expect(wide.yield).toBe(1);
    expect(narrow.yield!).toBeLessThan(0.01);
    expect(wide.channels[0].rising.histogram.counts.reduce((a, b) => a + b, 0)).toBe(1000);
  });

  test('hysteresis below the stated noise is counted: no feedback means every trial (0 < noise)', () => {
    const d = dividerDesign({ quantity: { name: 'input voltage', unit: 'V', min: 0, max: 5, noise: 0.01 } });
    expect(runSpread(d, { trials: 100, worstCase: false }).channels[0].hysteresis.belowNoise).toBe(1);
  });
});
