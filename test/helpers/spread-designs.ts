import type { Design } from '../../src/engine/design/types';
import { BUILTIN_PARTS } from '../../src/engine/parts';
import { makeDesign, stepChannel } from './designs';

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
