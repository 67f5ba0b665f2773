import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { prepareNetwork } from '../../../src/engine/prepare';
import { buildSpreadModel } from '../../../src/engine/spread/model';
import { runTrials } from '../../../src/engine/spread/monte-carlo';
import { perturbNetwork } from '../../../src/engine/spread/perturb';
import { worstCase } from '../../../src/engine/spread/worst-case';
import { fourStepDesign } from '../../helpers/designs';
import { smallFeedbackDesign } from '../../helpers/spread-designs';

/** Every corner of the parameter box through the full analysis, independently of worstCase. */
function bruteForce(design: ReturnType<typeof smallFeedbackDesign>) {
  const model = buildSpreadModel(design);
  const n = model.params.length;
  const rising: number[] = [];
  const falling: number[] = [];
  const hyst: number[] = [];
  for (let mask = 0; mask < 2 ** n; mask++) {
    const units = Array.from({ length: n }, (_, i) => (mask & (1 << i) ? 1 : -1));
    const a = analyze(design, prepareNetwork(design, perturbNetwork(model.net, model.params, units)));
    const ch = a.channels[0];
    rising.push(ch.rising!.x);
    falling.push(ch.falling!.x);
    hyst.push(ch.hysteresis!);
  }
  const span = (v: number[]) => ({ min: Math.min(...v), max: Math.max(...v) });
  return { n, rising: span(rising), falling: span(falling), hysteresis: span(hyst) };
}

describe('worst case', () => {
  test('corner enumeration attains the brute-force bounds over all corners (1e-12 relative)', () => {
    const design = smallFeedbackDesign();
    const brute = bruteForce(design);
    expect(brute.n).toBe(9);
    const wc = worstCase(buildSpreadModel(design));
    expect(wc.method).toBe('corners');
    for (const key of ['rising', 'falling', 'hysteresis'] as const) {
      expect(wc.channels[0][key].min).toBeCloseTo(brute[key].min, 12);
      expect(wc.channels[0][key].max).toBeCloseTo(brute[key].max, 12);
    }
  });

  test('sensitivity-signed corners find the same bounds as enumeration on a monotone design (1e-12)', () => {
    const model = buildSpreadModel(smallFeedbackDesign());
    const all = worstCase(model);
    const signed = worstCase(model, { maxCornerParameters: 0 });
    expect(signed.method).toBe('sensitivity');
    for (const key of ['rising', 'falling', 'hysteresis'] as const) {
      expect(signed.channels[0][key].min).toBeCloseTo(all.channels[0][key].min!, 12);
      expect(signed.channels[0][key].max).toBeCloseTo(all.channels[0][key].max!, 12);
    }
  });

  test.each([
    ['small design, corners', smallFeedbackDesign()],
    ['four-step bipolar design, signed corners', { ...fourStepDesign(470e3), part: smallFeedbackDesign().part }],
  ])('Monte Carlo extremes lie inside the worst-case bounds: %s', (_, design) => {
    const model = buildSpreadModel(design, { distributions: { resistor: 'uniform', offset: 'uniform', knee: 'uniform', reference: 'uniform' } });
    const wc = worstCase(model);
    const block = runTrials(model, 5, 0, 2000);
    const n = model.channels.length;
    const eps = 1e-9;
    for (let t = 0; t < 2000; t++) {
      for (let k = 0; k < n; k++) {
        const b = wc.channels[k];
        const r = block.rising[t * n + k];
        const f = block.falling[t * n + k];
        expect(r).toBeGreaterThanOrEqual(b.rising.min! - eps);
        expect(r).toBeLessThanOrEqual(b.rising.max! + eps);
        expect(f).toBeGreaterThanOrEqual(b.falling.min! - eps);
        expect(f).toBeLessThanOrEqual(b.falling.max! + eps);
        expect(r - f).toBeGreaterThanOrEqual(b.hysteresis.min! - eps);
        expect(r - f).toBeLessThanOrEqual(b.hysteresis.max! + eps);
      }
    }
  });
});
