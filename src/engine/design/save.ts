/**
 * Writing a resolved design back to the file form: resistors as RKM codes ("4k7"), other values
 * as engineering text with units ("2.5 V", "100 µA", "1 %"), keys in a fixed order. Every value
 * written reads back through `parseDesign` to the same number; where no short text does, the
 * plain SI number is written instead.
 */
import { BUILTIN_PARTS } from '../parts';
import { formatEng, formatRkm, parseValue, type ValueUnit } from '../values';
import type { ChannelFile, DesignFile, FileValue, FunctionFile, PartFile, TargetsFile } from './file-types';
import { PART_UNITS } from './resolve';
import type { Channel, Design, PartClass, Reference, Supply, TargetFunction, Targets } from './types';

/** The shortest text from `write(digits)` that reads back as exactly `value`, else the number. */
function shortest(value: number, unit: ValueUnit, write: (digits: number) => string): FileValue {
  if (!Number.isFinite(value)) return value;
  for (let digits = 1; digits <= 15; digits++) {
    const text = write(digits);
    const back = parseValue(text, unit);
    if (back.ok && back.value === value) return text;
  }
  return value;
}

const ohms = (v: number) => shortest(v, 'ohm', (d) => formatRkm(v, d));
const eng = (v: number, unit: 'V' | 'A') => shortest(v, unit, (d) => formatEng(v, unit, { digits: d }));
const ratio = (v: number) => shortest(v, 'ratio', (d) => `${Number((v * 100).toPrecision(d))} %`);

/** Writers for the quantity's own unit: engineering text for V and A, plain numbers otherwise. */
function xWriter(unit: string): (v: number) => FileValue {
  return unit === 'V' || unit === 'A' ? (v) => eng(v, unit) : (v) => v;
}

function supplyFile(s: Supply): DesignFile['supply'] {
  if (s.kind === 'measured') return { kind: 'measured' };
  return { kind: 'fixed', volts: eng(s.volts, 'V'), min: eng(s.min, 'V'), max: eng(s.max, 'V') };
}

function referenceFile(r: Reference): DesignFile['reference'] {
  if (r.kind === 'supply') return { kind: 'supply' };
  if (r.kind === 'external') return { kind: 'external', volts: eng(r.volts, 'V'), tolerance: ratio(r.tolerance) };
  return {
    kind: 'shunt', volts: eng(r.volts, 'V'), bias: ohms(r.bias), rdyn: ohms(r.rdyn),
    minCurrent: eng(r.minCurrent, 'A'), maxCurrent: eng(r.maxCurrent, 'A'), tolerance: ratio(r.tolerance),
  };
}

/** The class id plus every field that differs from the built-in class, in `PartClass` order. */
function partFile(part: PartClass): PartFile {
  const file: Record<string, unknown> = { class: part.id };
  const base = BUILTIN_PARTS[part.id] as PartClass | undefined;
  for (const [key, value] of Object.entries(part) as [keyof PartClass, PartClass[keyof PartClass]][]) {
    if (key === 'id' || (base && base[key] === value)) continue;
    const unit = PART_UNITS[key];
    if (typeof value === 'number' && unit) file[key] = unit === 'ohm' ? ohms(value) : eng(value, unit as 'V' | 'A');
    else file[key] = value;
  }
  return file as unknown as PartFile;
}

function channelFile(c: Channel): ChannelFile {
  const file: ChannelFile = { id: c.id, label: c.label, package: c.package, channel: c.channel, plus: c.plus, minus: c.minus };
  if (c.seriesPlus !== undefined) file.seriesPlus = ohms(c.seriesPlus);
  if (c.seriesMinus !== undefined) file.seriesMinus = ohms(c.seriesMinus);
  if (c.feedback) file.feedback = { resistor: ohms(c.feedback.ohms), to: c.feedback.to };
  if (c.pullup) file.pullup = { resistor: ohms(c.pullup.ohms), to: c.pullup.to };
  if (c.led) {
    file.led = { resistor: ohms(c.led.ohms), knee: eng(c.led.knee, 'V'), rdyn: ohms(c.led.rdyn), anode: c.led.anode };
    if (c.led.colour !== undefined) file.led.colour = c.led.colour;
  }
  if (c.wiredTo !== undefined) file.wiredTo = c.wiredTo;
  return file;
}

function functionFile(f: TargetFunction, x: (v: number) => FileValue): FunctionFile {
  const common = { id: f.id };
  if (f.kind === 'bar') {
    return { kind: 'bar', ...common, thresholds: f.thresholds.map(x), hysteresis: x(f.hysteresis), anchor: f.anchor, mode: f.mode };
  }
  if (f.kind === 'window') {
    return { kind: 'window', ...common, low: x(f.low), high: x(f.high), hysteresis: x(f.hysteresis), anchor: f.anchor, sense: f.sense, load: f.load };
  }
  return { kind: 'single', ...common, threshold: x(f.threshold), hysteresis: x(f.hysteresis), anchor: f.anchor, polarity: f.polarity, load: f.load };
}

function targetsFile(t: Targets, x: (v: number) => FileValue): TargetsFile {
  return {
    functions: t.functions.map((f) => functionFile(f, x)),
    series: t.series,
    tolerance: ratio(t.tolerance),
    stringBudget: eng(t.stringBudget, 'A'),
    inputBudget: eng(t.inputBudget, 'A'),
    led: { knee: eng(t.led.knee, 'V'), rdyn: ohms(t.led.rdyn), current: eng(t.led.current, 'A') },
    pullup: ohms(t.pullup),
    maxPackages: t.maxPackages,
    feedback: t.feedback,
    allowance: x(t.allowance),
  };
}

/**
 * The file form of `design`, ready for `JSON.stringify`. Every section is written out in full
 * (defaults included) in the same key order each time, so saved files diff cleanly.
 */
export function designToFile(design: Design): DesignFile {
  const x = xWriter(design.quantity.unit);
  const q = design.quantity;
  // The gain is signal units per unit of x, often a bare ratio, so it is written as a number.
  const signalUnit = design.input.signal === 'voltage' ? 'V' : 'A';
  const input: DesignFile['input'] = { signal: design.input.signal, offset: eng(design.input.offset, signalUnit), gain: design.input.gain };
  if (design.input.divider) input.divider = { top: ohms(design.input.divider.top), bottom: ohms(design.input.divider.bottom) };
  if (design.input.shunt !== undefined) input.shunt = ohms(design.input.shunt);
  const file: DesignFile = {
    format: 1,
    name: design.name,
    notes: design.notes,
    quantity: { name: q.name, unit: q.unit, min: x(q.min), max: x(q.max), noise: x(q.noise) },
    input,
    supply: supplyFile(design.supply),
    reference: referenceFile(design.reference),
    part: partFile(design.part),
    string: design.string.map(ohms),
    rails: design.rails.map((r) => ({ id: r.id, volts: eng(r.volts, 'V') })),
    channels: design.channels.map(channelFile),
    spares: design.spares.map((s) => ({ package: s.package, channel: s.channel, plus: s.plus, minus: s.minus })),
    resistors: { tolerance: ratio(design.resistorTolerance), series: design.series },
  };
  if (design.battery) file.battery = { chemistry: design.battery.chemistry, capacityAh: design.battery.capacityAh };
  if (design.targets) file.targets = targetsFile(design.targets, x);
  return file;
}
