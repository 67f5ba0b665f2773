import { describe, expect, it } from 'vitest';
import { analyze } from '../../../src/engine/analyze';
import { columnOf, columnX, sweepCells } from '../../../src/ui/state/sweep-cells';
import { fourStepDesign } from '../../helpers/designs';

describe('sweep cells', () => {
  it('puts a value in the column whose span holds it', () => {
    // 10 columns over 0..5: column width 0.5, so 2.6 is in column 5 (2.5..3.0); arithmetic, exact.
    expect(columnOf(2.6, 10, 0, 5)).toBe(5);
    expect(columnX(5, 10, 0, 5)).toBe(2.75);
  });

  it('shows the hysteresis band as on-while-falling cells between the two trip points', () => {
    const d = fourStepDesign(100e3);
    const a = analyze(d);
    const width = 500;
    const cells = sweepCells(a, width, d.quantity.min, d.quantity.max);
    const c = a.channels[0];
    expect(c.hysteresis).toBeGreaterThan(0.02);
    // A column centred between falling and rising trip points: on only while x falls.
    const mid = (c.rising!.x + c.falling!.x) / 2;
    expect(cells[c.id][columnOf(mid, width, 0, 5)]).toBe('down');
    expect(cells[c.id][columnOf(c.rising!.x + 0.1, width, 0, 5)]).toBe('both');
    expect(cells[c.id][columnOf(c.falling!.x - 0.1, width, 0, 5)]).toBe('off');
  });
});
