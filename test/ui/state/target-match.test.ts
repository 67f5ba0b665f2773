import { describe, expect, it } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { matchTargets, targetPoints } from '../../../src/ui/state/target-match';
import { demoDesign } from '../../helpers/ui';

describe('target match', () => {
  it('lists the demo bar thresholds in order', () => {
    // presets/lead-acid-12v-gauge.tapline.json: 11.8, 12.1, 12.4, 12.7 V.
    expect(targetPoints(demoDesign()).map((p) => p.x)).toEqual([11.8, 12.1, 12.4, 12.7]);
  });

  it('pairs each demo channel with its own step on the rising edge', () => {
    const d = demoDesign();
    const m = matchTargets(d, analyze(d).channels);
    expect(Object.fromEntries(Object.entries(m).map(([k, v]) => [k, v.target.x]))).toEqual({ S1: 11.8, S2: 12.1, S3: 12.4, S4: 12.7 });
    // The preset's values realise each step within 20 mV (its stated design intent).
    for (const v of Object.values(m)) expect(Math.abs(v.error)).toBeLessThan(0.02);
  });
});
