import { describe, expect, test } from 'vitest';
import { analyze, probe } from '../../src/engine/analyze';
import { prepare } from '../../src/engine/prepare';
import { idealPart, makeDesign, stepChannel } from '../helpers/designs';

describe('closed forms', () => {
  test('an unloaded divider sits at Vref·R2/(R1+R2) (voltage-divider rule; any circuits text, e.g. Horowitz & Hill, The Art of Electronics, 3rd ed., §1.2.3, from memory) to 1 nV', () => {
    const d = makeDesign({ reference: { kind: 'external', volts: 5, tolerance: 0 }, string: [47e3, 22e3], channels: [] });
    const p = prepare(d);
    expect(probe(p, 1, 'up').nodes.T1).toBeCloseTo((5 * 22e3) / (47e3 + 22e3), 9);
  });

  // Non-inverting reference divider R1 (from Vref) / R2 (to ground) at the + input, feedback Rf from
  // the output, pull-up Rp to Vcc, signal on the − input. Superposition gives the two thresholds:
  //   output high (pulled to Vcc through Rp+Rf): V_H = (Vref/R1 + Vcc/(Rp+Rf)) / (1/R1 + 1/R2 + 1/(Rp+Rf))
  //   output low (0 V):                          V_L = (Vref/R1) / (1/R1 + 1/R2 + 1/Rf)
  // Source: the Schmitt trigger with a reference (bistable circuit) in Sedra & Smith, Microelectronic
  // Circuits, 7th ed., ch. 18, from memory; the equations are the superposition written out.
  const R1 = 100e3;
  const R2 = 68e3;
  const Rf = 1e6;
  const Rp = 10e3;
  const Vref = 5;
  const Vcc = 12;
  const schmitt = makeDesign({
    quantity: { name: 'input', unit: 'V', min: 0, max: 5, noise: 0 },
    supply: { kind: 'fixed', volts: Vcc, min: Vcc, max: Vcc },
    reference: { kind: 'external', volts: Vref, tolerance: 0 },
    string: [R1, R2],
    channels: [stepChannel('A', 1, 'T1', { feedback: { ohms: Rf, to: 'plus' }, pullup: { ohms: Rp, to: 'supply' } })],
  });
  const VH = (Vref / R1 + Vcc / (Rp + Rf)) / (1 / R1 + 1 / R2 + 1 / (Rp + Rf));
  const VL = Vref / R1 / (1 / R1 + 1 / R2 + 1 / Rf);

  test('single open-collector comparator: rising trip equals the textbook upper threshold to 1 µV', () => {
    expect(analyze(schmitt).channels[0].rising?.x).toBeCloseTo(VH, 6);
  });

  test('single open-collector comparator: falling trip equals the textbook lower threshold to 1 µV', () => {
    expect(analyze(schmitt).channels[0].falling?.x).toBeCloseTo(VL, 6);
  });

  test('hysteresis equals V_H − V_L to 1 µV', () => {
    expect(analyze(schmitt).channels[0].hysteresis).toBeCloseTo(VH - VL, 6);
  });
});

describe('a fact of the trade (common practice, no source)', () => {
  // 9 V supply, two 4.7 kΩ in a divider, 100 kΩ from the comparator output to the midpoint.
  const design = makeDesign({
    quantity: { name: 'input', unit: 'V', min: 0, max: 9, noise: 0 },
    supply: { kind: 'fixed', volts: 9, min: 9, max: 9 },
    reference: { kind: 'supply' },
    string: [4.7e3, 4.7e3],
    // A push-pull output that stands at 6.5 V high (2.5 V drop) and 0.48 V low.
    part: idealPart({ output: 'push-pull', vohDrop: 2.5, rout: 1e-6, vsat0: 0.48 }),
    channels: [stepChannel('A', 1, 'T1', { feedback: { ohms: 100e3, to: 'plus' } })],
  });
  const p = prepare(design);

  test('with the output at 6.5 V the midpoint sits near 4.55 V (±5 mV)', () => {
    expect(Math.abs(probe(p, 0.5, 'up').nodes.T1 - 4.55)).toBeLessThan(5e-3);
  });

  test('with the output at 0.48 V the midpoint sits near 4.41 V (±5 mV)', () => {
    expect(Math.abs(probe(p, 8.5, 'up').nodes.T1 - 4.41)).toBeLessThan(5e-3);
  });
});
