/**
 * Messages between the spread pool and its workers. A worker lives across runs: each run sends it
 * one `model` message (design and options, tagged with the run's model id) before its first job of
 * that run, and every job and reply carries the model id, so replies of a cancelled run are told
 * apart from the current one.
 */
import type { Design } from '../engine/design/types';
import type { SpreadOptions, TrialBlock, WorstCase, WorstCaseOptions } from '../engine/spread';

/** The options that shape a spread model and its worst-case search (structured-clone safe). */
export type SpreadModelOptions = SpreadOptions & WorstCaseOptions;

/** Sets up the model a run's jobs refer to; the worker keeps the latest one. */
export interface SpreadModelMessage {
  kind: 'model';
  /** Model id, unique within a pool and to one run (replies of a cancelled run are told apart by it). */
  model: number;
  /**
   * The design and options as one text: a worker whose model was built from the same text keeps it
   * under the new id instead of building it again.
   */
  key: string;
  design: Design;
  options: SpreadModelOptions;
}

/** A job for a worker: a range of Monte Carlo trials, or the worst-case search, on model `model`. */
export type SpreadJob =
  | { kind: 'trials'; model: number; job: number; seed: number; from: number; to: number }
  | { kind: 'worst'; model: number; job: number };

/** Anything the pool sends a worker. */
export type SpreadRequest = SpreadModelMessage | SpreadJob;

/** A worker's answer: ready after start-up, then one reply per job (its result or its failure). */
export type SpreadReply =
  | { kind: 'ready' }
  | { kind: 'trials'; model: number; job: number; block: TrialBlock }
  | { kind: 'worst'; model: number; job: number; worst: WorstCase }
  | { kind: 'failed'; model: number; job: number; message: string };
