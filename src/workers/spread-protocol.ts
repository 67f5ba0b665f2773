/** Messages between the spread pool and its workers. */
import type { Design } from '../engine/design/types';
import type { SpreadOptions, TrialBlock, WorstCase, WorstCaseOptions } from '../engine/spread';

/** Data every worker starts with: the design and the options that shape its spread model. */
export interface SpreadWorkerData {
  design: Design;
  options: SpreadOptions & WorstCaseOptions;
}

/** A job for a worker: a range of Monte Carlo trials, or the worst-case search. */
export type SpreadJob = { kind: 'trials'; job: number; seed: number; from: number; to: number } | { kind: 'worst'; job: number };

/** A worker's answer to one job, or the failure that stopped it. */
export type SpreadReply =
  | { kind: 'trials'; job: number; block: TrialBlock }
  | { kind: 'worst'; job: number; worst: WorstCase }
  | { kind: 'failed'; job: number; message: string };
