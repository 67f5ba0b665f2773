import { describe, expect, test } from 'vitest';
import { buildNetwork } from '../../../src/engine/network/build';
import { parameterValue, perturbInto, perturbNetwork, spreadParameters, valueCopy } from '../../../src/engine/spread/perturb';
import { smallFeedbackDesign } from '../../helpers/spread-designs';

describe('uncertain parameters', () => {
  test('a bipolar one-step design has nine parameters, in network order', () => {
    const d = smallFeedbackDesign();
    const ids = spreadParameters(d, buildNetwork(d)).map((p) => p.id);
    expect(ids).toEqual(['RS1', 'RS2', 'RF:A', 'RL:A', 'knee A', 'reference', 'Vos A', 'Ib+ A', 'Ib- A']);
  });

  test('resistor limits follow the design tolerance, or a per-part tolerance (exact)', () => {
    const d = smallFeedbackDesign();
    const ps = spreadParameters(d, buildNetwork(d), { partTolerance: { RS2: 0.001 } });
    expect(ps.find((p) => p.id === 'RS1')).toMatchObject({ lo: 9900, nominal: 10e3, hi: 10100 });
    expect(ps.find((p) => p.id === 'RS2')!.hi).toBeCloseTo(10010, 9);
  });

  test('bias current spans 0 .. maximum around its typical value (class figures, from memory)', () => {
    const d = smallFeedbackDesign();
    const ib = spreadParameters(d, buildNetwork(d)).find((p) => p.id === 'Ib+ A')!;
    expect(ib).toMatchObject({ lo: 0, nominal: d.part.ibTyp, hi: d.part.ibMax });
    expect([parameterValue(ib, -1), parameterValue(ib, 0), parameterValue(ib, 1)]).toEqual([0, d.part.ibTyp, d.part.ibMax]);
  });

  test('a fixed supply wanders over its stated range with the nominal at u = 0', () => {
    const d = { ...smallFeedbackDesign(), supply: { kind: 'fixed' as const, volts: 12, min: 11, max: 14 } };
    const s = spreadParameters(d, buildNetwork(d)).find((p) => p.id === 'supply')!;
    expect([parameterValue(s, -1), parameterValue(s, 0), parameterValue(s, 1)]).toEqual([11, 12, 14]);
  });

  test('perturbing leaves the nominal network untouched', () => {
    const d = smallFeedbackDesign();
    const net = buildNetwork(d);
    const before = JSON.stringify(net);
    const ps = spreadParameters(d, net);
    const moved = perturbNetwork(net, ps, ps.map(() => 1));
    expect(JSON.stringify(net)).toBe(before);
    expect(moved.resistors[0].ohms).toBeCloseTo(10100, 9);
    expect(moved.comparators[0].vos).toBe(d.part.vosMax);
  });

  test('one copy re-valued point after point equals a fresh perturbed copy at each point (exact)', () => {
    // Reference: perturbNetwork, which copies the nominal network anew for every point.
    const d = smallFeedbackDesign();
    const net = buildNetwork(d);
    const ps = spreadParameters(d, net);
    const copy = valueCopy(net);
    for (const u of [1, -1, 0.3, 0]) {
      const units = ps.map((_, k) => (k % 2 ? u : -u));
      perturbInto(copy, ps, units);
      expect(copy).toEqual(perturbNetwork(net, ps, units));
    }
  });
});
