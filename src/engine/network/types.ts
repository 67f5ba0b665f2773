/**
 * The compiled circuit: a small resistive network whose sources are affine in the measured quantity x.
 * Node indices count from 0; ground is `GND` (-1) and never gets a row.
 */

/** Index used for ground in every element. */
export const GND = -1;

/** A resistor between nodes `a` and `b` (ohms). */
export interface NetResistor {
  /** Designator, e.g. "RS1" (string), "RF2" (feedback), "RP3" (pull-up). */
  id: string;
  a: number;
  b: number;
  ohms: number;
}

/** A voltage source from ground to `node`: V(node) = c0 + c1·x (V). */
export interface NetVSource {
  id: string;
  node: number;
  c0: number;
  c1: number;
}

/** A current source pushing c0 + c1·x amperes out of node `from` and into node `to`. */
export interface NetISource {
  id: string;
  from: number;
  to: number;
  c0: number;
  c1: number;
}

/** One comparator channel. */
export interface NetComparator {
  /** Channel id from the design. */
  id: string;
  plus: number;
  minus: number;
  out: number;
  /** Offset added to the non-inverting input (V). */
  vos: number;
  /** Bias current at each input (A); positive flows out of the pin into the node. */
  ibPlus: number;
  ibMinus: number;
  /** Output low: Vsat0 (V) behind rsat (ohms) to ground. */
  vsat0: number;
  rsat: number;
  /** Push-pull output: when high, drives `supply` − vohDrop behind rout. */
  pushPull: boolean;
  vohDrop: number;
  rout: number;
}

/**
 * A piecewise-linear diode from `anode` to `cathode`: open below `knee`, otherwise a knee source in
 * series with `rSeries + rdyn`. Used for LEDs (with their series resistor folded in) and for the
 * shunt reference (knee = reference voltage, anode = ref node, cathode = ground).
 */
export interface NetDiode {
  /** "D:<channel id>" for an LED, "VREF" for the shunt reference. */
  id: string;
  kind: 'led' | 'shunt';
  anode: number;
  cathode: number;
  knee: number;
  /** External series resistance folded into the branch (ohms), e.g. the LED resistor. */
  rSeries: number;
  /** Dynamic resistance of the junction itself (ohms). */
  rdyn: number;
  /** Designator of the folded series resistor, when there is one. */
  seriesId?: string;
  /** Owning channel id for LEDs. */
  channel?: string;
}

/** The whole network. */
export interface Network {
  /** Node names by index, e.g. "supply", "ref", "in", "T1", "out:A", "p+:A". */
  nodes: string[];
  resistors: NetResistor[];
  vsources: NetVSource[];
  isources: NetISource[];
  comparators: NetComparator[];
  diodes: NetDiode[];
  /** Node index of the comparator supply rail. */
  supply: number;
  /** Index into `vsources` of the source that feeds the supply rail (its current is the drain). */
  supplySource: number;
  /** Quiescent current of all packages, drawn from the supply (A). */
  quiescent: number;
}
