/**
 * What one exact analysis of a design returns. Numbers are SI (volts, amperes, ohms, watts) except
 * x values, which are in the design's quantity unit. No NaN or Infinity ever appears: absent values
 * are `null`.
 */

/** Severity of a finding: `error` makes `check` exit 1. */
export type Severity = 'error' | 'warning' | 'info';

/** One thing the checks found. */
export interface Finding {
  severity: Severity;
  /** Stable machine code, e.g. "common-mode", "sink-current", "floating-output". */
  code: string;
  /** The part concerned: a channel id, resistor designator, "reference", "supply", ... */
  part: string;
  /** Where in x it happens (unit of x), when it has a place. */
  x: number | null;
  /** How much, as readable text with units, e.g. "0.42 V above the limit". */
  amount: string;
  /** What is wrong, one sentence. */
  message: string;
  /** What to change, one sentence. */
  fix: string;
}

/** A trip point: where a channel's output changes state. */
export interface Trip {
  /** Measured quantity at the transition (unit of x). */
  x: number;
  /** Voltage at the comparator's inverting pin just before the transition (V). */
  pinMinus: number;
  /** Voltage at the non-inverting pin just before the transition (V). */
  pinPlus: number;
}

/** Trip points and hysteresis of one channel. */
export interface ChannelResult {
  id: string;
  label: string;
  package: number;
  channel: number;
  /** First transition as x rises, or null when the output never changes going up. */
  rising: Trip | null;
  /** First transition as x falls, or null. */
  falling: Trip | null;
  /** Output state after the up transition: `low` = sinking (LED lit). */
  risingTo: 'low' | 'high' | null;
  /** rising.x − falling.x (unit of x), null unless both exist. */
  hysteresis: number | null;
  /** Hysteresis seen at the reference pin (V): the change of the threshold-side pin voltage. */
  hysteresisPins: number | null;
  /** Largest sink current of this output over the whole range (A). */
  sinkMax: number;
  /** LED current when lit at the top of its range (A), null without an LED. */
  ledCurrentMax: number | null;
}

/** Voltage of one string tap over the sweep. */
export interface TapResult {
  /** Tap node name, e.g. "T2". */
  node: string;
  /** Lowest and highest tap voltage seen over both sweeps (V). */
  min: number;
  max: number;
  /** Channels whose inputs connect to this tap. */
  channels: string[];
}

/** A stretch of x where the network keeps one state and everything is affine in x. */
export interface Segment {
  /** Sweep direction this segment belongs to. */
  direction: 'up' | 'down';
  /** Ends of the stretch (unit of x), from <= to. */
  from: number;
  to: number;
  /** Output state per channel id: true = sinking (low). */
  low: Record<string, boolean>;
  /** Per LED (keyed by channel id): lit, i.e. carrying at least LIT_CURRENT at the middle of the stretch. */
  lit: Record<string, boolean>;
}

/** A band of x with no stable state: the circuit chatters there. */
export interface ChatterBand {
  direction: 'up' | 'down';
  from: number;
  to: number;
  /** Elements that keep flipping. */
  elements: string[];
}

/** The circuit as it is at one value of x, on a given sweep direction. */
export interface ProbeResult {
  x: number;
  direction: 'up' | 'down';
  /** Node voltages by name (V). */
  nodes: Record<string, number>;
  /** Output sinking per channel id. */
  low: Record<string, boolean>;
  /** LED lit (carrying at least LIT_CURRENT) per channel id. */
  lit: Record<string, boolean>;
  /** Current drawn from the supply rail, including part quiescent current (A). */
  supplyCurrent: number;
  /** Sink current per channel output (A). */
  sinkCurrent: Record<string, number>;
  /** Current in each LED (A). */
  ledCurrent: Record<string, number>;
}

/** The whole analysis. */
export interface Analysis {
  channels: ChannelResult[];
  taps: TapResult[];
  segments: Segment[];
  chatter: ChatterBand[];
  /** Supply current extremes over the range, with where they occur (A; x in its unit). */
  supplyCurrent: { min: number; minAt: number; max: number; maxAt: number };
  /** Worst dissipation of each resistor over the range (W), by designator. */
  dissipation: Record<string, number>;
  findings: Finding[];
}
