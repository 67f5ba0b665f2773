import { expect, test } from 'vitest';
import type { TargetFunction } from '../../../src/engine/design/types';
import { allocate, expandFunctions, tripsFor } from '../../../src/engine/planner/allocate';
import { plan } from '../../../src/engine/planner/index';
import { issueExample } from './fixtures';

const win = (id: string): TargetFunction => ({ kind: 'window', id, low: 11, high: 14, hysteresis: 0.1, anchor: 'centre', sense: 'outside', load: 'led' });
const single = (id: string, t: number): TargetFunction => ({ kind: 'single', id, threshold: t, hysteresis: 0.1, anchor: 'centre', polarity: 'above', load: 'led' });

test('anchors place the hysteresis band: rising edge, falling edge or centred on the threshold', () => {
  // Definitions of the three anchors (this project's terms), hand arithmetic.
  expect(tripsFor(12, 0.2, 'rising')).toEqual({ rising: 12, falling: 11.8 });
  expect(tripsFor(12, 0.2, 'falling')).toEqual({ rising: 12.2, falling: 12 });
  expect(tripsFor(12, 0.2, 'centre')).toEqual({ rising: 12.1, falling: 11.9 });
});

test('uses the fewest packages, ceil(channels / 4), and keeps each window pair in one package', () => {
  // 3 windows (6 channels) + 1 single = 7 channels: 2 packages; a naive in-order fill would split a window.
  const units = expandFunctions([single('s', 12), win('a'), win('b'), win('c')], 'V');
  const placed = allocate(units, 4);
  expect(placed.packages).toBe(2);
  for (const id of ['a', 'b', 'c']) {
    const lo = units.find((u) => u.id === `${id}-lo`)!;
    const hi = units.find((u) => u.id === `${id}-hi`)!;
    expect(lo.package).toBe(hi.package);
  }
  expect(placed.spares).toEqual([{ package: 2, channel: 4, plus: 'gnd', minus: 'ref' }]);
});

test('unused channels are spares with + to ground, − to the reference and the output open (common practice, no source)', () => {
  const result = plan(issueExample());
  const spares = result.allocation.filter((e) => e.id === null);
  expect(spares).toEqual([
    { package: 2, channel: 3, id: null, role: 'spare', pins: { plusIn: 'gnd', minusIn: 'ref', out: 'open' } },
    { package: 2, channel: 4, id: null, role: 'spare', pins: { plusIn: 'gnd', minusIn: 'ref', out: 'open' } },
  ]);
});

test('the map gives each channel its pin functions by node', () => {
  const result = plan(issueExample());
  const lo = result.allocation.find((e) => e.id === 'win-lo')!;
  expect(lo.pins.plusIn).toMatch(/^in via RIP:win-lo$/);
  expect(lo.pins.minusIn).toMatch(/^T\d$/);
  const hi = result.allocation.find((e) => e.id === 'win-hi')!;
  expect(hi.pins.out).toBe('out:win-hi (wired to out:win-lo)');
});
