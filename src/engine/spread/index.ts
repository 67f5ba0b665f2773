/**
 * Spread analysis (ENGINE.md §4): worst case and Monte Carlo on the exact engine. This module is the
 * single-threaded, pure entry; the worker pool in src/workers runs the same trials over threads.
 */
import type { Design } from '../design/types';
import { buildSpreadModel } from './model';
import { runTrials } from './monte-carlo';
import type { SpreadOptions } from './perturb';
import { type SpreadReport, summarize, type SummaryOptions } from './summary';
import { worstCase, type WorstCaseOptions } from './worst-case';

export { createRng, drawUnit, unitStandardDeviation, type DistributionKind, type Rng } from './distributions';
export { buildSpreadModel, evaluateAt, sweepAt, sweepTrips, type SpreadModel, type TripSample } from './model';
export { joinBlocks, runTrials, trialUnits, type TrialBlock } from './monte-carlo';
export {
  DEFAULT_DISTRIBUTIONS,
  DEFAULT_KNEE_SPREAD,
  parameterValue,
  perturbInto,
  perturbNetwork,
  spreadParameters,
  type Parameter,
  type ParameterGroup,
  type SpreadOptions,
  valueCopy,
} from './perturb';
export { summarize, type ChannelSpread, type OrderRisk, type QuantitySpread, type SpreadReport, type SummaryOptions } from './summary';
export { worstCase, type Bound, type ChannelBounds, type WorstCase, type WorstCaseOptions } from './worst-case';

/** Everything a spread run needs besides the design. */
export interface SpreadRunOptions extends SpreadOptions, SummaryOptions, WorstCaseOptions {
  /** Monte Carlo trials; default 10 000. */
  trials?: number;
  /** Seed of the run (32-bit integer); default 1. */
  seed?: number;
  /** Whether to run the worst-case search as well; default true. */
  worstCase?: boolean;
}

/** Default Monte Carlo trial count. */
export const DEFAULT_TRIALS = 10_000;

/** Runs worst case and Monte Carlo on one thread and returns the report. Pure and deterministic. */
export function runSpread(design: Design, options: SpreadRunOptions = {}): SpreadReport {
  const model = buildSpreadModel(design, options);
  const seed = options.seed ?? 1;
  const block = runTrials(model, seed, 0, options.trials ?? DEFAULT_TRIALS);
  const worst = options.worstCase === false ? null : worstCase(model, options);
  return summarize(model, block, seed, worst, options);
}
