/**
 * Built-in comparator part classes, described by class and parameters only. Every number is a
 * round typical or guaranteed figure for the class, recalled from memory: check your datasheet and
 * override any field in the design file's `part` section.
 */
import type { PartClass } from './design/types';

/** Bipolar open-collector quad comparator, the classic general-purpose class. */
const BIPOLAR_OC_QUAD: PartClass = {
  id: 'bipolar-oc-quad',
  description: 'bipolar open-collector quad comparator, 2–36 V single supply',
  output: 'open-collector',
  // From memory, check your datasheet: 2–36 V operating, 36 V absolute maximum.
  supplyMin: 2,
  supplyMax: 36,
  absMaxSupply: 36,
  // From memory: about 0.8 mA typical for the whole package, output off.
  iqPerPackage: 0.8e-3,
  // From memory: 2 mV typical; 7 mV is the maximum over the temperature range (5 mV at 25 °C).
  // The larger figure is used so worst-case spread covers a gauge in a cold garage or hot car.
  vosTyp: 2e-3,
  vosMax: 7e-3,
  // From memory: 25 nA typical, 250 nA maximum, sourced out of the pin (PNP input stage).
  ibTyp: 25e-9,
  ibMax: 250e-9,
  biasDirection: 'out',
  // From memory: inputs work down to ground and up to 1.5 V below the supply.
  cmMin: 0,
  cmHeadroom: 1.5,
  // From memory: about 0.1 V at light load, rising to about 0.35 V at 4 mA (0.1 V + 4 mA × 60 Ω).
  vsat0: 0.1,
  rsat: 60,
  // From memory: 6 mA is the guaranteed least sink current (16 mA typical); the guaranteed figure
  // is used as the limit so a design that passes holds for every part of the class.
  sinkMax: 6e-3,
  vohDrop: 0,
  rout: 0,
};

/** CMOS open-drain micropower quad comparator for battery-powered designs. */
const CMOS_OD_MICROPOWER_QUAD: PartClass = {
  id: 'cmos-od-micropower-quad',
  description: 'CMOS open-drain micropower quad comparator, 2–16 V, rail-to-rail input',
  output: 'open-collector',
  // From memory, check your datasheet: 2–16 V operating, 18 V absolute maximum.
  supplyMin: 2,
  supplyMax: 16,
  absMaxSupply: 18,
  // From memory: a few microamperes for the whole package.
  iqPerPackage: 5e-6,
  // From memory: 5 mV typical, 10 mV maximum.
  vosTyp: 5e-3,
  vosMax: 10e-3,
  // From memory: 1 pA typical, 1 nA maximum (leakage; its sign is not defined, taken as inward).
  ibTyp: 1e-12,
  ibMax: 1e-9,
  biasDirection: 'in',
  // From memory: rail-to-rail input range.
  cmMin: 0,
  cmHeadroom: 0,
  // From memory: open-drain low output about 100 Ω to ground, no saturation offset.
  vsat0: 0,
  rsat: 100,
  // From memory: about 10 mA sink per output.
  sinkMax: 10e-3,
  vohDrop: 0,
  rout: 0,
};

/** CMOS push-pull quad comparator driving logic directly. */
const CMOS_PP_QUAD: PartClass = {
  id: 'cmos-pp-quad',
  description: 'CMOS push-pull quad comparator, 2.7–5.5 V, rail-to-rail input and output',
  output: 'push-pull',
  // From memory, check your datasheet: 2.7–5.5 V operating, 6 V absolute maximum.
  supplyMin: 2.7,
  supplyMax: 5.5,
  absMaxSupply: 6,
  // From memory: some tens of microamperes for the whole package.
  iqPerPackage: 40e-6,
  // From memory: 1 mV typical, 6 mV maximum.
  vosTyp: 1e-3,
  vosMax: 6e-3,
  // From memory: 1 pA typical, 1 nA maximum (leakage, taken as inward).
  ibTyp: 1e-12,
  ibMax: 1e-9,
  biasDirection: 'in',
  // From memory: rail-to-rail input range.
  cmMin: 0,
  cmHeadroom: 0,
  // From memory: about 100 Ω output resistance either way; high level about 0.1 V below the supply.
  vsat0: 0,
  rsat: 100,
  sinkMax: 10e-3,
  vohDrop: 0.1,
  rout: 100,
};

/** The built-in part classes by id. */
export const BUILTIN_PARTS: Readonly<Record<string, PartClass>> = Object.freeze({
  [BIPOLAR_OC_QUAD.id]: BIPOLAR_OC_QUAD,
  [CMOS_OD_MICROPOWER_QUAD.id]: CMOS_OD_MICROPOWER_QUAD,
  [CMOS_PP_QUAD.id]: CMOS_PP_QUAD,
});

/** The fields of a part class a design file may override (everything except its id). */
export type PartOverrides = Partial<Omit<PartClass, 'id'>>;

/** Note shown beside the typical and maximum figures of the built-in classes. */
export const PART_VALUES_NOTE = 'from memory, check your datasheet';

/**
 * The class `id` with `overrides` applied (SI units, as in `PartClass`), or `undefined` when no class
 * has that id. Built-in classes come first; `extra` adds user classes (kept by the store) by id.
 * Undefined override fields are ignored.
 */
export function resolvePart(id: string, overrides: PartOverrides = {}, extra: Readonly<Record<string, PartClass>> = {}): PartClass | undefined {
  const base = Object.hasOwn(BUILTIN_PARTS, id) ? BUILTIN_PARTS[id] : Object.hasOwn(extra, id) ? extra[id] : undefined;
  if (!base) return undefined;
  const part: PartClass = { ...base, id };
  for (const [key, value] of Object.entries(overrides)) {
    if (value !== undefined && key !== 'id') (part as unknown as Record<string, unknown>)[key] = value;
  }
  return part;
}
