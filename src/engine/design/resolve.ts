/**
 * Turns a structurally valid design file into the resolved `Design` (SI numbers, defaults filled),
 * recording a problem for every value that does not parse or does not make sense.
 */
import { BUILTIN_PARTS, resolvePart, type PartOverrides } from '../parts';
import type { ValueUnit } from '../values';
import { EXTERNAL_REFERENCE_TOLERANCE, LED_RDYN, QUANTITY_NOISE, SHUNT_DEFAULTS } from './defaults';
import type { ChannelFile, DesignFile, PartFile } from './file-types';
import { joinPath, pathOf } from './problems';
import { fraction, nonNegative, positive, type Reader } from './reader';
import { resolveTargets } from './resolve-targets';
import type { Channel, Design, InputPath, PartClass, Reference, Supply } from './types';

/** Units of the numeric part fields a file may override. */
export const PART_UNITS: Readonly<Record<string, ValueUnit>> = {
  supplyMin: 'V', supplyMax: 'V', absMaxSupply: 'V', iqPerPackage: 'A', vosTyp: 'V', vosMax: 'V',
  ibTyp: 'A', ibMax: 'A', cmMin: 'V', cmHeadroom: 'V', vsat0: 'V', rsat: 'ohm', sinkMax: 'A',
  vohDrop: 'V', rout: 'ohm',
};

const MAGNITUDES = ['iqPerPackage', 'vosTyp', 'vosMax', 'ibTyp', 'ibMax', 'vsat0', 'sinkMax', 'vohDrop'];

function readInput(file: DesignFile, r: Reader): InputPath {
  const f = file.input;
  const unit = f.signal === 'voltage' ? 'V' : 'A';
  const gain = r.value(f.gain, 'input.gain', unit, (v) => (v !== 0 ? undefined : 'a gain of 0 means x never reaches the comparators'));
  const input: InputPath = { signal: f.signal, offset: r.value(f.offset, 'input.offset', unit), gain };
  if (f.divider) {
    input.divider = {
      top: r.value(f.divider.top, 'input.divider.top', 'ohm'),
      bottom: r.value(f.divider.bottom, 'input.divider.bottom', 'ohm'),
    };
    if (f.signal === 'current') r.problem('input.divider', f.divider, 'a divider scales a voltage signal; a current signal needs "shunt" instead');
  }
  if (f.shunt !== undefined) {
    input.shunt = r.value(f.shunt, 'input.shunt', 'ohm');
    if (f.signal === 'voltage') r.problem('input.shunt', f.shunt, 'a shunt converts a current signal; remove it, or set "signal": "current"');
  } else if (f.signal === 'current') {
    r.problem('input.shunt', undefined, 'a current signal needs a shunt resistor from in to gnd, e.g. "shunt": "100R"');
  }
  return input;
}

function readSupply(file: DesignFile, r: Reader): Supply {
  const f = file.supply;
  if (f.kind === 'measured') {
    if (file.quantity.unit !== 'V') {
      r.problem('supply.kind', f.kind, `the supply can be the measured quantity only when x is a voltage (quantity.unit "V", not "${file.quantity.unit}"); use "kind": "fixed"`);
    }
    return { kind: 'measured' };
  }
  const volts = r.value(f.volts, 'supply.volts', 'V', positive('the supply'));
  const min = r.value(f.min, 'supply.min', 'V', positive('the supply'));
  const max = r.value(f.max, 'supply.max', 'V', positive('the supply'));
  if (min > volts || volts > max) r.problem('supply', f, 'need min <= volts <= max');
  return { kind: 'fixed', volts, min, max };
}

function readReference(file: DesignFile, r: Reader): Reference {
  const f = file.reference;
  if (f.kind === 'supply') return { kind: 'supply' };
  const volts = r.value(f.volts, 'reference.volts', 'V', positive('the reference'));
  if (f.kind === 'external') {
    return { kind: 'external', volts, tolerance: r.optional(f.tolerance, EXTERNAL_REFERENCE_TOLERANCE, 'reference.tolerance', 'ratio', fraction('a tolerance')) };
  }
  const d = SHUNT_DEFAULTS;
  const ref: Reference = {
    kind: 'shunt',
    volts,
    bias: r.value(f.bias, 'reference.bias', 'ohm'),
    rdyn: r.optional(f.rdyn, d.rdyn, 'reference.rdyn', 'ohm'),
    minCurrent: r.optional(f.minCurrent, d.minCurrent, 'reference.minCurrent', 'A', positive('a current')),
    maxCurrent: r.optional(f.maxCurrent, d.maxCurrent, 'reference.maxCurrent', 'A', positive('a current')),
    tolerance: r.optional(f.tolerance, d.tolerance, 'reference.tolerance', 'ratio', fraction('a tolerance')),
  };
  if (ref.minCurrent >= ref.maxCurrent) r.problem('reference.maxCurrent', f.maxCurrent, 'must be greater than minCurrent');
  return ref;
}

function readPart(f: PartFile, r: Reader): PartClass {
  const overrides: Record<string, unknown> = {};
  for (const [key, raw] of Object.entries(f)) {
    if (key === 'class') continue;
    const unit = PART_UNITS[key];
    const path = joinPath('part', key);
    overrides[key] = unit ? r.value(raw as string | number, path, unit, MAGNITUDES.includes(key) ? nonNegative(key) : undefined) : raw;
  }
  const part = resolvePart(f.class, overrides as PartOverrides);
  if (!part) {
    r.problem('part.class', f.class, `no such part class; built-in classes are ${Object.keys(BUILTIN_PARTS).join(', ')}`);
    return { ...Object.values(BUILTIN_PARTS)[0], ...(overrides as PartOverrides), id: f.class };
  }
  const order = (lo: keyof PartClass, hi: keyof PartClass) => {
    if (!((part[lo] as number) > (part[hi] as number))) return;
    const given = f[hi as keyof PartFile] !== undefined ? hi : lo;
    r.problem(joinPath('part', given), f[given as keyof PartFile], `${lo} (${part[lo]}) must not exceed ${hi} (${part[hi]})`);
  };
  order('supplyMin', 'supplyMax');
  order('supplyMax', 'absMaxSupply');
  order('vosTyp', 'vosMax');
  order('ibTyp', 'ibMax');
  return part;
}

function readChannel(c: ChannelFile, at: string, r: Reader): Channel {
  const channel: Channel = { id: c.id, label: c.label, package: c.package, channel: c.channel, plus: c.plus, minus: c.minus };
  if (c.seriesPlus !== undefined) channel.seriesPlus = r.value(c.seriesPlus, joinPath(at, 'seriesPlus'), 'ohm');
  if (c.seriesMinus !== undefined) channel.seriesMinus = r.value(c.seriesMinus, joinPath(at, 'seriesMinus'), 'ohm');
  if (c.feedback) channel.feedback = { ohms: r.value(c.feedback.resistor, pathOf(at, 'feedback', 'resistor'), 'ohm'), to: c.feedback.to };
  if (c.pullup) channel.pullup = { ohms: r.value(c.pullup.resistor, pathOf(at, 'pullup', 'resistor'), 'ohm'), to: c.pullup.to };
  if (c.led) {
    channel.led = {
      ohms: r.value(c.led.resistor, pathOf(at, 'led', 'resistor'), 'ohm'),
      knee: r.value(c.led.knee, pathOf(at, 'led', 'knee'), 'V', positive('a knee voltage')),
      rdyn: r.optional(c.led.rdyn, LED_RDYN, pathOf(at, 'led', 'rdyn'), 'ohm'),
      anode: c.led.anode,
    };
    if (c.led.colour !== undefined) channel.led.colour = c.led.colour;
  }
  if (c.wiredTo !== undefined) channel.wiredTo = c.wiredTo;
  return channel;
}

/** The resolved design; its numbers are NaN wherever `r` recorded a problem. */
export function resolveDesign(file: DesignFile, r: Reader): Design {
  const q = file.quantity;
  const min = r.x(q.min, 'quantity.min');
  const max = r.x(q.max, 'quantity.max');
  if (min >= max) r.problem('quantity.max', q.max, 'must be greater than quantity.min');
  const part = readPart(file.part, r);
  const channels = file.channels.map((c, i) => readChannel(c, joinPath('channels', i), r));
  if (part.output === 'push-pull' && channels.some((c) => c.wiredTo !== undefined)) {
    r.warn('part.output', 'push-pull outputs tied together (wiredTo) fight each other when they disagree; use an open-collector class');
  }
  const design: Design = {
    format: 1,
    name: file.name,
    notes: file.notes ?? '',
    quantity: { name: q.name, unit: q.unit, min, max, noise: q.noise === undefined ? QUANTITY_NOISE : r.x(q.noise, 'quantity.noise', nonNegative('noise')) },
    input: readInput(file, r),
    supply: readSupply(file, r),
    reference: readReference(file, r),
    part,
    string: file.string.map((v, i) => r.value(v, joinPath('string', i), 'ohm')),
    rails: (file.rails ?? []).map((rail, i) => ({ id: rail.id, volts: r.value(rail.volts, pathOf('rails', i, 'volts'), 'V') })),
    channels,
    spares: (file.spares ?? []).map((s) => ({ package: s.package, channel: s.channel, plus: s.plus, minus: s.minus })),
    resistorTolerance: r.value(file.resistors.tolerance, 'resistors.tolerance', 'ratio', fraction('a tolerance')),
    series: file.resistors.series,
  };
  if (file.battery) {
    design.battery = {
      chemistry: file.battery.chemistry,
      capacityAh: r.value(file.battery.capacityAh, 'battery.capacityAh', 'none', positive('a capacity')),
    };
  }
  if (file.targets) design.targets = resolveTargets(file.targets, design, r);
  return design;
}
