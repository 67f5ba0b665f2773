/**
 * The threads behind a `SpreadPool`: starts them, hands out one run's jobs to whichever is free,
 * drops answers of cancelled runs, replaces workers that died, and keeps idle workers from holding
 * the process open (`unref`). One run at a time; the pool queues them.
 */
import { Worker } from 'node:worker_threads';
import { abortError, type Outcome, type RunControl } from './spread-jobs';
import type { SpreadJob, SpreadModelMessage, SpreadReply } from './spread-protocol';

/** A reply to a job (not the start-up `ready`). */
type ReplyOf = Exclude<SpreadReply, { kind: 'ready' }>;

/** One worker thread and what it is doing. */
interface Slot {
  worker: Worker;
  /** It said `ready`: its script loaded. */
  ready: boolean;
  /** A job is out, possibly of a cancelled run whose answer will be dropped. */
  busy: boolean;
  /** Id of the model last sent to it. */
  model: number;
  /** Ended by the set or died: later events are ignored. */
  gone: boolean;
  /** Settles once it is ready or has failed to start. */
  started: Promise<void>;
  onReady: () => void;
  onFail: (e: Error) => void;
}

/** The run being served. */
interface Run {
  message: SpreadModelMessage;
  /** The next job for `slot`, or null when every job is out. */
  nextJob(slot: Slot): SpreadJob | null;
  take(reply: ReplyOf): void;
  /** Ends the run: resolves it (null) or rejects it; later calls do nothing. */
  settle(error: Error | null): void;
}

/** Up to `size` spread workers running the script at `url`. */
export class WorkerSet {
  private readonly slots: Slot[] = [];
  private starting: Promise<number> | null = null;
  private current: Run | null = null;
  private models = 0;
  private hasStarted = false;
  private cannotStart = false;
  private isClosed = false;

  constructor(private readonly size: number, private readonly url: URL | string) {}

  /** Workers alive (ready or starting). */
  get live(): number {
    return this.slots.length;
  }

  /** A fresh model id for the next run. */
  nextModel(): number {
    return ++this.models;
  }

  /**
   * Starts missing workers and resolves with how many are ready. When none has ever started (no
   * worker script) it gives up for good and resolves 0, so runs go to the caller's thread.
   */
  start(): Promise<number> {
    if (this.cannotStart || this.isClosed) return Promise.resolve(0);
    this.starting ??= this.fill().finally(() => (this.starting = null));
    return this.starting;
  }

  /**
   * Serves one run: resolves with what the jobs produced and how many workers took part. With
   * `here`, this thread takes jobs too (one per event-loop turn, through `here`) from the start, so
   * the run needs no worker to be ready yet: workers join as they come up.
   */
  run(message: SpreadModelMessage, jobs: SpreadJob[], total: number, control: RunControl, here?: (job: SpreadJob) => ReplyOf): Promise<{ outcome: Outcome; used: number }> {
    return new Promise((resolve, reject) => {
      const outcome: Outcome = { blocks: [], worst: null };
      const used = new Set<Slot>();
      const signal = control.signal;
      let next = 0;
      let pending = jobs.length;
      let done = 0;
      const onAbort = () => run.settle(abortError());
      const run: Run = {
        message,
        nextJob: (slot) => {
          if (next >= jobs.length) return null;
          used.add(slot);
          return jobs[next++];
        },
        take: (reply) => {
          if (reply.kind === 'failed') return run.settle(new Error(`spread analysis failed in a worker thread: ${reply.message}`));
          if (reply.kind === 'worst') outcome.worst = reply.worst;
          else {
            outcome.blocks.push(reply.block);
            done += reply.block.to - reply.block.from;
            try {
              control.onProgress?.(done, total);
            } catch (e) {
              return run.settle(e as Error);
            }
          }
          if (--pending === 0) run.settle(null);
        },
        settle: (error) => {
          if (this.current !== run) return;
          this.current = null;
          signal?.removeEventListener('abort', onAbort);
          for (const s of this.slots) if (!s.busy) s.worker.unref();
          if (error) reject(error);
          else resolve({ outcome, used: used.size });
        },
      };
      if (jobs.length === 0) return resolve({ outcome, used: 0 });
      if (!here && !this.slots.some((s) => s.ready)) return reject(new Error('spread analysis failed: no worker thread is running'));
      this.current = run;
      if (signal?.aborted) return run.settle(abortError());
      signal?.addEventListener('abort', onAbort, { once: true });
      for (const slot of [...this.slots]) this.feed(slot);
      if (here) void this.helpHere(run, () => (next < jobs.length ? jobs[next++] : null), here);
    });
  }

  /** This thread's share of `run`: a job per event-loop turn until none is left or the run ends. */
  private async helpHere(run: Run, nextJob: () => SpreadJob | null, here: (job: SpreadJob) => ReplyOf): Promise<void> {
    for (;;) {
      await new Promise((resolve) => setImmediate(resolve));
      if (this.current !== run) return;
      const job = nextJob();
      if (!job) return;
      let reply: ReplyOf;
      try {
        reply = here(job);
      } catch (e) {
        reply = { kind: 'failed', model: job.model, job: job.job, message: (e as Error).message };
      }
      run.take(reply);
    }
  }

  /** Rejects the current run with `reason` and ends every worker. */
  async close(reason: Error): Promise<void> {
    this.isClosed = true;
    this.current?.settle(reason);
    await Promise.all([...this.slots].map((s) => this.end(s)));
  }

  private async fill(): Promise<number> {
    const fresh: Slot[] = [];
    while (this.slots.length < this.size) {
      const slot = this.spawn();
      if (!slot) break;
      this.slots.push(slot);
      fresh.push(slot);
    }
    await Promise.allSettled(fresh.map((s) => s.started));
    if (!this.hasStarted && !this.isClosed) {
      this.cannotStart = true;
      await Promise.all([...this.slots].map((s) => this.end(s)));
    }
    return this.slots.filter((s) => s.ready).length;
  }

  /** A new worker with its events wired, or null when the thread cannot even be created. */
  private spawn(): Slot | null {
    let worker: Worker;
    try {
      worker = new Worker(this.url);
    } catch {
      return null;
    }
    const slot = { worker, ready: false, busy: false, model: 0, gone: false } as Slot;
    slot.started = new Promise<void>((resolve, reject) => {
      slot.onReady = resolve;
      slot.onFail = reject;
    });
    slot.started.catch(() => {});
    worker.on('message', (reply: SpreadReply) => this.onMessage(slot, reply));
    worker.on('error', (e: Error) => this.lost(slot, e.message));
    worker.on('messageerror', (e: Error) => this.lost(slot, `a message could not be read: ${e.message}`));
    worker.on('exit', (code: number) => this.lost(slot, `it stopped with exit code ${code}`));
    return slot;
  }

  private onMessage(slot: Slot, reply: SpreadReply): void {
    if (slot.gone) return;
    if (reply.kind === 'ready') {
      slot.ready = true;
      this.hasStarted = true;
      slot.worker.unref();
      slot.onReady();
      // A run that started without waiting for the workers takes this one on now.
      this.feed(slot);
      return;
    }
    slot.busy = false;
    const run = this.current;
    if (run && reply.model === run.message.model) run.take(reply);
    this.feed(slot);
  }

  /** Gives `slot` the next job of the current run, or lets it idle without holding the process. */
  private feed(slot: Slot): void {
    if (slot.gone || !slot.ready || slot.busy) return;
    const run = this.current;
    const job = run?.nextJob(slot);
    if (!run || !job) {
      slot.worker.unref();
      return;
    }
    try {
      if (slot.model !== run.message.model) {
        slot.worker.postMessage(run.message);
        slot.model = run.message.model;
      }
      slot.busy = true;
      slot.worker.ref();
      slot.worker.postMessage(job);
    } catch (e) {
      run.settle(new Error(`spread analysis failed: the job could not be sent to a worker thread (${(e as Error).message})`));
    }
  }

  /** A worker died or could not start: drop it; a run in progress fails with the reason. */
  private lost(slot: Slot, why: string): void {
    if (slot.gone) return;
    const wasReady = slot.ready;
    void this.end(slot);
    if (wasReady) this.current?.settle(new Error(`spread analysis failed: a worker thread stopped (${why})`));
  }

  private end(slot: Slot): Promise<void> {
    if (!slot.gone) {
      slot.gone = true;
      const k = this.slots.indexOf(slot);
      if (k >= 0) this.slots.splice(k, 1);
      if (!slot.ready) slot.onFail(new Error('the worker thread did not start'));
    }
    return slot.worker.terminate().then(
      () => undefined,
      () => undefined,
    );
  }
}
