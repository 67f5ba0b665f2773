/**
 * What the planner reports: the package/channel map (pin functions per channel, spares), the
 * resistor values with their roles, and target vs realised for every trip point, from one exact
 * analysis of the final design.
 */
import type { Analysis } from '../analysis-types';
import type { Design } from '../design/types';
import { QUAD } from './allocate';
import type { MapEntry, PlanRow, Unit, ValueEntry } from './types';

/** The package/channel map of a planned design: every slot of every package used, spares included. */
export function allocationMap(design: Design, units: Unit[]): MapEntry[] {
  const out: MapEntry[] = [];
  const packages = Math.max(0, ...design.channels.map((c) => c.package), ...design.spares.map((s) => s.package));
  for (let pkg = 1; pkg <= packages; pkg++) {
    for (let k = 1; k <= QUAD; k++) {
      const ch = design.channels.find((c) => c.package === pkg && c.channel === k);
      const spare = design.spares.find((s) => s.package === pkg && s.channel === k);
      if (ch) {
        const u = units.find((v) => v.id === ch.id);
        const fn = u ? `${u.fn.kind} ${u.fn.id}: ${ch.label}` : ch.label;
        const out_ = ch.wiredTo ? `out:${ch.id} (wired to out:${ch.wiredTo})` : `out:${ch.id}`;
        const pin = (node: string, series?: number) => (series ? `${node} via RIP:${ch.id}` : node);
        out.push({ package: pkg, channel: k, id: ch.id, role: fn, pins: { plusIn: pin(ch.plus, ch.seriesPlus), minusIn: ch.minus, out: out_ } });
      } else if (spare) {
        out.push({ package: pkg, channel: k, id: null, role: 'spare', pins: { plusIn: spare.plus, minusIn: spare.minus, out: 'open' } });
      }
    }
  }
  return out;
}

/** Target vs realised rows for every trip of every unit, read from `analysis`; `allowance` in unit of x. */
export function tripRows(units: Unit[], analysis: Analysis, allowance: number): PlanRow[] {
  const rows: PlanRow[] = [];
  for (const u of units) {
    const c = analysis.channels.find((r) => r.id === u.id);
    for (const edge of ['rising', 'falling'] as const) {
      const target = u[edge];
      const realised = c?.[edge]?.x ?? null;
      const error = realised === null ? null : realised - target;
      rows.push({ channel: u.id, fn: u.fn.id, edge, target, realised, error, ok: error !== null && Math.abs(error) <= allowance });
    }
  }
  return rows;
}

/** Every resistor of the design with its role (ohms). */
export function valueList(design: Design): ValueEntry[] {
  const out: ValueEntry[] = [];
  if (design.input.divider) {
    out.push({ id: 'RD1', ohms: design.input.divider.top, role: 'input divider, top' });
    out.push({ id: 'RD2', ohms: design.input.divider.bottom, role: 'input divider, bottom' });
  }
  if (design.reference.kind === 'shunt') out.push({ id: 'RB', ohms: design.reference.bias, role: 'shunt reference bias' });
  design.string.forEach((ohms, k) => out.push({ id: `RS${k + 1}`, ohms, role: k === 0 ? 'string, top' : k === design.string.length - 1 ? 'string, bottom' : `string, T${k} to T${k + 1}` }));
  for (const c of design.channels) {
    if (c.seriesPlus) out.push({ id: `RIP:${c.id}`, ohms: c.seriesPlus, role: `series into + of ${c.id}` });
    if (c.feedback) out.push({ id: `RF:${c.id}`, ohms: c.feedback.ohms, role: `feedback of ${c.id} (hysteresis)` });
    if (c.pullup) out.push({ id: `RP:${c.id}`, ohms: c.pullup.ohms, role: `pull-up of ${c.id}` });
    if (c.led) out.push({ id: `RL:${c.id}`, ohms: c.led.ohms, role: `LED resistor of ${c.id}` });
  }
  return out;
}
