import { expect, test } from 'vitest';
import { parseValue, withUnitReader } from '../../src/engine/values';

// The unit reader (mathjs) is loaded only when some text needs it. This file runs in its own module
// instance, so the reader starts unloaded; the tests run in order.

test('common forms read without the unit reader: RKM, SI prefix, the unit symbol', () => {
  // IEC 60062 RKM code 4k7 = 4700 ohms; "50 mV" = 0.05 V by the SI prefix milli.
  expect(parseValue('4k7', 'ohm')).toEqual({ ok: true, value: 4700 });
  expect(parseValue('4.7 kohm', 'ohm')).toEqual({ ok: true, value: 4700 });
  expect(parseValue('50 mV', 'V')).toEqual({ ok: true, value: 0.05 });
});

test('a unit name needs the reader: refused and marked until it is loaded', () => {
  const r = parseValue('3 volts', 'V');
  expect(r.ok).toBe(false);
  expect(!r.ok && r.needsUnitReader).toBe(true);
});

test('withUnitReader loads the reader and reads again', async () => {
  // 3 volts = 3 V (SI base unit).
  expect(await withUnitReader(() => parseValue('3 volts', 'V'))).toEqual({ ok: true, value: 3 });
  expect(parseValue('3 volts', 'V')).toEqual({ ok: true, value: 3 });
});
