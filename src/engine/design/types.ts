/**
 * The resolved design model: what a `*.tapline.json` file says once it has been validated and every
 * value parsed. All numbers are SI base units (volts, amperes, ohms, watts, seconds) except the
 * measured quantity x, which is in the design's own unit (`quantity.unit`).
 *
 * Node references (`NodeRef`) name points of the circuit:
 * - `gnd`: ground (0 V);
 * - `supply`: the comparator supply rail (equal to x when the gauge runs from what it measures);
 * - `ref`: the reference node (the shunt reference cathode, the external reference, or the supply
 *   when the reference is the supply itself);
 * - `in`: the sense node, where the measured quantity reaches the comparators after scaling;
 * - `T1`..`Tn-1`: the string taps, numbered from the top of the string down;
 * - `out:ID`: the output of channel ID;
 * - the `id` of any extra fixed rail in `rails`.
 */
export type NodeRef = string;

/** The measured quantity x: what the user reads and thinks in. */
export interface Quantity {
  /** Human name, e.g. "battery voltage". */
  name: string;
  /** Unit symbol of x as shown to the user, e.g. "V", "%", "°C". */
  unit: string;
  /** Lowest x of interest (unit of x); the sweep starts here. */
  min: number;
  /** Highest x of interest (unit of x); the sweep turns back here. */
  max: number;
  /** Peak-to-peak noise on x (unit of x); hysteresis should exceed it. 0 when unknown. */
  noise: number;
}

/**
 * How x reaches the comparators. The sensor delivers `signal = offset + gain·x` (volts for a
 * voltage signal, amperes for a current loop). A voltage signal may pass a scaling divider
 * (top from the signal to `in`, bottom from `in` to ground); a current signal flows into a shunt
 * resistor from `in` to ground.
 */
export interface InputPath {
  /** Whether the sensor is a voltage source or a current source. */
  signal: 'voltage' | 'current';
  /** Sensor output at x = 0 (V or A). */
  offset: number;
  /** Sensor output per unit of x (V or A per unit of x). */
  gain: number;
  /** Optional scaling divider for a voltage signal (ohms). */
  divider?: { top: number; bottom: number };
  /** Shunt resistor for a current signal (ohms). */
  shunt?: number;
}

/** The comparator supply rail. */
export type Supply =
  /** The rail is the measured voltage itself (x in volts): a gauge powered by the battery it reads. */
  | { kind: 'measured' }
  /** A fixed rail: nominal volts and the range it can wander over. */
  | { kind: 'fixed'; volts: number; min: number; max: number };

/** Where the string gets its top voltage. */
export type Reference =
  /** The string hangs straight off the supply rail: thresholds are ratiometric to it. */
  | { kind: 'supply' }
  /**
   * A shunt reference fed from the supply through a bias resistor. Modelled as a diode-like element
   * that clamps `ref` at `volts` behind `rdyn` once the supply can lift it there.
   */
  | {
      kind: 'shunt';
      /** Regulated voltage (V). */
      volts: number;
      /** Bias resistor from supply to `ref` (ohms). */
      bias: number;
      /** Dynamic impedance while regulating (ohms). */
      rdyn: number;
      /** Least cathode current for regulation (A). */
      minCurrent: number;
      /** Largest allowed cathode current (A). */
      maxCurrent: number;
      /** Relative tolerance of `volts` (e.g. 0.005 for 0.5 %). */
      tolerance: number;
    }
  /** An ideal external reference voltage. */
  | { kind: 'external'; volts: number; tolerance: number };

/** The comparator part class: parameters, never a part number. */
export interface PartClass {
  /** Class identifier, e.g. "bipolar-oc-quad". */
  id: string;
  /** Plain description by class and parameters. */
  description: string;
  /** Output stage type. */
  output: 'open-collector' | 'push-pull';
  /** Recommended supply range (V). */
  supplyMin: number;
  supplyMax: number;
  /** Absolute maximum supply (V). */
  absMaxSupply: number;
  /** Quiescent supply current per package, all four channels (A). */
  iqPerPackage: number;
  /** Input offset voltage, typical and maximum magnitude (V). */
  vosTyp: number;
  vosMax: number;
  /** Input bias current, typical and maximum magnitude (A). */
  ibTyp: number;
  ibMax: number;
  /** Bias current direction: `out` = sourced out of the pin (bipolar PNP inputs), `in` = into it. */
  biasDirection: 'out' | 'in';
  /** Lowest allowed input voltage (V, relative to ground). */
  cmMin: number;
  /** Input common-mode headroom below the supply (V); the top of the range is supply − this. */
  cmHeadroom: number;
  /** Output low: saturation voltage at zero current (V) and its series resistance (ohms). */
  vsat0: number;
  rsat: number;
  /** Largest sink current per output (A). */
  sinkMax: number;
  /** Push-pull only: output-high drop below the supply (V) and the output resistance (ohms). */
  vohDrop: number;
  rout: number;
}

/** One comparator channel as wired. */
export interface Channel {
  /** Unique, user-facing identifier, e.g. "A" or "step1". */
  id: string;
  /** What this channel is for, e.g. "12.2 V step". */
  label: string;
  /** Package number, 1-based. */
  package: number;
  /** Channel within the quad package, 1..4. */
  channel: number;
  /** What the non-inverting and inverting inputs connect to. */
  plus: NodeRef;
  minus: NodeRef;
  /** Optional series resistors between the named node and the input pin (ohms). */
  seriesPlus?: number;
  seriesMinus?: number;
  /**
   * Feedback resistor from the output to an input pin (ohms). `plus` is positive feedback
   * (hysteresis); `minus` is negative feedback, which a comparator cannot live with.
   */
  feedback?: { ohms: number; to: 'plus' | 'minus' };
  /** Pull-up resistor from the output to a node (ohms). */
  pullup?: { ohms: number; to: NodeRef };
  /** LED with series resistor, from `anode` to this output (lit when the output sinks). */
  led?: { ohms: number; knee: number; rdyn: number; anode: NodeRef; colour?: string };
  /** Another channel whose output is tied to this one (wired-OR window). */
  wiredTo?: string;
}

/** An extra fixed rail, e.g. a logic supply for pull-ups. */
export interface Rail {
  id: string;
  volts: number;
}

/** A package slot deliberately left unused, with its inputs tied to defined levels. */
export interface Spare {
  package: number;
  channel: number;
  plus: NodeRef;
  minus: NodeRef;
}

/** IEC 60063 series names. */
export type SeriesName = 'E3' | 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

/** Where the hysteresis band sits relative to the stated threshold. */
export type Anchor = 'rising' | 'falling' | 'centre';

/** Target functions the planner realises. Thresholds are in units of x. */
export type TargetFunction =
  | {
      kind: 'bar';
      id: string;
      /** Step thresholds, ascending (unit of x). */
      thresholds: number[];
      /** Hysteresis per step (unit of x). */
      hysteresis: number;
      anchor: Anchor;
      /** `bar`: every step below the level lit; `dot`: only the step at the level. */
      mode: 'bar' | 'dot';
    }
  | {
      kind: 'window';
      id: string;
      low: number;
      high: number;
      hysteresis: number;
      anchor: Anchor;
      /** Output asserted (sinking) when x is inside or outside the window. */
      sense: 'inside' | 'outside';
      load: 'led' | 'logic' | 'relay';
    }
  | {
      kind: 'single';
      id: string;
      threshold: number;
      hysteresis: number;
      anchor: Anchor;
      /** Output asserted (sinking) when x is above or below the threshold. */
      polarity: 'above' | 'below';
      load: 'led' | 'logic' | 'relay';
    };

/** Planner targets carried in the same file as the realised circuit. */
export interface Targets {
  functions: TargetFunction[];
  /** Resistor series and tolerance for snapping. */
  series: SeriesName;
  tolerance: number;
  /** Most current the string may draw (A). */
  stringBudget: number;
  /** Most current the input divider may draw (A). */
  inputBudget: number;
  /** LED knee voltage (V), dynamic resistance (ohms) and target current (A). */
  led: { knee: number; rdyn: number; current: number };
  /** Logic pull-up value (ohms) for logic and relay-driver loads. */
  pullup: number;
  /** Largest allowed quad packages. */
  maxPackages: number;
  /** Feedback placement: chosen per function, or forced. */
  feedback: 'auto' | 'tap' | 'input';
  /** Largest trip-point error accepted before a two-resistor pair is offered (unit of x). */
  allowance: number;
}

/** Battery facts for drain estimates (optional). */
export interface Battery {
  /** Chemistry label shown in cautions, e.g. "lead-acid", "lithium-ion". */
  chemistry: string;
  /** Capacity (ampere-hours). */
  capacityAh: number;
}

/** A whole design, resolved to SI numbers. */
export interface Design {
  format: 1;
  name: string;
  notes: string;
  quantity: Quantity;
  input: InputPath;
  supply: Supply;
  reference: Reference;
  part: PartClass;
  /** The resistor string, top to bottom, fed from `ref` (or `supply` when the reference is it). */
  string: number[];
  rails: Rail[];
  channels: Channel[];
  spares: Spare[];
  /** Resistor tolerance for the built circuit (relative) and its series. */
  resistorTolerance: number;
  series: SeriesName;
  battery?: Battery;
  targets?: Targets;
}
