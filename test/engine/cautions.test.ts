import { describe, expect, test } from 'vitest';
import { cautionsFor } from '../../src/engine/cautions';
import { idealPart, makeDesign, stepChannel } from '../helpers/designs';

const base = () => makeDesign({ channels: [stepChannel('A', 1, 'T1')], part: idealPart({ absMaxSupply: 36 }) });
const ids = (d: ReturnType<typeof base>) => cautionsFor(d).map((c) => c.id);

describe('cautions', () => {
  test('a 12 V bench design without a battery gets no caution', () => {
    expect(ids(base())).toEqual([]);
  });

  test.each(['lead-acid', 'AGM', 'lithium-ion', 'LiFePO4'])('a %s battery gets the fault-current and not-protection cautions', (chemistry) => {
    expect(ids({ ...base(), battery: { chemistry, capacityAh: 100 } })).toEqual(['battery-fault-current', 'not-cell-protection']);
  });

  test('a battery of another chemistry still gets the not-protection caution only', () => {
    expect(ids({ ...base(), battery: { chemistry: 'nickel-metal hydride', capacityAh: 2 } })).toEqual(['not-cell-protection']);
  });

  test('a measured voltage above 60 V gets the hazardous-voltage caution (60 V DC touch limit, from memory)', () => {
    const d = base();
    d.quantity = { ...d.quantity, min: 0, max: 340 };
    expect(ids(d)).toContain('hazardous-voltage');
  });

  test('exactly 60 V does not trigger it', () => {
    const d = base();
    d.quantity = { ...d.quantity, max: 60 };
    expect(ids(d)).not.toContain('hazardous-voltage');
  });

  test('a supply above 80 % of the absolute maximum gets the abs-max caution', () => {
    const d = base();
    d.supply = { kind: 'fixed', volts: 30, min: 28, max: 32 };
    expect(ids(d)).toEqual(['abs-max-supply']);
  });

  test('every caution defers to codes, practice or the datasheet', () => {
    const d = { ...base(), battery: { chemistry: 'lead-acid', capacityAh: 100 } };
    d.quantity = { ...d.quantity, max: 100 };
    d.supply = { kind: 'measured' };
    for (const c of cautionsFor(d)) expect(c.text).toMatch(/codes|qualified|datasheet|licensed/);
  });
});
