/**
 * The editable values of a design, in the order the screen shows them, each with how to read and
 * write it. One list per pane; the reducer and the panes share it so selection indices agree.
 */
import type { Design, SeriesName, TargetFunction } from '../../engine/design/types';
import { SERIES } from '../../engine/series';
import type { ValueUnit } from '../../engine/values';

/** Panes the user moves between with the pane keys, in that order. */
export type PaneId = 'string' | 'channels' | 'targets' | 'findings';

/** Every pane id in focus order. */
export const PANES: readonly PaneId[] = ['string', 'channels', 'targets', 'findings'];

/** How a field's value is kept and stepped. */
export type FieldKind = 'resistor' | 'number' | 'series';

/** One editable value. */
export interface Field {
  /** Stable id, e.g. "string.2", "ch.S1.feedback", "target.charge.t0". */
  id: string;
  pane: PaneId;
  /** Short name shown in prompts and messages, e.g. "RS3" or "S1 feedback". */
  label: string;
  kind: FieldKind;
  /** Unit the value is typed in (for parseValue); 'series' fields take a series name. */
  unit: ValueUnit;
  /** Unit symbol shown after the value ("" for resistors, which show RKM codes). */
  symbol: string;
  /** Channel id this value belongs to, for the channels table. */
  channel?: string;
  /** Target function this value belongs to (targets pane). */
  functionId?: string;
  /** Column of the channels table or row role elsewhere. */
  role: string;
  get(d: Design): number | SeriesName;
  /** A copy of `d` with the value replaced (SI number, or a series name). */
  set(d: Design, v: number | SeriesName): Design;
}

/** Units of x parseValue understands; any other unit is typed as a bare number. */
export function xValueUnit(unit: string): ValueUnit {
  return ({ V: 'V', A: 'A', W: 'W', F: 'F' } as Record<string, ValueUnit>)[unit] ?? 'none';
}

const num = (v: number | SeriesName) => v as number;

function stringFields(d: Design): Field[] {
  const out: Field[] = [{
    id: 'series', pane: 'string', label: 'resistor series', kind: 'series', unit: 'none', symbol: '', role: 'series',
    get: (x) => x.series,
    set: (x, v) => ({ ...x, series: v as SeriesName }),
  }];
  if (d.supply.kind === 'fixed') {
    out.push({
      id: 'supply.volts', pane: 'string', label: 'supply', kind: 'number', unit: 'V', symbol: 'V', role: 'supply',
      get: (x) => (x.supply.kind === 'fixed' ? x.supply.volts : NaN),
      set: (x, v) => (x.supply.kind === 'fixed' ? { ...x, supply: { ...x.supply, volts: num(v) } } : x),
    });
  }
  const ref = d.reference;
  if (ref.kind === 'shunt') {
    out.push({
      id: 'ref.bias', pane: 'string', label: 'RB (reference bias)', kind: 'resistor', unit: 'ohm', symbol: '', role: 'bias',
      get: (x) => (x.reference.kind === 'shunt' ? x.reference.bias : NaN),
      set: (x, v) => (x.reference.kind === 'shunt' ? { ...x, reference: { ...x.reference, bias: num(v) } } : x),
    });
  }
  if (ref.kind !== 'supply') {
    out.push({
      id: 'ref.volts', pane: 'string', label: 'reference voltage', kind: 'number', unit: 'V', symbol: 'V', role: 'ref',
      get: (x) => (x.reference.kind === 'supply' ? NaN : x.reference.volts),
      set: (x, v) => (x.reference.kind === 'supply' ? x : { ...x, reference: { ...x.reference, volts: num(v) } }),
    });
  }
  d.string.forEach((_, k) => out.push({
    id: `string.${k}`, pane: 'string', label: `RS${k + 1}`, kind: 'resistor', unit: 'ohm', symbol: '', role: 'string',
    get: (x) => x.string[k],
    set: (x, v) => ({ ...x, string: x.string.map((r, j) => (j === k ? num(v) : r)) }),
  }));
  if (d.input.divider) {
    for (const [key, name] of [['top', 'RD1 (input divider top)'], ['bottom', 'RD2 (input divider bottom)']] as const) {
      out.push({
        id: `input.${key}`, pane: 'string', label: name, kind: 'resistor', unit: 'ohm', symbol: '', role: `divider-${key}`,
        get: (x) => x.input.divider?.[key] ?? NaN,
        set: (x, v) => (x.input.divider ? { ...x, input: { ...x.input, divider: { ...x.input.divider, [key]: num(v) } } } : x),
      });
    }
  }
  if (d.input.shunt !== undefined) {
    out.push({
      id: 'input.shunt', pane: 'string', label: 'RSH (loop shunt)', kind: 'resistor', unit: 'ohm', symbol: '', role: 'shunt',
      get: (x) => x.input.shunt ?? NaN,
      set: (x, v) => ({ ...x, input: { ...x.input, shunt: num(v) } }),
    });
  }
  return out;
}

type ChannelPart = 'feedback' | 'led' | 'pullup' | 'seriesPlus' | 'seriesMinus';
const CHANNEL_PARTS: { part: ChannelPart; name: string }[] = [
  { part: 'feedback', name: 'feedback' }, { part: 'led', name: 'LED resistor' }, { part: 'pullup', name: 'pull-up' },
  { part: 'seriesPlus', name: 'series + input' }, { part: 'seriesMinus', name: 'series − input' },
];

function channelFields(d: Design): Field[] {
  const out: Field[] = [];
  for (const ch of d.channels) {
    for (const { part, name } of CHANNEL_PARTS) {
      const has = part === 'seriesPlus' || part === 'seriesMinus' ? ch[part] !== undefined : !!ch[part];
      if (!has) continue;
      const id = ch.id;
      out.push({
        id: `ch.${id}.${part}`, pane: 'channels', label: `${id} ${name}`, kind: 'resistor', unit: 'ohm', symbol: '', channel: id, role: part,
        get: (x) => {
          const c = x.channels.find((q) => q.id === id);
          if (!c) return NaN;
          if (part === 'seriesPlus' || part === 'seriesMinus') return c[part] ?? NaN;
          return c[part]?.ohms ?? NaN;
        },
        set: (x, v) => ({
          ...x,
          channels: x.channels.map((c) => {
            if (c.id !== id) return c;
            if (part === 'seriesPlus' || part === 'seriesMinus') return { ...c, [part]: num(v) };
            const cur = c[part];
            return cur ? { ...c, [part]: { ...cur, ohms: num(v) } } : c;
          }),
        }),
      });
    }
  }
  return out;
}

function updateFunction(d: Design, fid: string, fn: (f: TargetFunction) => TargetFunction): Design {
  if (!d.targets) return d;
  return { ...d, targets: { ...d.targets, functions: d.targets.functions.map((f) => (f.id === fid ? fn(f) : f)) } };
}

function targetFields(d: Design): Field[] {
  if (!d.targets) return [];
  const xu = xValueUnit(d.quantity.unit);
  const sym = d.quantity.unit;
  const out: Field[] = [];
  const mk = (fid: string, key: string, label: string, get: (f: TargetFunction) => number, put: (f: TargetFunction, v: number) => TargetFunction): Field => ({
    id: `target.${fid}.${key}`, pane: 'targets', label, kind: 'number', unit: xu, symbol: sym, role: key, functionId: fid,
    get: (x) => {
      const f = x.targets?.functions.find((q) => q.id === fid);
      return f ? get(f) : NaN;
    },
    set: (x, v) => updateFunction(x, fid, (f) => put(f, num(v))),
  });
  for (const f of d.targets.functions) {
    if (f.kind === 'bar') {
      f.thresholds.forEach((_, k) => out.push(mk(f.id, `t${k}`, `${f.id} step ${k + 1}`,
        (g) => (g.kind === 'bar' ? g.thresholds[k] : NaN),
        (g, v) => (g.kind === 'bar' ? { ...g, thresholds: g.thresholds.map((t, j) => (j === k ? v : t)) } : g))));
    } else if (f.kind === 'window') {
      out.push(mk(f.id, 'low', `${f.id} low edge`, (g) => (g.kind === 'window' ? g.low : NaN), (g, v) => (g.kind === 'window' ? { ...g, low: v } : g)));
      out.push(mk(f.id, 'high', `${f.id} high edge`, (g) => (g.kind === 'window' ? g.high : NaN), (g, v) => (g.kind === 'window' ? { ...g, high: v } : g)));
    } else {
      out.push(mk(f.id, 'threshold', `${f.id} threshold`, (g) => (g.kind === 'single' ? g.threshold : NaN), (g, v) => (g.kind === 'single' ? { ...g, threshold: v } : g)));
    }
    out.push(mk(f.id, 'hysteresis', `${f.id} hysteresis`, (g) => g.hysteresis, (g, v) => ({ ...g, hysteresis: v })));
  }
  return out;
}

/** The editable values shown in `pane`, in screen order. */
export function paneFields(d: Design, pane: PaneId): Field[] {
  if (pane === 'string') return stringFields(d);
  if (pane === 'channels') return channelFields(d);
  if (pane === 'targets') return targetFields(d);
  return [];
}

/** The next (or previous, `steps` < 0) IEC 60063 series name in the order E3 … E192, wrapping. */
export function cycleSeries(s: SeriesName, steps: number): SeriesName {
  const names = Object.keys(SERIES) as SeriesName[];
  const k = names.indexOf(s);
  return names[(((k + steps) % names.length) + names.length) % names.length];
}
