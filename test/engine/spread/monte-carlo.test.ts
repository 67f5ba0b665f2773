import { createHash } from 'node:crypto';
import { describe, expect, test } from 'vitest';
import { buildSpreadModel } from '../../../src/engine/spread/model';
import { joinBlocks, runTrials } from '../../../src/engine/spread/monte-carlo';
import { eightStepDesign, fourStepDesign } from '../../helpers/designs';
import { dividerDesign, smallFeedbackDesign } from '../../helpers/spread-designs';

describe('Monte Carlo trials', () => {
  test('the same seed gives the same numbers, bit for bit', () => {
    const model = buildSpreadModel(smallFeedbackDesign());
    const a = runTrials(model, 7, 0, 200);
    const b = runTrials(model, 7, 0, 200);
    expect(Array.from(a.rising)).toEqual(Array.from(b.rising));
    expect(Array.from(a.falling)).toEqual(Array.from(b.falling));
  });

  test('a different seed gives different numbers', () => {
    const model = buildSpreadModel(smallFeedbackDesign());
    expect(runTrials(model, 7, 0, 20).rising).not.toEqual(runTrials(model, 8, 0, 20).rising);
  });

  test('splitting the trials into ranges (as threads do) changes nothing', () => {
    const model = buildSpreadModel(smallFeedbackDesign());
    const whole = runTrials(model, 99, 0, 300);
    const parts = joinBlocks([runTrials(model, 99, 170, 300), runTrials(model, 99, 0, 53), runTrials(model, 99, 53, 170)], 1);
    expect(Array.from(parts.rising)).toEqual(Array.from(whole.rising));
    expect(Array.from(parts.falling)).toEqual(Array.from(whole.falling));
  });

  test('divider tap spread matches first-order propagation of uncertainty within 2 %', () => {
    // Unloaded divider V·R2/(R1+R2), V = 5 V, R1 = R2 = 10 kΩ, ±1 % uniform, ideal comparator: the
    // rising trip equals the tap voltage. JCGM 100:2008 eq. (10): u² = Σ (∂f/∂Ri)² u²(Ri) with the
    // uniform u(Ri) = a/sqrt(3) (4.3.7); ∂f/∂R1 = −V·R2/(R1+R2)², ∂f/∂R2 = V·R1/(R1+R2)².
    // 20 000 trials: the sampling error of the standard deviation is about 0.5 %.
    const design = dividerDesign();
    const model = buildSpreadModel(design, { distributions: { resistor: 'uniform' } });
    expect(model.params.map((p) => p.id)).toEqual(['RS1', 'RS2']);
    const block = runTrials(model, 2024, 0, 20_000);
    const xs = Array.from(block.rising);
    const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
    const sd = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
    const [V, R1, R2] = [5, 10e3, 10e3];
    const u = (0.01 * 10e3) / Math.sqrt(3);
    const d1 = (-V * R2) / (R1 + R2) ** 2;
    const d2 = (V * R1) / (R1 + R2) ** 2;
    const analytic = Math.sqrt((d1 * u) ** 2 + (d2 * u) ** 2);
    expect(Math.abs(sd / analytic - 1)).toBeLessThan(0.02);
    expect(mean).toBeCloseTo(2.5, 3);
  });

  test('trials 100..599 of seed 7 are bit for bit those recorded before the trial speed-ups', () => {
    // Regression pin: SHA-256 (first 128 bits) of the rising, falling and chatter arrays as the engine
    // produced them at commit 09486d4, before the speed-ups that must not change any number.
    const pins: [string, Parameters<typeof buildSpreadModel>[0], string][] = [
      ['eight steps', eightStepDesign(), 'a8d42e0a4830b6cc8607da6837d2bdc7'],
      ['four steps, 470k feedback', fourStepDesign(470e3), '68ebae3921fc9dfb1f43e75bf7bb2edc'],
      ['one step with feedback', smallFeedbackDesign(), '996b3e9149c32d63bd4a642ae8fb8a01'],
    ];
    for (const [name, design, pin] of pins) {
      const b = runTrials(buildSpreadModel(design), 7, 100, 600);
      const hash = createHash('sha256').update(new Uint8Array(b.rising.buffer)).update(new Uint8Array(b.falling.buffer)).update(b.chatter).digest('hex');
      expect(`${name}: ${hash.slice(0, 32)}`).toBe(`${name}: ${pin}`);
    }
  });
});
