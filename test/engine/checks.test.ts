import { describe, expect, test } from 'vitest';
import { analyze } from '../../src/engine/analyze';
import { fourStepDesign, idealPart, makeDesign, stepChannel } from '../helpers/designs';

const codes = (d: Parameters<typeof analyze>[0]) => analyze(d).findings.map((f) => f.code);

describe('checks', () => {
  test('an open-collector output with no load is reported as floating, with the fix', () => {
    const a = analyze(makeDesign({ channels: [stepChannel('A', 1, 'T1')] }));
    const f = a.findings.find((x) => x.code === 'floating-output');
    expect(f?.part).toBe('A');
    expect(f?.fix).toMatch(/pull-up/);
  });

  test('feedback wired to the inverting input is an error naming the resistor to move', () => {
    const a = analyze(makeDesign({ channels: [stepChannel('A', 1, 'T1', { feedback: { ohms: 1e6, to: 'minus' }, pullup: { ohms: 1e4, to: 'supply' } })] }));
    const f = a.findings.find((x) => x.code === 'negative-feedback');
    expect(f?.severity).toBe('error');
    expect(f?.fix).toMatch(/RF:A/);
  });

  test('unused channels of a used package are reported until listed as spares', () => {
    const d = makeDesign({ channels: [stepChannel('A', 1, 'T1', { pullup: { ohms: 1e4, to: 'supply' } })] });
    expect(codes(d).filter((c) => c === 'unused-floating')).toHaveLength(3);
    d.spares = [2, 3, 4].map((channel) => ({ package: 1, channel, plus: 'gnd', minus: 'ref' }));
    expect(codes(d)).not.toContain('unused-floating');
  });

  test('an input above the common-mode range (supply − headroom) is an error with x and amount', () => {
    // Input straight from x up to 10 V on a 12 V supply with 3 V of headroom: over by up to 1 V.
    const d = makeDesign({ part: idealPart({ cmHeadroom: 3 }), channels: [stepChannel('A', 1, 'T1', { pullup: { ohms: 1e4, to: 'supply' } })] });
    const f = analyze(d).findings.find((x) => x.code === 'common-mode');
    expect(f?.severity).toBe('error');
    expect(f?.x).toBeCloseTo(10, 9);
    expect(f?.amount).toMatch(/1\.00 V above/);
  });

  test('sink current over the rating is an error', () => {
    const d = makeDesign({ part: idealPart({ sinkMax: 1e-3 }), channels: [stepChannel('A', 1, 'T1', { pullup: { ohms: 1e3, to: 'supply' } })] });
    expect(analyze(d).findings.find((x) => x.code === 'sink-current')?.severity).toBe('error');
  });

  test('hysteresis below the stated noise is reported per channel', () => {
    const d = fourStepDesign(100e6);
    d.quantity.noise = 0.05;
    expect(codes(d).filter((c) => c === 'hysteresis-below-noise')).toHaveLength(4);
  });

  test('a shunt reference starved at low x is reported as dropping out', () => {
    const d = makeDesign({
      quantity: { name: 'battery', unit: 'V', min: 3, max: 15, noise: 0 },
      supply: { kind: 'measured' },
      input: { signal: 'voltage', offset: 0, gain: 1, divider: { top: 100e3, bottom: 20e3 } },
      reference: { kind: 'shunt', volts: 2.5, bias: 10e3, rdyn: 0.2, minCurrent: 1e-3, maxCurrent: 0.1, tolerance: 0.005 },
      channels: [stepChannel('A', 1, 'T1', { pullup: { ohms: 1e5, to: 'supply' } })],
    });
    const f = analyze(d).findings.find((x) => x.code === 'reference-dropout');
    expect(f?.x).toBeCloseTo(3, 6);
  });

  test('thresholds on a string fed from a wandering supply are reported with how far they move', () => {
    // String from the 12 V supply (±1 V): a tap at half the supply moves by ±0.5 V (divider rule).
    const d = makeDesign({
      supply: { kind: 'fixed', volts: 12, min: 11, max: 13 },
      reference: { kind: 'supply' },
      channels: [stepChannel('A', 1, 'T1', { pullup: { ohms: 1e4, to: 'supply' } })],
    });
    const f = analyze(d).findings.find((x) => x.code === 'supply-dependent');
    expect(f?.amount).toBe('±500 mV');
  });

  test('a feedback resistor above 10 MΩ is noted, with a fix that keeps the hysteresis (common practice, no source)', () => {
    const f = analyze(fourStepDesign(22e6)).findings.filter((x) => x.code === 'high-resistance');
    expect(f).toHaveLength(4);
    expect(f[0].severity).toBe('info');
    expect(f[0].fix).toMatch(/smaller feedback resistor/);
  });
});
