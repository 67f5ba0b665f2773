/**
 * Runs a spread analysis over worker threads so every core is used and the caller stays
 * responsive: progress callback, cancellation through an AbortSignal. Trials are handed out in
 * chunks to whichever worker is free; results are joined in trial order, and each trial's random
 * stream depends only on (seed, trial), so the thread count never changes the numbers.
 *
 * The worker script is dist/spread-worker.js beside the bundle (see `defaultWorkerUrl`). When it
 * cannot be started (running from sources, or `threads: 0`) the same chunks run in this thread,
 * yielding to the event loop between chunks.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { Design } from '../engine/design/types';
import {
  buildSpreadModel,
  DEFAULT_TRIALS,
  joinBlocks,
  runTrials,
  type SpreadReport,
  type SpreadRunOptions,
  summarize,
  type TrialBlock,
  worstCase,
  type WorstCase,
} from '../engine/spread';
import type { SpreadJob, SpreadReply, SpreadWorkerData } from './spread-protocol';

/** How the work is spread over threads. */
export interface PoolOptions {
  /** Worker threads; 0 runs everything in this thread. Default: the available parallelism. */
  threads?: number;
  /** Trials per job handed to a worker; default 250. */
  chunk?: number;
  /** Worker script (an ES module); default `defaultWorkerUrl()`. */
  workerUrl?: URL | string;
  /** Called after each finished chunk with trials done and the total. */
  onProgress?: (done: number, total: number) => void;
  /** Aborting it stops the workers and rejects with an error named `AbortError`. */
  signal?: AbortSignal;
}

/** A finished parallel run: the report and how many worker threads did it (0 = this thread). */
export interface ParallelSpread {
  report: SpreadReport;
  threads: number;
}

/** The worker script beside this module once bundled: dist/spread-worker.js next to dist/tapline.js. */
export function defaultWorkerUrl(): URL {
  return new URL('./spread-worker.js', import.meta.url);
}

/** Runs worst case and Monte Carlo for `design`, spread over worker threads. */
export async function runSpreadParallel(design: Design, options: SpreadRunOptions & PoolOptions = {}): Promise<ParallelSpread> {
  const model = buildSpreadModel(design, options);
  const seed = options.seed ?? 1;
  const trials = options.trials ?? DEFAULT_TRIALS;
  const chunk = Math.max(1, Math.floor(options.chunk ?? 250));
  const jobs: SpreadJob[] = [];
  if (options.worstCase !== false) jobs.push({ kind: 'worst', job: 0 });
  for (let from = 0; from < trials; from += chunk) jobs.push({ kind: 'trials', job: jobs.length, seed, from, to: Math.min(trials, from + chunk) });
  const threads = Math.max(0, Math.min(Math.floor(options.threads ?? availableParallelism()), jobs.length));
  const data: SpreadWorkerData = { design, options: pickModelOptions(options) };
  let outcome: Outcome | null = null;
  if (threads > 0) outcome = await runOnWorkers(jobs, data, threads, trials, options);
  const used = outcome ? threads : 0;
  outcome ??= await runHere(jobs, model, trials, options);
  const report = summarize(model, joinBlocks(outcome.blocks, model.channels.length), seed, outcome.worst, options);
  return { report, threads: used };
}

interface Outcome {
  blocks: TrialBlock[];
  worst: WorstCase | null;
}

function abortError(): Error {
  const e = new Error('spread analysis cancelled');
  e.name = 'AbortError';
  return e;
}

/** Structured-clone-safe copy of the options that shape the model and the worst-case search. */
function pickModelOptions(o: SpreadRunOptions): SpreadWorkerData['options'] {
  const { resistorTolerance, partTolerance, referenceTolerance, partLimit, ledKneeSpread, supplyRange, distributions, maxCornerParameters } = o;
  return JSON.parse(JSON.stringify({ resistorTolerance, partTolerance, referenceTolerance, partLimit, ledKneeSpread, supplyRange, distributions, maxCornerParameters }));
}

async function runHere(jobs: SpreadJob[], model: ReturnType<typeof buildSpreadModel>, total: number, o: SpreadRunOptions & PoolOptions): Promise<Outcome> {
  const out: Outcome = { blocks: [], worst: null };
  let done = 0;
  for (const job of jobs) {
    await new Promise((resolve) => setImmediate(resolve));
    if (o.signal?.aborted) throw abortError();
    if (job.kind === 'worst') {
      out.worst = worstCase(model, o);
      continue;
    }
    out.blocks.push(runTrials(model, job.seed, job.from, job.to));
    done += job.to - job.from;
    o.onProgress?.(done, total);
  }
  return out;
}

/**
 * Runs the jobs on `threads` workers. Resolves null when the workers cannot start (no worker script),
 * so the caller can fall back to this thread; rejects on cancellation or a failure after start.
 */
function runOnWorkers(jobs: SpreadJob[], data: SpreadWorkerData, threads: number, total: number, o: PoolOptions): Promise<Outcome | null> {
  return new Promise((resolve, reject) => {
    const out: Outcome = { blocks: [], worst: null };
    const workers: Worker[] = [];
    let next = 0;
    let pending = jobs.length;
    let done = 0;
    let started = false;
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      o.signal?.removeEventListener('abort', onAbort);
      for (const w of workers) void w.terminate();
      fn();
    };
    const onAbort = () => finish(() => reject(abortError()));
    if (o.signal?.aborted) return onAbort();
    o.signal?.addEventListener('abort', onAbort);
    const feed = (w: Worker) => {
      if (next < jobs.length) w.postMessage(jobs[next++]);
    };
    const onReply = (w: Worker, reply: SpreadReply) => {
      started = true;
      if (reply.kind === 'failed') return finish(() => reject(new Error(reply.message)));
      if (reply.kind === 'worst') out.worst = reply.worst;
      else {
        out.blocks.push(reply.block);
        done += reply.block.to - reply.block.from;
        o.onProgress?.(done, total);
      }
      pending--;
      if (pending === 0) return finish(() => resolve(out));
      feed(w);
    };
    const onError = (e: Error) => finish(() => (started ? reject(e) : resolve(null)));
    try {
      for (let i = 0; i < threads; i++) {
        const w = new Worker(o.workerUrl ?? defaultWorkerUrl(), { workerData: data });
        workers.push(w);
        w.on('message', (reply: SpreadReply) => onReply(w, reply));
        w.on('error', onError);
        w.on('exit', (code) => {
          if (code !== 0) onError(new Error(`spread worker stopped with exit code ${code}`));
        });
        feed(w);
      }
    } catch {
      finish(() => resolve(null));
    }
  });
}
