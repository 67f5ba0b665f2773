/**
 * The pieces of a parallel spread run that do not depend on threads: the job list, the options a
 * worker needs, the cancellation error, and running the jobs in this thread when no worker can start.
 */
import {
  runTrials,
  type SpreadModel,
  type SpreadRunOptions,
  type TrialBlock,
  worstCase,
  type WorstCase,
} from '../engine/spread';
import type { SpreadJob, SpreadModelOptions, SpreadReply } from './spread-protocol';

/** How one run is split and followed: chunk size, progress, cancellation. */
export interface RunControl {
  /** Trials per job handed to a worker; default 250. */
  chunk?: number;
  /** Called after each finished chunk with trials done and the total. */
  onProgress?: (done: number, total: number) => void;
  /** Aborting it stops the run and rejects it with an error named `AbortError`. */
  signal?: AbortSignal;
}

/** Default trials per job: short enough that a cancelled chunk ends within a few tens of ms. */
export const DEFAULT_CHUNK = 250;

/** What the jobs of a run produced: trial blocks in any order and the worst case when asked for. */
export interface Outcome {
  blocks: TrialBlock[];
  worst: WorstCase | null;
}

/** The error a cancelled run rejects with (name `AbortError`). */
export function abortError(): Error {
  const e = new Error('spread analysis cancelled');
  e.name = 'AbortError';
  return e;
}

/**
 * The jobs of a run on model `model`: the worst-case search first (unless `worstCase: false`), then
 * trial ranges of `chunk` trials (the last one shorter).
 */
export function spreadJobs(model: number, trials: number, seed: number, chunk: number, withWorst: boolean): SpreadJob[] {
  const jobs: SpreadJob[] = [];
  const size = Math.max(1, Math.floor(chunk));
  if (withWorst) jobs.push({ kind: 'worst', model, job: 0 });
  for (let from = 0; from < trials; from += size) jobs.push({ kind: 'trials', model, job: jobs.length, seed, from, to: Math.min(trials, from + size) });
  return jobs;
}

/** Structured-clone-safe copy of the options that shape the model and the worst-case search. */
export function pickModelOptions(o: SpreadRunOptions): SpreadModelOptions {
  const { resistorTolerance, partTolerance, referenceTolerance, partLimit, ledKneeSpread, supplyRange, distributions, maxCornerParameters } = o;
  return JSON.parse(JSON.stringify({ resistorTolerance, partTolerance, referenceTolerance, partLimit, ledKneeSpread, supplyRange, distributions, maxCornerParameters }));
}

/** Runs one job in this thread and answers as a worker would. */
export function jobHere(model: SpreadModel, job: SpreadJob, o: SpreadRunOptions): Extract<SpreadReply, { kind: 'worst' | 'trials' }> {
  if (job.kind === 'worst') return { kind: 'worst', model: job.model, job: job.job, worst: worstCase(model, o) };
  return { kind: 'trials', model: job.model, job: job.job, block: runTrials(model, job.seed, job.from, job.to) };
}

/** Runs `jobs` in this thread, yielding to the event loop between them so progress and cancel get through. */
export async function runHere(jobs: SpreadJob[], model: SpreadModel, total: number, o: SpreadRunOptions & RunControl): Promise<Outcome> {
  const out: Outcome = { blocks: [], worst: null };
  let done = 0;
  for (const job of jobs) {
    await new Promise((resolve) => setImmediate(resolve));
    if (o.signal?.aborted) throw abortError();
    const reply = jobHere(model, job, o);
    if (reply.kind === 'worst') {
      out.worst = reply.worst;
      continue;
    }
    out.blocks.push(reply.block);
    done += reply.block.to - reply.block.from;
    o.onProgress?.(done, total);
  }
  return out;
}
