/**
 * Types shared by the planner stages. All numbers are SI (volts, amperes, ohms) except x values,
 * which are in the design's quantity unit.
 */
import type { Design, TargetFunction } from '../design/types';

/** Something the planner could not do: which target, why, and what to change. */
export interface PlanProblem {
  /** The target concerned: a function id, a channel id, or "design". */
  target: string;
  /** What cannot be met and why, one or two sentences. */
  message: string;
  /** What to change. */
  fix: string;
}

/** One comparator channel the targets need, before and after placement. */
export interface Unit {
  /** Channel id in the realised design, e.g. "charge-3", "win-lo". */
  id: string;
  /** Human label, e.g. "12.2 V step". */
  label: string;
  fn: TargetFunction;
  /** Role inside its function. */
  role: 'step' | 'low' | 'high' | 'single';
  /** Target trip points (unit of x): x rising and x falling. */
  rising: number;
  falling: number;
  /** True: signal on −, tap on + (output sinks as x rises past). False: signal on +, tap on −. */
  sinksOnRise: boolean;
  /** Tap node name once taps are assigned, e.g. "T2". */
  tap: string;
  /** Where the hysteresis feedback goes, and why. */
  feedback: 'none' | 'tap' | 'input';
  feedbackWhy: string;
  /** Placement: package (1-based) and channel within it (1..4). */
  package: number;
  channel: number;
}

/** One row of the package/channel map. */
export interface MapEntry {
  package: number;
  channel: number;
  /** Channel id, or null for a spare. */
  id: string | null;
  /** What the channel does, e.g. "bar charge step 2 (12.2 V)" or "spare". */
  role: string;
  /** What each pin function connects to: "+in", "−in", "out". */
  pins: { plusIn: string; minusIn: string; out: string };
}

/** Target vs realised for one trip point. */
export interface PlanRow {
  /** Channel id. */
  channel: string;
  /** Function id. */
  fn: string;
  /** Which trip: x rising or x falling. */
  edge: 'rising' | 'falling';
  /** Target and realised trip (unit of x); realised is null when the channel never trips. */
  target: number;
  realised: number | null;
  /** realised − target (unit of x), null when not realised. */
  error: number | null;
  /** Whether |error| is within targets.allowance. */
  ok: boolean;
}

/** A two-resistor combination offered where one series value misses by more than the allowance. */
export interface PairOffer {
  /** Designator, e.g. "RS3" or "RF:charge-2". */
  resistor: string;
  /** Wanted value (ohms). */
  ideal: number;
  /** The two series values (ohms) and how they combine. */
  values: [number, number];
  how: 'series' | 'parallel';
  /** Resulting value (ohms). */
  realised: number;
}

/** A resistor of the realised design, for the values listing. */
export interface ValueEntry {
  /** Designator as the engine names it: RS1.., RD1/RD2, RB, RF:<ch>, RIP:<ch>, RP:<ch>, RL:<ch>. */
  id: string;
  /** Value (ohms). */
  ohms: number;
  /** What it does, one phrase. */
  role: string;
}

/** Everything `plan` returns. */
export interface PlanResult {
  /** True when every target is met within the allowance and no error-level finding remains. */
  ok: boolean;
  /** The realised design (the input design with values, channels and spares filled in). */
  design: Design;
  /** Package/channel map, spares included. */
  allocation: MapEntry[];
  /** Target vs realised for every trip point. */
  rows: PlanRow[];
  /** Resistor values with their roles. */
  values: ValueEntry[];
  /** Two-resistor pairs used. */
  pairs: PairOffer[];
  /** Design decisions worth telling the user (feedback placement, wasted current, ...). */
  notes: string[];
  problems: PlanProblem[];
}
