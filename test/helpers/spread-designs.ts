import type { Design } from '../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../src/engine/parts';
import { makeDesign, stepChannel } from './designs';

/**
 * An eight-step battery bar gauge on two bipolar open-collector quads: input divider 20k/10k, an
 * external 5 V reference feeding a nine-resistor string, feedback into each tap and an LED per
 * output. Steps every 0.4 V from 11.0 V to 13.8 V (about 100 µA in the string).
 */
export function eightStepDesign(): Design {
  const led = { ohms: 1.8e3, knee: 1.9, rdyn: 20, anode: 'supply' };
  const steps = 8;
  const top = 4e3;
  const mid = 1.3333e3;
  const bottom = 36.667e3;
  const string = [top, ...Array.from({ length: steps - 1 }, () => mid), bottom];
  return makeDesign({
    quantity: { name: 'battery voltage', unit: 'V', min: 10, max: 15, noise: 0.02 },
    input: { signal: 'voltage', offset: 0, gain: 1, divider: { top: 20e3, bottom: 10e3 } },
    supply: { kind: 'fixed', volts: 12, min: 11.5, max: 12.5 },
    reference: { kind: 'external', volts: 5, tolerance: 0.005 },
    part: { ...BUILTIN_PARTS['bipolar-oc-quad'] },
    string,
    channels: Array.from({ length: steps }, (_, i) =>
      stepChannel(`S${i + 1}`, (i % 4) + 1, `T${steps - i}`, {
        package: i < 4 ? 1 : 2,
        feedback: { ohms: 2.2e6, to: 'plus' },
        led: { ...led },
      }),
    ),
  });
}

/** One step on a 10k/10k string from an external 5 V reference, no loads: the tap sits at 2.5 V. */
export function dividerDesign(over: Partial<Design> = {}): Design {
  return makeDesign({
    quantity: { name: 'input voltage', unit: 'V', min: 0, max: 5, noise: 0 },
    reference: { kind: 'external', volts: 5, tolerance: 0 },
    string: [10e3, 10e3],
    channels: [stepChannel('A', 1, 'T1')],
    ...over,
  });
}

/**
 * One step with feedback and an LED on a bipolar open-collector class: nine uncertain parameters
 * (two string resistors, feedback, LED resistor, LED knee, reference, offset, two bias currents).
 */
export function smallFeedbackDesign(): Design {
  return makeDesign({
    quantity: { name: 'input voltage', unit: 'V', min: 0, max: 5, noise: 0 },
    supply: { kind: 'fixed', volts: 12, min: 12, max: 12 },
    reference: { kind: 'external', volts: 5, tolerance: 0.01 },
    part: { ...BUILTIN_PARTS['bipolar-oc-quad'] },
    string: [10e3, 10e3],
    channels: [stepChannel('A', 1, 'T1', { feedback: { ohms: 470e3, to: 'plus' }, led: { ohms: 2.2e3, knee: 1.9, rdyn: 20, anode: 'supply' } })],
  });
}
