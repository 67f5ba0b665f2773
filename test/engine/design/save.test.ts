import { describe, expect, test } from 'vitest';
import { parseDesign } from '../../../src/engine/design/load';
import { designToFile } from '../../../src/engine/design/save';
import type { Design } from '../../../src/engine/design/types';
import { demoCopy } from '../../helpers/design-fixtures';

function demoDesign(): Design {
  const result = parseDesign(demoCopy());
  if (!result.ok) throw new Error('demo refused');
  return result.design;
}

function reload(design: Design): Design {
  const result = parseDesign(JSON.parse(JSON.stringify(designToFile(design))));
  if (!result.ok) throw new Error(JSON.stringify(result.problems));
  return result.design;
}

describe('designToFile', () => {
  test('the demo survives a save and load unchanged (exact equality)', () => {
    const design = demoDesign();
    expect(reload(design)).toEqual(design);
  });

  test('writes resistors as RKM codes', () => {
    // IEC 60062 RKM: 3090 Ω = 3k09, 845 Ω = 845R, 25 500 Ω = 25k5, 2.55 MΩ = 2M55.
    const file = designToFile(demoDesign());
    expect(file.string).toEqual(['3k09', '845R', '845R', '845R', '25k5']);
    expect(file.channels[0].feedback?.resistor).toBe('2M55');
  });

  test('writes other values as engineering text with units', () => {
    // SI prefixes (BIPM SI Brochure, 9th ed., table 7): 1e-4 A = 100 µA, 0.05 V = 50 mV.
    const file = designToFile(demoDesign());
    expect([file.targets?.stringBudget, file.quantity.noise, file.resistors.tolerance]).toEqual(['100 µA', '50 mV', '1 %']);
  });

  test('resistor values off any series still round-trip exactly', () => {
    const design = demoDesign();
    design.string = [12345.678, 0.1 + 0.2, 1 / 3, 4.7e6, 1e-3];
    expect(reload(design).string).toEqual(design.string);
  });

  test('writes only the part fields that differ from the built-in class', () => {
    const design = demoDesign();
    design.part = { ...design.part, vosMax: 5e-3 };
    const file = designToFile(design);
    expect(file.part).toEqual({ class: 'bipolar-oc-quad', vosMax: '5 mV' });
    expect(reload(design).part.vosMax).toBe(5e-3);
  });

  test('keys come out in a fixed order', () => {
    const design = demoDesign();
    const shuffled = Object.fromEntries(Object.entries(design).reverse()) as unknown as Design;
    expect(JSON.stringify(designToFile(shuffled))).toBe(JSON.stringify(designToFile(design)));
    expect(Object.keys(designToFile(design))).toEqual([
      'format', 'name', 'notes', 'quantity', 'input', 'supply', 'reference', 'part', 'string', 'rails', 'channels',
      'spares', 'resistors', 'battery', 'targets',
    ]);
  });
});
