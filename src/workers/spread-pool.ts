/**
 * Runs spread analyses over worker threads so every core is used and the caller stays responsive.
 * A `SpreadPool` keeps its workers between runs (their compiled code stays warm): create it once,
 * `run` as often as needed, `close` at the end. Trials are handed out in chunks to whichever worker is
 * free; results are joined in trial order, and each trial's random stream depends only on
 * (seed, trial), so the thread count never changes the numbers.
 *
 * The worker script is dist/spread-worker.js (see `defaultWorkerUrl`). When it cannot be started
 * (running from sources, or `threads: 0`) the same chunks run in this thread, yielding to the event
 * loop between chunks.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { Design } from '../engine/design/types';
import { buildSpreadModel, DEFAULT_TRIALS, joinBlocks, type SpreadModel, type SpreadReport, type SpreadRunOptions, summarize } from '../engine/spread';
import { abortError, DEFAULT_CHUNK, jobHere, type Outcome, pickModelOptions, type RunControl, runHere, spreadJobs } from './spread-jobs';
import { WorkerSet } from './worker-set';

export type { RunControl } from './spread-jobs';

/** How a pool is set up. */
export interface SpreadPoolOptions {
  /** Worker threads; 0 runs everything in this thread. Default: the available parallelism. */
  threads?: number;
  /** Worker script (an ES module); default `defaultWorkerUrl()`. */
  workerUrl?: URL | string;
  /**
   * This thread takes jobs too, between event-loop turns, from the start of each run instead of
   * waiting for the workers to come up (batch use; the screen leaves it off to stay responsive).
   */
  helpHere?: boolean;
}

/** Options of a one-off parallel run: the pool's and the run's. */
export type PoolOptions = SpreadPoolOptions & RunControl;

/** A finished parallel run: the report and how many worker threads did it (0 = this thread). */
export interface ParallelSpread {
  report: SpreadReport;
  threads: number;
}

/**
 * The worker script: dist/spread-worker.js. The bundle may put this module in dist/ or in a shared
 * chunk under dist/chunks/, so both places are looked at; from sources neither exists.
 */
export function defaultWorkerUrl(): URL {
  const beside = new URL('./spread-worker.js', import.meta.url);
  const above = new URL('../spread-worker.js', import.meta.url);
  return !existsSync(beside) && existsSync(above) ? above : beside;
}

/** `promise`, or a rejection with an AbortError as soon as `signal` aborts. */
function untilAborted<T>(promise: Promise<T>, signal: AbortSignal | undefined): Promise<T> {
  if (!signal) return promise;
  if (signal.aborted) return Promise.reject(abortError());
  return new Promise<T>((resolve, reject) => {
    const onAbort = () => reject(abortError());
    signal.addEventListener('abort', onAbort, { once: true });
    promise.then(resolve, reject).finally(() => signal.removeEventListener('abort', onAbort));
  });
}

function closedError(): Error {
  return new Error('the spread pool is closed; create a new one');
}

/**
 * A reusable set of spread worker threads. Runs are served one after another in call order; the
 * workers start with the first run (or `start`), are restarted when one has died, and never keep the
 * process alive while idle. Cancelling a run rejects it at once; a worker busy with a chunk of it
 * finishes that chunk (at most `chunk` trials) and its answer is dropped.
 */
export class SpreadPool {
  private readonly workers: WorkerSet | null;
  private readonly helpHere: boolean;
  private queue: Promise<void> = Promise.resolve();
  private isClosed = false;
  /** The model of the last run and the key of the design and options it was built from. */
  private last: { key: string; model: SpreadModel } | null = null;

  constructor(options: SpreadPoolOptions = {}) {
    const threads = Math.max(0, Math.floor(options.threads ?? availableParallelism()));
    this.workers = threads > 0 ? new WorkerSet(threads, options.workerUrl ?? defaultWorkerUrl()) : null;
    this.helpHere = options.helpHere ?? false;
  }

  /** Worker threads alive now (started or starting). */
  get liveWorkers(): number {
    return this.workers?.live ?? 0;
  }

  /** Starts the workers ahead of the first run; resolves with how many are ready (0: runs stay in this thread). */
  start(): Promise<number> {
    if (this.isClosed) return Promise.reject(closedError());
    return this.workers?.start() ?? Promise.resolve(0);
  }

  /** Runs worst case and Monte Carlo for `design`; waits for earlier runs of this pool first. */
  run(design: Design, options: SpreadRunOptions & RunControl = {}): Promise<ParallelSpread> {
    const before = this.queue;
    let release = () => {};
    this.queue = new Promise<void>((resolve) => (release = resolve));
    return new Promise<ParallelSpread>((resolve, reject) => {
      const signal = options.signal;
      // A run cancelled while it waits for its turn rejects at once and is skipped.
      const onAbort = () => reject(abortError());
      signal?.addEventListener('abort', onAbort, { once: true });
      void before.then(async () => {
        signal?.removeEventListener('abort', onAbort);
        try {
          if (signal?.aborted) throw abortError();
          resolve(await this.runNow(design, options));
        } catch (e) {
          reject(e);
        } finally {
          release();
        }
      });
    });
  }

  /** Cancels the current run (it rejects) and ends every worker; later runs reject. */
  async close(): Promise<void> {
    this.isClosed = true;
    await this.workers?.close(closedError());
  }

  private async runNow(design: Design, o: SpreadRunOptions & RunControl): Promise<ParallelSpread> {
    if (this.isClosed) throw closedError();
    // Workers boot while this thread builds the model.
    const starting = this.start();
    starting.catch(() => {});
    const options = pickModelOptions(o);
    // A run of the same design with the same model options (another seed, more trials) keeps the
    // last run's model here and in every worker (see `key`): nothing is rebuilt, and the compiled
    // code, tuned to that model's objects, stays as it is.
    const key = JSON.stringify([design, options]);
    if (this.last?.key !== key) this.last = { key, model: buildSpreadModel(design, o) };
    const model = this.last.model;
    const seed = o.seed ?? 1;
    const trials = o.trials ?? DEFAULT_TRIALS;
    const workers = this.workers;
    const jobs = spreadJobs(workers?.nextModel() ?? 0, trials, seed, o.chunk ?? DEFAULT_CHUNK, o.worstCase !== false);
    const message = { kind: 'model' as const, model: jobs[0]?.model ?? 0, key, design, options };
    let outcome: Outcome;
    let used = 0;
    if (workers && this.helpHere) {
      // Workers join as they come up; until then (or if none can start) this thread does the work.
      ({ outcome, used } = await workers.run(message, jobs, trials, o, (job) => jobHere(model, job, o)));
    } else if (workers && (await untilAborted(starting, o.signal)) > 0) {
      ({ outcome, used } = await workers.run(message, jobs, trials, o));
    } else outcome = await runHere(jobs, model, trials, o);
    const report = summarize(model, joinBlocks(outcome.blocks, model.channels.length), seed, outcome.worst, o);
    return { report, threads: used };
  }
}

/**
 * Trials a one-off run needs per worker it starts. A fresh worker takes about 50 ms to start and a
 * few hundred more before its code is compiled, and meanwhile competes with this thread for the
 * cores: on a 2-core machine a one-off run of 10 000 trials took 300–430 ms with one worker and
 * about 200 ms without, and even 40 000 trials gained nothing. A pool kept warm (the screen's) is
 * a different matter: there two workers run 10 000 trials in about 60 % of one thread's time.
 */
export const TRIALS_PER_WORKER = 20_000;

/**
 * Runs worst case and Monte Carlo for `design` on a one-off pool (workers started for this run and
 * ended after it), as the batch command does. This thread works too from the first moment. By
 * default a run starts one worker per TRIALS_PER_WORKER trials, at most one per core but one;
 * `threads` (workers besides this thread) sets the number, capped at the number of jobs.
 */
export async function runSpreadParallel(design: Design, options: SpreadRunOptions & PoolOptions = {}): Promise<ParallelSpread> {
  const trials = options.trials ?? DEFAULT_TRIALS;
  const jobCount = spreadJobs(0, trials, 1, options.chunk ?? DEFAULT_CHUNK, options.worstCase !== false).length;
  const wanted = options.threads ?? Math.min(availableParallelism() - 1, trials / TRIALS_PER_WORKER);
  const threads = Math.max(0, Math.min(Math.floor(wanted), jobCount));
  const pool = new SpreadPool({ threads, workerUrl: options.workerUrl, helpHere: options.helpHere ?? true });
  try {
    return await pool.run(design, options);
  } finally {
    await pool.close();
  }
}
