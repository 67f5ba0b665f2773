import { describe, expect, it } from 'vitest';
import { spiceNetlist, spiceNumber } from '../../../src/engine/export/spice';
import { tripTolerance } from '../../../src/engine/export/spice-measures';
import { prepare } from '../../../src/engine/prepare';
import { fourStepDesign } from '../../helpers/designs';
import { loadPresets } from '../../helpers/presets';

// Reference for the element syntax: the SPICE3 input format (Berkeley SPICE3 user's guide, from
// memory) as ngspice reads it: R, V, I, E, G, S, D cards, .model SW/D, .tran, .meas.
describe('spiceNetlist', () => {
  const design = fourStepDesign();
  const text = spiceNetlist(design);

  it('starts with a title comment and ends with .end', () => {
    expect(text.startsWith('* ')).toBe(true);
    expect(text.trimEnd().endsWith('.end')).toBe(true);
  });

  it('ramps x from min to max and back with a PWL source', () => {
    expect(text).toContain('VX x 0 PWL(0 0 1 5 2 0)');
  });

  it('writes each string resistor with its conventional designator and exact value', () => {
    expect(text).toMatch(/^\* RS1\nR1 ref t1 20000$/m);
    expect(text).toMatch(/^\* RS5\nR5 t4 0 20000$/m);
  });

  it('models each comparator as an offset source, a switch and its saturation source', () => {
    expect(text).toMatch(/^VOS_U1A u1a_vos t4 DC 0$/m);
    expect(text).toMatch(/^SU1A out_s1 u1a_s sig u1a_vos SW_U1A OFF$/m);
  });

  it('models each LED as resistor, near-ideal diode, knee source and dynamic resistance', () => {
    expect(text).toMatch(/^D_D1 d1_r d1_j DIDEAL$/m);
    expect(text).toMatch(/^VK_D1 d1_j d1_k DC 1.9$/m);
  });

  it('uses no inline comments, only whole comment lines', () => {
    expect(text).not.toContain(' $ ');
  });

  it('states one .meas per channel and direction', () => {
    expect(text.match(/^\.meas tran /gm)).toHaveLength(8);
  });

  it('prints numbers with 10 significant digits at most', () => {
    expect(spiceNumber(1 / 3)).toBe('0.3333333333');
  });
});

describe('tripTolerance', () => {
  it('is 1 mV of x when x is in volts', () => {
    expect(tripTolerance(prepare(fourStepDesign()))).toBe(1e-3);
  });

  it('is 1 mV at the sense node in x units for a 4-20 mA loop', () => {
    // 0.16 mA per % into 249 ohm is 39.84 mV per %, so 1 mV is 0.0251 % (Ohm's law; the string
    // loads the shunt slightly, hence 3 digits). Precision 3 significant digits.
    const tank = loadPresets().find((p) => p.id === 'tank-level-4-20ma');
    expect(tripTolerance(tank!.prepared)).toBeCloseTo(1e-3 / (0.16e-3 * 249), 3);
  });
});
