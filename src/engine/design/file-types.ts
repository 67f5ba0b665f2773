/**
 * The FILE form of a design (`*.tapline.json`), as `tapline.schema.json` describes it. It mirrors
 * `Design`, but every value may be a plain SI number or text with units, SI prefixes or RKM codes
 * ("4k7", "2.5 V", "100 uA", "1 %"), and optional fields may be left out.
 */
import type { Anchor, SeriesName } from './types';

/** A value as written: a plain SI number or text such as "4k7" or "2.5 V". */
export type FileValue = string | number;

/** A part section: a built-in class id plus any overridden `PartClass` fields. */
export interface PartFile {
  class: string;
  description?: string;
  output?: 'open-collector' | 'push-pull';
  biasDirection?: 'out' | 'in';
  supplyMin?: FileValue;
  supplyMax?: FileValue;
  absMaxSupply?: FileValue;
  iqPerPackage?: FileValue;
  vosTyp?: FileValue;
  vosMax?: FileValue;
  ibTyp?: FileValue;
  ibMax?: FileValue;
  cmMin?: FileValue;
  cmHeadroom?: FileValue;
  vsat0?: FileValue;
  rsat?: FileValue;
  sinkMax?: FileValue;
  vohDrop?: FileValue;
  rout?: FileValue;
}

/** One channel as written. */
export interface ChannelFile {
  id: string;
  label: string;
  package: number;
  channel: number;
  plus: string;
  minus: string;
  seriesPlus?: FileValue;
  seriesMinus?: FileValue;
  feedback?: { resistor: FileValue; to: 'plus' | 'minus' };
  pullup?: { resistor: FileValue; to: string };
  led?: { resistor: FileValue; knee: FileValue; rdyn?: FileValue; anode: string; colour?: string };
  wiredTo?: string;
}

/** One target function as written. */
export type FunctionFile =
  | { kind: 'bar'; id: string; thresholds: FileValue[]; hysteresis: FileValue; anchor?: Anchor; mode?: 'bar' | 'dot' }
  | {
      kind: 'window'; id: string; low: FileValue; high: FileValue; hysteresis: FileValue; anchor?: Anchor;
      sense?: 'inside' | 'outside'; load?: 'led' | 'logic' | 'relay';
    }
  | {
      kind: 'single'; id: string; threshold: FileValue; hysteresis: FileValue; anchor?: Anchor;
      polarity: 'above' | 'below'; load?: 'led' | 'logic' | 'relay';
    };

/** Planner targets as written. */
export interface TargetsFile {
  functions: FunctionFile[];
  series?: SeriesName;
  tolerance?: FileValue;
  stringBudget?: FileValue;
  inputBudget?: FileValue;
  led?: { knee?: FileValue; rdyn?: FileValue; current?: FileValue };
  pullup?: FileValue;
  maxPackages?: number;
  feedback?: 'auto' | 'tap' | 'input';
  allowance?: FileValue;
}

/** A whole design file. */
export interface DesignFile {
  $schema?: string;
  format: 1;
  name: string;
  notes?: string;
  quantity: { name: string; unit: string; min: FileValue; max: FileValue; noise?: FileValue };
  input: {
    signal: 'voltage' | 'current';
    offset: FileValue;
    gain: FileValue;
    divider?: { top: FileValue; bottom: FileValue };
    shunt?: FileValue;
  };
  supply: { kind: 'measured' } | { kind: 'fixed'; volts: FileValue; min: FileValue; max: FileValue };
  reference:
    | { kind: 'supply' }
    | {
        kind: 'shunt'; volts: FileValue; bias: FileValue; rdyn?: FileValue; minCurrent?: FileValue;
        maxCurrent?: FileValue; tolerance?: FileValue;
      }
    | { kind: 'external'; volts: FileValue; tolerance?: FileValue };
  part: PartFile;
  string: FileValue[];
  rails?: { id: string; volts: FileValue }[];
  channels: ChannelFile[];
  spares?: { package: number; channel: number; plus: string; minus: string }[];
  resistors: { tolerance: FileValue; series: SeriesName };
  battery?: { chemistry: string; capacityAh: FileValue };
  targets?: TargetsFile;
}
