import { describe, expect, it } from 'vitest';
import { buildReport, drainDays } from '../../../src/engine/export/report';
import { formatX } from '../../../src/engine/export/report-parts';
import { loadPresets } from '../../helpers/presets';

describe('drainDays', () => {
  it('is capacity over current over 24 h', () => {
    // 7 Ah at 2 mA: 3500 h, 145.8 days (arithmetic). Precision 1e-9 days.
    expect(drainDays(7, 2e-3)).toBeCloseTo(3500 / 24, 9);
  });
});

describe.each(loadPresets())('report of $id', (p) => {
  const text = buildReport({ design: p.design, analysis: p.analysis, designators: p.designators, cautions: ['Test caution.'] });

  it('holds every realised trip point as the table prints it', () => {
    for (const c of p.analysis.channels) {
      for (const trip of [c.rising, c.falling]) if (trip) expect(text).toContain(formatX(p.design, trip.x));
    }
  });

  it('holds every target threshold', () => {
    for (const fn of p.design.targets?.functions ?? []) {
      const values = fn.kind === 'bar' ? fn.thresholds : fn.kind === 'window' ? [fn.low, fn.high] : [fn.threshold];
      for (const v of values) expect(text).toContain(formatX(p.design, v));
    }
  });

  it('has every section in order', () => {
    const heads = [...text.matchAll(/^## (.+)$/gm)].map((m) => m[1]);
    expect(heads).toEqual(['Job', 'String', 'Allocation', 'Trip points', 'Currents', 'Spread', 'Findings', 'Cautions', 'Bill of materials']);
  });

  it('draws every string resistor', () => {
    p.design.string.forEach((_, k) => expect(text).toContain(`  ${p.designators.of(`RS${k + 1}`)}`));
  });
});
