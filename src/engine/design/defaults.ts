/**
 * Values the loader fills in when a design file leaves an optional field out. SI units.
 */

/** Shunt reference defaults: from memory, typical adjustable shunt reference class. */
export const SHUNT_DEFAULTS = {
  /** Dynamic impedance while regulating (ohms). */
  rdyn: 0.2,
  /** Least cathode current for regulation (A). */
  minCurrent: 1e-3,
  /** Largest allowed cathode current (A). */
  maxCurrent: 100e-3,
  /** Relative tolerance of the regulated voltage. */
  tolerance: 0.005,
} as const;

/** Tolerance of an external reference when the file gives none (relative); same class figure. */
export const EXTERNAL_REFERENCE_TOLERANCE = 0.005;

/** LED dynamic resistance above the knee (ohms): common practice, no source. */
export const LED_RDYN = 20;

/** Noise on x when the file gives none (unit of x): unknown, taken as none. */
export const QUANTITY_NOISE = 0;

/** Planner target defaults; each is common practice, no source. */
export const TARGET_DEFAULTS = {
  /** Most current the string may draw (A). */
  stringBudget: 100e-6,
  /** Most current the input divider may draw (A). */
  inputBudget: 100e-6,
  /** Indicator LED: knee (V), dynamic resistance (ohms), target current (A). */
  led: { knee: 1.9, rdyn: LED_RDYN, current: 5e-3 },
  /** Logic pull-up (ohms). */
  pullup: 10e3,
  /** Largest number of quad packages. */
  maxPackages: 4,
  /** Feedback placement. */
  feedback: 'auto',
  /** Allowed trip-point error as a fraction of the x range (quantity.max − quantity.min). */
  allowanceOfRange: 0.01,
  /** Edge placed on the threshold. */
  anchor: 'centre',
  /** Bar display mode. */
  mode: 'bar',
  /** Window output sense. */
  sense: 'inside',
  /** Output load. */
  load: 'led',
} as const;
