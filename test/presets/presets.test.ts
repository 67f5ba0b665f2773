/**
 * Every preset loads, has targets, checks without error-level findings (warnings only where its
 * notes say the scenario intends them), meets its own targets within its allowance, and keeps its
 * numbers (snapshots of values rounded to 4 significant figures).
 */
import { describe, expect, it } from 'vitest';
import { tripRows } from '../../src/engine/export/trip-rows';
import { plan } from '../../src/engine/planner';
import { loadPresets } from '../helpers/presets';

const presets = loadPresets();
const round = (x: number | null) => (x === null ? null : Number(x.toPrecision(4)));

it('has at least six presets, the lead-acid gauge among them', () => {
  expect(presets.length).toBeGreaterThanOrEqual(6);
  expect(presets.map((p) => p.id)).toContain('lead-acid-12v-gauge');
});

describe.each(presets)('preset $id', (p) => {
  it('states targets', () => {
    expect(p.design.targets?.functions.length).toBeGreaterThan(0);
  });

  it('has no error-level finding', () => {
    expect(p.analysis.findings.filter((f) => f.severity === 'error')).toEqual([]);
  });

  it('names every warning code it has in its notes as intended', () => {
    for (const f of p.analysis.findings.filter((x) => x.severity === 'warning')) expect(p.design.notes).toContain(f.code);
  });

  it('meets every target trip point within the allowance', () => {
    const allowance = p.design.targets!.allowance;
    for (const row of tripRows(p.design, p.analysis)) {
      expect(row.error, `${row.channel} ${row.edge}`).not.toBeNull();
      expect(Math.abs(row.error!), `${row.channel} ${row.edge}`).toBeLessThanOrEqual(allowance);
    }
  });

  it('states targets the planner can realise', () => {
    const planned = plan(p.design);
    expect(planned.problems).toEqual([]);
    expect(planned.ok).toBe(true);
  });

  it('keeps its trip points, hysteresis and currents', () => {
    const a = p.analysis;
    expect({
      trips: a.channels.map((c) => [c.id, round(c.rising?.x ?? null), round(c.falling?.x ?? null), round(c.hysteresis)]),
      supply: [round(a.supplyCurrent.min), round(a.supplyCurrent.max)],
    }).toMatchSnapshot();
  });
});
