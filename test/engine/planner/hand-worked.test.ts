import { expect, test } from 'vitest';
import { plan } from '../../../src/engine/planner/index';
import { makeDesign } from '../../helpers/designs';
import { targets } from './fixtures';

// Two steps (2 V and 3 V, 0.1 V hysteresis anchored on the rising edge) on a three-resistor string
// under an ideal 5 V reference, x fed straight to the sense node, ideal open-collector comparators
// with 10 kΩ pull-ups to a 12 V rail and feedback into each step's own tap.
const design = makeDesign({
  quantity: { name: 'input voltage', unit: 'V', min: 0, max: 5, noise: 0 },
  supply: { kind: 'fixed', volts: 12, min: 12, max: 12 },
  reference: { kind: 'external', volts: 5, tolerance: 0 },
  string: [],
  channels: [],
  // Logic loads rather than LEDs, so a released output is simply the pull-up rail.
  targets: targets(
    [
      { kind: 'single', id: 'lo', threshold: 2, hysteresis: 0.1, anchor: 'rising', polarity: 'above', load: 'logic' },
      { kind: 'single', id: 'hi', threshold: 3, hysteresis: 0.1, anchor: 'rising', polarity: 'above', load: 'logic' },
    ],
    { feedback: 'tap', pullup: 10e3, allowance: 0.02 },
  ),
});

test('two-threshold string: realised trips equal hand nodal analysis of the planned values, and meet the targets', () => {
  const result = plan(design);
  expect(result.ok).toBe(true);
  const d = result.design;
  const [r1, r2, r3] = d.string; // T1 (3 V step) under r1, T2 (2 V step) under r2
  const rp = 10e3;
  const rfHi = d.channels.find((c) => c.id === 'hi')!.feedback!.ohms; // into T1
  const rfLo = d.channels.find((c) => c.id === 'lo')!.feedback!.ohms; // into T2

  // Nodal analysis at T1 and T2 (textbook, any circuits text; from memory). A released output is
  // 12 V behind RP + RF into its tap; a sinking one is 0 V behind RF (ideal saturation).
  // (g1 + g2 + G1)·T1 − g2·T2 = g1·5 + G1·E1;  −g2·T1 + (g2 + g3 + G2)·T2 = G2·E2; Cramer's rule.
  const taps = (hiHigh: boolean, loHigh: boolean) => {
    const g1 = 1 / r1, g2 = 1 / r2, g3 = 1 / r3;
    const G1 = hiHigh ? 1 / (rp + rfHi) : 1 / rfHi;
    const G2 = loHigh ? 1 / (rp + rfLo) : 1 / rfLo;
    const b1 = g1 * 5 + G1 * (hiHigh ? 12 : 0);
    const b2 = G2 * (loHigh ? 12 : 0);
    const a11 = g1 + g2 + G1, a22 = g2 + g3 + G2;
    const det = a11 * a22 - g2 * g2;
    return { t1: (b1 * a22 + g2 * b2) / det, t2: (a11 * b2 + g2 * b1) / det };
  };
  // x = V(in); a channel trips when x crosses its tap in the state just before the edge.
  const hand = {
    'lo rising': taps(true, true).t2, // both released below 2 V
    'hi rising': taps(true, false).t1, // lo sinking between the steps
    'hi falling': taps(false, false).t1, // both sinking above 3 V
    'lo falling': taps(true, false).t2, // hi released again, lo still sinking
  };
  for (const row of result.rows) {
    const key = `${row.channel} ${row.edge}` as keyof typeof hand;
    expect(row.realised!).toBeCloseTo(hand[key], 6); // 1e-6 V: ideal-part rsat of 1 µΩ and GMIN
    expect(Math.abs(row.realised! - row.target)).toBeLessThanOrEqual(0.02);
  }

  // Isolated non-inverting Schmitt estimate (textbook; from memory): the tap moves by
  // ΔV ≈ Vhigh·Rth/(Rth + RF + RP) between output states, Rth = tap source resistance.
  // Coupling through the shared string makes the exact value differ by a few per cent at most.
  const total = r1 + r2 + r3;
  const rthT2 = ((r1 + r2) * r3) / total;
  const schmittLo = (12 * rthT2) / (rthT2 + rfLo + rp);
  expect(Math.abs(schmittLo / 0.1 - 1)).toBeLessThan(0.05);
});
