import { describe, expect, it } from 'vitest';
import { assignDesignators } from '../../../src/engine/export/designators';
import { fourStepDesign } from '../../helpers/designs';

// Reference: the sequential class-letter convention of IEEE 315 / IEC 81346 (R resistors, D diodes,
// U integrated circuits), from memory; numbering order is our own and stated in the module.
describe('assignDesignators', () => {
  const ds = assignDesignators(fourStepDesign());

  it('numbers the string first, top to bottom', () => {
    expect(['RS1', 'RS2', 'RS3', 'RS4', 'RS5'].map(ds.of)).toEqual(['R1', 'R2', 'R3', 'R4', 'R5']);
  });

  it('continues per channel with feedback then LED resistor', () => {
    expect([ds.of('RF:S1'), ds.of('RL:S1'), ds.of('RF:S2'), ds.of('RL:S2')]).toEqual(['R6', 'R7', 'R8', 'R9']);
  });

  it('gives LEDs D1.. and comparator units package letter by channel', () => {
    expect([ds.of('D:S1'), ds.of('D:S4'), ds.unitOf('S1'), ds.unitOf('S4')]).toEqual(['D1', 'D4', 'U1A', 'U1D']);
  });

  it('never gives two parts the same designator', () => {
    const refs = ds.entries.map((e) => e.ref);
    expect(new Set(refs).size).toBe(refs.length);
  });
});
