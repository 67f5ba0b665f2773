import type { Channel, Design, PartClass } from '../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../src/engine/parts';

/**
 * An idealised open-collector comparator class for closed-form checks: no offset, no bias current,
 * a saturated output of exactly `vsat0` (rsat tiny), wide common-mode range.
 */
export function idealPart(over: Partial<PartClass> = {}): PartClass {
  return {
    id: 'ideal-oc',
    description: 'ideal open-collector comparator for tests',
    output: 'open-collector',
    supplyMin: 0,
    supplyMax: 100,
    absMaxSupply: 100,
    iqPerPackage: 0,
    vosTyp: 0,
    vosMax: 0,
    ibTyp: 0,
    ibMax: 0,
    biasDirection: 'out',
    cmMin: -100,
    cmHeadroom: -100,
    vsat0: 0,
    rsat: 1e-6,
    sinkMax: 1,
    vohDrop: 0,
    rout: 1,
    ...over,
  };
}

/** A minimal design around the given channels and string; every field can be overridden. */
export function makeDesign(over: Partial<Design> & { channels: Channel[] }): Design {
  return {
    format: 1,
    name: 'test',
    notes: '',
    quantity: { name: 'input voltage', unit: 'V', min: 0, max: 10, noise: 0 },
    input: { signal: 'voltage', offset: 0, gain: 1 },
    supply: { kind: 'fixed', volts: 12, min: 12, max: 12 },
    reference: { kind: 'external', volts: 5, tolerance: 0 },
    part: idealPart(),
    string: [10e3, 10e3],
    rails: [],
    spares: [],
    resistorTolerance: 0.01,
    series: 'E96',
    ...over,
  };
}

/** A channel with the signal on the inverting input and a tap on the non-inverting one. */
export function stepChannel(id: string, channel: number, tap: string, extra: Partial<Channel> = {}): Channel {
  return { id, label: id, package: 1, channel, plus: tap, minus: 'in', ...extra };
}

/**
 * A four-step bar string on one quad: external reference, five string resistors, each channel with
 * feedback into its tap and an LED load from the supply. The shared-string coupling case.
 */
export function fourStepDesign(feedback = 1e6): Design {
  const led = { ohms: 1.8e3, knee: 1.9, rdyn: 20, anode: 'supply' };
  return makeDesign({
    quantity: { name: 'input voltage', unit: 'V', min: 0, max: 5, noise: 0 },
    reference: { kind: 'external', volts: 5, tolerance: 0 },
    string: [20e3, 2e3, 2e3, 2e3, 20e3],
    channels: [1, 2, 3, 4].map((k) =>
      stepChannel(`S${k}`, k, `T${5 - k}`, { feedback: { ohms: feedback, to: 'plus' }, led: { ...led } }),
    ),
  });
}

/**
 * The benchmark design (engine and spread): eight bar steps on two bipolar open-collector quads,
 * powered by the 24 V-class battery it measures, input divider, shunt reference, feedback into each
 * tap and an LED per step.
 */
export function eightStepDesign(): Design {
  const led = { ohms: 8.2e3, knee: 1.9, rdyn: 20, anode: 'supply' };
  return makeDesign({
    quantity: { name: 'battery voltage', unit: 'V', min: 18, max: 30, noise: 0.05 },
    supply: { kind: 'measured' },
    input: { signal: 'voltage', offset: 0, gain: 1, divider: { top: 100e3, bottom: 10e3 } },
    reference: { kind: 'shunt', volts: 2.5, bias: 10e3, rdyn: 0.2, minCurrent: 1e-3, maxCurrent: 0.1, tolerance: 0.005 },
    part: { ...BUILTIN_PARTS['bipolar-oc-quad'] },
    string: [4.7e3, 1e3, 1e3, 1e3, 1e3, 1e3, 1e3, 1e3, 27e3],
    channels: Array.from({ length: 8 }, (_, k) =>
      stepChannel(`S${k + 1}`, (k % 4) + 1, `T${8 - k}`, { package: Math.floor(k / 4) + 1, feedback: { ohms: 4.7e6, to: 'plus' }, led: { ...led } }),
    ),
  });
}
