import { all, create } from 'mathjs';
import { beforeAll, describe, expect, test } from 'vitest';
import type { SeriesName } from '../../src/engine/design/types.js';
import { formatBare, formatEng, formatRkm, loadUnitReader, parseValue, type ValueUnit } from '../../src/engine/values.js';
import { iecValues } from '../helpers/iec-60063.js';

// Unit names and wrong-unit messages come from the unit reader, loaded on first need.
beforeAll(() => loadUnitReader());

/** Reference library for unit conversion. */
const math = create(all);

function valueOf(input: string | number, unit: ValueUnit): number {
  const r = parseValue(input, unit);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

function messageOf(input: string | number, unit: ValueUnit): string {
  const r = parseValue(input, unit);
  return r.ok ? `accepted ${r.value}` : r.message;
}

describe('parseValue: RKM codes', () => {
  // IEC 60062 RKM examples, from memory: the letter stands for the decimal point and the multiplier.
  test.each([
    ['4k7', 4700], ['4K7', 4700], ['2R2', 2.2], ['1M0', 1e6], ['0R47', 0.47], ['R47', 0.47],
    ['47k', 47e3], ['100k', 100e3], ['10R', 10], ['1G5', 1.5e9], ['49k9', 49900], ['1k02', 1020], ['2T2', 2.2e12],
  ])('%s is %d Ω (exact)', (text, ohms) => {
    expect(valueOf(text, 'ohm')).toBe(ohms);
  });

  // IEC 60062, from memory: lowercase m is milli, distinct from M (mega); L also marks milliohms.
  test.each([['4m7', 0.0047], ['4L7', 0.0047], ['4M7', 4.7e6]])('%s is %d Ω (exact)', (text, ohms) => {
    expect(valueOf(text, 'ohm')).toBe(ohms);
  });

  // Common practice, no source: the unit symbol or a prefix letter as decimal marker.
  test.each([['2V5', 'V', 2.5], ['4m7', 'V', 0.0047], ['470u', 'A', 470e-6], ['4n7', 'F', 4.7e-9], ['1k5', 'none', 1500]] as const)(
    '%s as %s is %d', (text, unit, value) => {
      expect(valueOf(text, unit)).toBe(value);
    },
  );
});

describe('parseValue: SI prefixes and units', () => {
  // SI Brochure (BIPM, 9th ed.) prefixes: p 1e-12, n 1e-9, µ 1e-6, m 1e-3, k 1e3, M 1e6, G 1e9; exact decimals.
  test.each([
    ['4.7k', 'ohm', 4700], ['4.7 kΩ', 'ohm', 4700], ['4.7kohm', 'ohm', 4700], ['4.7 KΩ', 'ohm', 4700],
    ['470 µA', 'A', 470e-6], ['470uA', 'A', 470e-6], ['470 μA', 'A', 470e-6], ['2.5 V', 'V', 2.5],
    ['50 mV', 'V', 0.05], ['-12 V', 'V', -12], ['100 nF', 'F', 100e-9], ['250 mW', 'W', 0.25],
    ['4700', 'ohm', 4700], ['4.7e3', 'ohm', 4700], [' 4k7 ', 'ohm', 4700],
  ] as const)('%j as %s is %d (exact)', (text, unit, value) => {
    expect(valueOf(text, unit)).toBe(value);
  });

  // Reference: mathjs unit conversion to the SI base unit, relative 1e-12.
  test.each([
    ['4.7 kiloohm', 'ohm'], ['0.0047 megaohm', 'ohm'], ['3 millivolt', 'V'], ['1.5 kV', 'V'],
    ['2 microampere', 'A'], ['0.75 kW', 'W'], ['22 pF', 'F'],
  ] as const)('%j as %s matches mathjs', (text, unit) => {
    const expected = math.unit(text).toNumber(unit);
    expect(valueOf(text, unit)).toBeCloseTo(expected, 12 - Math.ceil(Math.log10(Math.abs(expected))));
  });

  // Definitions: 1 % = 0.01, 1 ppm = 1e-6 (ISO 80000-1); exact decimals.
  test.each([['1 %', 0.01], ['0.5%', 0.005], ['50 ppm', 50e-6], ['0.01', 0.01]])('ratio %j is %d', (text, value) => {
    expect(valueOf(text, 'ratio')).toBe(value);
  });

  test('a number is taken as SI as it is', () => {
    expect(valueOf(4700, 'ohm')).toBe(4700);
  });
});

describe('parseValue: refusals', () => {
  test('an unreadable value names itself and the allowed forms', () => {
    expect(messageOf('4x7', 'ohm')).toBe('"4x7" is not a value in ohms: write 4k7, 4.7k or 4700');
  });

  // mathjs units: mA is a current, s a time.
  test('a value in the wrong unit names what it is and what was expected', () => {
    expect(messageOf('5 mA', 'ohm')).toBe('"5 mA" is a current, not a value in ohms: write 4k7, 4.7k or 4700');
    expect(messageOf('3 s', 'V')).toMatch(/^"3 s" is a time, not a voltage: write /);
  });

  test.each([['-4k7'], ['0'], [0], [-1]])('resistance %j must be > 0', (input) => {
    expect(messageOf(input, 'ohm')).toMatch(/is not allowed: a resistance must be greater than 0 ohms$/);
  });

  test.each([[Number.NaN], [Number.POSITIVE_INFINITY], ['1e400'], ['NaN']])('%j is refused', (input) => {
    expect(parseValue(input, 'V').ok).toBe(false);
  });

  test.each([['-1n', 'F'], ['-1 W', 'W']] as const)('negative %s as %s is refused', (text, unit) => {
    expect(messageOf(text, unit)).toMatch(/must not be negative$/);
  });

  test.each([[''], ['   '], ['V'], ['4,7k'], ['1 %']])('%j is not a resistance', (text) => {
    expect(parseValue(text, 'ohm').ok).toBe(false);
  });
});

describe('formatEng', () => {
  // SI Brochure prefixes; 3 significant digits with trailing zeros kept.
  test.each([
    [4700, 'Ω', '4.70 kΩ'], [470e-6, 'A', '470 µA'], [12.2, 'V', '12.2 V'], [0, 'V', '0 V'], [-0, 'V', '0 V'],
    [-0.05, 'V', '-50.0 mV'], [999.6, 'Ω', '1.00 kΩ'], [1.5e9, 'Ω', '1.50 GΩ'], [22e-12, 'F', '22.0 pF'], [0.1, '', '100m'],
  ])('%d %s is %j', (value, unit, text) => {
    expect(formatEng(value, unit)).toBe(text);
  });

  test('ascii mode writes u and ohm', () => {
    expect(formatEng(4.7e-6, 'A', { ascii: true })).toBe('4.70 uA');
    expect(formatEng(4700, 'Ω', { ascii: true })).toBe('4.70 kohm');
  });

  test('digits sets the significant figures', () => {
    expect(formatEng(4700, 'Ω', { digits: 2 })).toBe('4.7 kΩ');
    expect(formatEng(12.345, 'V', { digits: 4 })).toBe('12.35 V');
  });

  test('non-finite values never print NaN', () => {
    expect(formatEng(Number.NaN, 'V')).toBe('—');
    expect(formatEng(Number.POSITIVE_INFINITY, 'V', { ascii: true })).toBe('-');
  });

  test('magnitudes beyond the prefixes use exponent notation', () => {
    expect(formatEng(1e-20, 'F')).toBe('1.00e-20 F');
  });
});

describe('formatRkm', () => {
  // IEC 60062 RKM examples, from memory.
  test.each([
    [4700, '4k7'], [2.2, '2R2'], [1e6, '1M0'], [100e3, '100k'], [10, '10R'], [0.47, 'R47'], [1.5e9, '1G5'],
    [49900, '49k9'], [1.02e3, '1k02'], [1, '1R0'], [0.1, 'R10'], [0.047, 'R047'], [47, '47R'], [2.2e12, '2T2'],
  ])('%d Ω is %s', (ohms, code) => {
    expect(formatRkm(ohms)).toBe(code);
  });

  test('rounds to the given significant digits', () => {
    expect(formatRkm(4711, 2)).toBe('4k7');
    expect(formatRkm(999.6)).toBe('1k0');
  });

  test.each([[0], [-1], [Number.NaN]])('%d has no code', (ohms) => {
    expect(formatRkm(ohms)).toBe('-');
  });
});

describe('round trips', () => {
  const names: SeriesName[] = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'];

  // IEC 60063 tables (test/helpers/iec-60063.ts), 1 Ω..10 MΩ: parse(formatRkm(v)) is v exactly.
  test.each(names)('every %s value from 1 Ω to 10 MΩ survives formatRkm and parseValue', (name) => {
    for (const v of iecValues(name, 0, 7)) expect(valueOf(formatRkm(v), 'ohm')).toBe(v);
  });

  // 3-digit rounding: the error is at most half a unit in the third digit, i.e. 5e-3 relative.
  test.each([['Ω', 'ohm'], ['V', 'V'], ['A', 'A'], ['W', 'W'], ['F', 'F']] as const)(
    'formatEng(v, %j) reads back within 3-digit rounding', (symbol, unit) => {
      for (let i = 0; i < 2000; i += 1) {
        const v = 10 ** (-12 + i * 0.01237);
        const back = valueOf(formatEng(v, symbol), unit);
        expect(Math.abs(back - v) / v).toBeLessThanOrEqual(5e-3 + 1e-12);
        expect(valueOf(formatEng(v, symbol, { ascii: true }), unit)).toBe(back);
      }
    },
  );
});

describe('formatEng for units that take no SI prefix', () => {
  // SI Brochure (BIPM, 9th ed., §5.4.6): prefixes attach to SI unit symbols; % and °C are written
  // as plain numbers (a prefixed "m%" is not a unit).
  test('percent is written in plain decimals, never with a prefix', () => {
    expect(formatEng(0.258, '%')).toBe('0.258 %');
    expect(formatEng(26.19, '%')).toBe('26.2 %');
  });

  test('degrees Celsius keep the requested significant digits', () => {
    expect(formatEng(80.16, '°C', { digits: 4 })).toBe('80.16 °C');
    expect(formatEng(-10, '°C')).toBe('-10.0 °C');
  });

  test('large plain values are not rounded into exponent notation', () => {
    expect(formatEng(1234.5, 'mm')).toBe('1235 mm');
  });
});

describe('formatBare', () => {
  // Table cells whose column title names the unit: prefixes only where the SI allows them (BIPM SI
  // Brochure, 9th ed., §5.4.6).
  test('volts keep the engineering prefix without the unit', () => {
    expect(formatBare(0.0994, 'V', { digits: 3 })).toBe('99.4m');
  });

  test('percent is written in plain decimals', () => {
    expect(formatBare(0.18, '%', { digits: 2 })).toBe('0.18');
  });
});
