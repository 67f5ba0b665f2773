import { describe, expect, it } from 'vitest';
import { computeLayout, scrollStart } from '../../src/ui/layout';

describe('layout', () => {
  it('refuses terminals below 60x20', () => {
    expect(computeLayout(59, 24, 4)).toBeNull();
    expect(computeLayout(80, 19, 4)).toBeNull();
    expect(computeLayout(60, 20, 4)).not.toBeNull();
  });

  it('fills 80x24 exactly with every channel of a quad visible', () => {
    const l = computeLayout(80, 24, 4)!;
    expect(l.channelsHeight - 2).toBe(4);
    expect(1 + l.channelsHeight + l.middleHeight + 2).toBe(24);
    expect(l.sweepHeight + l.probeHeight + l.lowerHeight).toBe(l.middleHeight);
    expect(l.leftWidth + 1 + l.rightWidth).toBe(80);
  });

  it('gives the rows of the sweep to the lower pane while targets or findings have the focus', () => {
    const normal = computeLayout(80, 24, 8)!;
    const lower = computeLayout(80, 24, 8, true)!;
    expect(lower.sweepHeight).toBe(0);
    expect(lower.lowerHeight).toBe(normal.lowerHeight + normal.sweepHeight);
    expect(lower.sweepHeight + lower.probeHeight + lower.lowerHeight).toBe(lower.middleHeight);
  });

  it('scrolls so the selection stays visible', () => {
    expect(scrollStart(0, 30, 10)).toBe(0);
    expect(scrollStart(29, 30, 10)).toBe(20);
    expect(scrollStart(15, 30, 10)).toBe(10);
  });
});
