import { beforeAll, describe, expect, test } from 'vitest';
import { formatProblems, parseDesign, type Problem } from '../../../src/engine/design/load';
import { loadUnitReader } from '../../../src/engine/values';
import { demoCopy, lcg } from '../../helpers/design-fixtures';

// Wrong-unit messages ("a current, not ...") come from the unit reader.
beforeAll(() => loadUnitReader());

/** The problems of a file that must fail to load. */
function problemsOf(json: unknown): Problem[] {
  const result = parseDesign(json);
  if (result.ok) throw new Error('expected the file to be refused');
  return result.problems;
}

describe('parseDesign: the demo preset', () => {
  test('loads without problems or warnings', () => {
    const result = parseDesign(demoCopy());
    expect(result.ok && result.warnings).toEqual([]);
  });

  test('reads RKM resistor codes to ohms, exactly', () => {
    const result = parseDesign(demoCopy());
    if (!result.ok) throw new Error('demo refused');
    // IEC 60062 RKM: 3k09 = 3090 Ω, 845R = 845 Ω, 25k5 = 25 500 Ω; 432k, 93k1; 2M55 = 2.55 MΩ.
    expect(result.design.string).toEqual([3090, 845, 845, 845, 25500]);
    expect(result.design.input.divider).toEqual({ top: 432e3, bottom: 93.1e3 });
    expect(result.design.channels[0].feedback).toEqual({ ohms: 2.55e6, to: 'plus' });
  });

  test('reads units and percentages to SI', () => {
    const result = parseDesign(demoCopy());
    if (!result.ok) throw new Error('demo refused');
    // SI prefixes (BIPM SI Brochure, 9th ed., table 7): 50 mV = 0.05 V, 100 uA = 1e-4 A; 1 % = 0.01.
    expect(result.design.quantity.noise).toBe(0.05);
    expect(result.design.targets?.stringBudget).toBe(100e-6);
    expect(result.design.resistorTolerance).toBe(0.01);
  });
});

describe('parseDesign: defaults', () => {
  test('fills the shunt reference from the class defaults', () => {
    const file = demoCopy();
    file.reference = { kind: 'shunt', volts: '2.5 V', bias: '6k19' };
    const result = parseDesign(file);
    // From memory, typical adjustable shunt reference class: 0.2 Ω, 1 mA, 100 mA, 0.5 %.
    expect(result.ok && result.design.reference).toEqual({
      kind: 'shunt', volts: 2.5, bias: 6190, rdyn: 0.2, minCurrent: 1e-3, maxCurrent: 0.1, tolerance: 0.005,
    });
  });

  test('gives an LED without rdyn 20 ohms and a quantity without noise 0', () => {
    const file = demoCopy();
    delete file.channels[0].led.rdyn;
    delete file.quantity.noise;
    const result = parseDesign(file);
    // 20 Ω: common practice, no source.
    expect(result.ok && [result.design.channels[0].led?.rdyn, result.design.quantity.noise]).toEqual([20, 0]);
  });
});

describe('parseDesign: each kind of bad input names its path and the fix', () => {
  test('wrong type', () => {
    const file = demoCopy();
    file.channels[1].package = '1';
    expect(problemsOf(file)).toEqual([
      { path: 'channels[1].package', value: '1', message: 'must be a whole number (package number, 1-based)' },
    ]);
  });

  test('unknown node', () => {
    const file = demoCopy();
    file.channels[2].plus = 'T9';
    expect(problemsOf(file)).toEqual([
      { path: 'channels[2].plus', value: 'T9', message: 'no such node; taps are T1..T4, or use in, ref, supply, gnd, out:<channel id>' },
    ]);
  });

  test('output of an unknown channel', () => {
    const file = demoCopy();
    file.channels[0].minus = 'out:S9';
    expect(problemsOf(file)).toEqual([
      { path: 'channels[0].minus', value: 'out:S9', message: 'no channel "S9"; channels are S1, S2, S3, S4' },
    ]);
  });

  test('duplicate channel id', () => {
    const file = demoCopy();
    file.channels[3].id = 'S1';
    expect(problemsOf(file)).toEqual([
      { path: 'channels[3].id', value: 'S1', message: 'channel ids must be unique; rename this channel' },
    ]);
  });

  test('value that is not a resistance', () => {
    const file = demoCopy();
    file.string[1] = '4x7';
    expect(problemsOf(file)).toEqual([
      { path: 'string[1]', value: '4x7', message: 'not a value in ohms: write 4k7, 4.7k or 4700' },
    ]);
  });

  test('missing field', () => {
    const file = demoCopy();
    delete file.channels[0].minus;
    expect(problemsOf(file)).toEqual([
      { path: 'channels[0].minus', value: undefined, message: 'required field is missing (node on the inverting input)' },
    ]);
  });

  test('two channels in one slot', () => {
    const file = demoCopy();
    file.channels[1].channel = 1;
    expect(problemsOf(file)).toEqual([
      { path: 'channels[1].channel', value: 1, message: 'package 1 channel 1 is already used by channels[0].channel; pick a free slot' },
    ]);
  });

  test('channel 5 of a quad', () => {
    const file = demoCopy();
    file.channels[3].channel = 5;
    expect(problemsOf(file)).toEqual([
      {
        path: 'channels[3].channel', value: 5,
        message: 'must be at most 4 (channel within the quad package, 1..4; a fifth channel goes in the next package)',
      },
    ]);
  });

  test('unknown field', () => {
    const file = demoCopy();
    file.channels[0].feedbak = '1M';
    const [problem] = problemsOf(file);
    expect(problem.path).toBe('channels[0].feedbak');
    expect(problem.message).toMatch(/^unknown field; allowed here: id, label, .*feedback/);
  });

  test('unknown supply kind', () => {
    const file = demoCopy();
    file.supply = { kind: 'battery' };
    expect(problemsOf(file)).toEqual([
      { path: 'supply.kind', value: 'battery', message: 'no such kind; use one of "measured", "fixed"' },
    ]);
  });

  test('unknown part class', () => {
    const file = demoCopy();
    file.part = { class: 'tube-quad' };
    expect(problemsOf(file)[0]).toMatchObject({ path: 'part.class', message: expect.stringMatching(/^no such part class; built-in classes are bipolar-oc-quad/) });
  });

  test('quantity range upside down', () => {
    const file = demoCopy();
    file.quantity.max = '9 V';
    expect(problemsOf(file)[0]).toEqual({ path: 'quantity.max', value: '9 V', message: 'must be greater than quantity.min' });
  });

  test('current signal without a shunt', () => {
    const file = demoCopy();
    file.quantity.unit = 'mA';
    file.supply = { kind: 'fixed', volts: '5 V', min: '4.5 V', max: '5.5 V' };
    file.input = { signal: 'current', offset: '4 mA', gain: 0.001 };
    delete file.targets;
    expect(problemsOf(file)).toContainEqual({
      path: 'input.shunt', value: undefined, message: 'a current signal needs a shunt resistor from in to gnd, e.g. "shunt": "100R"',
    });
  });

  test('supply measured when x is not a voltage', () => {
    const file = demoCopy();
    file.quantity = { name: 'charge', unit: '%', min: 0, max: 100 };
    delete file.targets;
    expect(problemsOf(file)[0]).toMatchObject({ path: 'supply.kind', value: 'measured' });
  });

  test('wiredTo a channel that does not exist', () => {
    const file = demoCopy();
    file.channels[0].wiredTo = 'S7';
    expect(problemsOf(file)).toEqual([
      { path: 'channels[0].wiredTo', value: 'S7', message: 'no such channel; channels are S1, S2, S3, S4' },
    ]);
  });

  test('thresholds out of order', () => {
    const file = demoCopy();
    file.targets.functions[0].thresholds = ['11.8 V', '12.4 V', '12.1 V', '12.7 V'];
    expect(problemsOf(file)[0]).toMatchObject({ path: 'targets.functions[0].thresholds[2]', value: '12.1 V' });
  });

  test('every problem of a file is reported at once', () => {
    const file = demoCopy();
    file.string[0] = '4x7';
    file.channels[0].plus = 'T7';
    file.channels[1].id = 'S1';
    expect(problemsOf(file).map((p) => p.path)).toEqual(['channels[0].plus', 'channels[1].id', 'string[0]']);
  });
});

describe('parseDesign: warnings', () => {
  test('a wired-OR tie needs naming on one side only', () => {
    const file = demoCopy();
    file.channels[1].wiredTo = 'S1';
    const result = parseDesign(file);
    expect(result.ok && result.design.channels[1].wiredTo).toBe('S1');
  });

  test('feedback to the inverting input loads with a warning', () => {
    const file = demoCopy();
    file.channels[0].feedback.to = 'minus';
    const result = parseDesign(file);
    expect(result.ok && result.warnings).toEqual([
      'channels[0].feedback.to: feedback to the inverting input is negative feedback; a comparator needs it on plus for hysteresis',
    ]);
  });
});

describe('parseDesign never throws', () => {
  test.each([null, undefined, [], 42, 'text', true, {}, { format: 2 }, [[[]]]])('on %j', (json) => {
    const result = parseDesign(json);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.length).toBeGreaterThan(0);
  });

  test('on deeply wrong shapes', () => {
    const wrong = {
      format: 1, name: 3, quantity: [], input: { signal: 'light', divider: 'x' }, supply: null, reference: { kind: 7 },
      part: 'fast', string: [null, {}, ['1k']], channels: [null, 1, { id: {} }], spares: {}, resistors: [], targets: { functions: [{}] },
    };
    const result = parseDesign(wrong);
    expect(result.ok).toBe(false);
  });

  test('on 500 seeded random mutations of the demo', () => {
    const random = lcg(20240601);
    const junk = [null, 0, -1, 1e308, '', 'T0', 'out:', '0R', '-4k7', [], {}, 'NaN', true, '1e999'];
    for (let trial = 0; trial < 500; trial++) {
      const file = demoCopy();
      for (let edits = 1 + Math.floor(random() * 3); edits > 0; edits--) {
        let node = file;
        for (;;) {
          const keys = Object.keys(node);
          const key = keys[Math.floor(random() * keys.length)];
          const child = node[key];
          if (child && typeof child === 'object' && random() < 0.7 && Object.keys(child).length > 0) node = child;
          else {
            node[key] = junk[Math.floor(random() * junk.length)];
            break;
          }
        }
      }
      expect(() => parseDesign(file)).not.toThrow();
    }
  });
});

describe('formatProblems', () => {
  test('one line per problem: file, path, value and message', () => {
    const lines = formatProblems(
      [
        { path: 'channels[2].plus', value: 'T9', message: 'no such node; taps are T1..T4, or use in, ref, supply, gnd' },
        { path: 'channels[0].minus', value: undefined, message: 'required field is missing' },
        { path: '', value: undefined, message: 'the file must hold one JSON object' },
      ],
      'demo.tapline.json',
    );
    expect(lines).toBe(
      [
        'demo.tapline.json: channels[2].plus = "T9": no such node; taps are T1..T4, or use in, ref, supply, gnd',
        'demo.tapline.json: channels[0].minus: required field is missing',
        'demo.tapline.json: the file must hold one JSON object',
      ].join('\n'),
    );
  });
});
