/**
 * Worker thread entry of the spread pool (bundled to dist/spread-worker.js). Says `ready` once
 * loaded, then builds a run's spread model from its `model` message (or keeps the last one when the
 * design and options are the same) and answers that run's jobs: trial ranges and the worst-case
 * search. It stays alive between runs, so its compiled code stays warm.
 */
import { parentPort } from 'node:worker_threads';
import { buildSpreadModel, runTrials, type SpreadModel, worstCase } from '../engine/spread';
import type { SpreadModelOptions, SpreadReply, SpreadRequest } from './spread-protocol';

/** The model of the current run, or why it could not be built. */
let current: { id: number; key: string; model: SpreadModel | null; options: SpreadModelOptions; error: string } | null = null;

function answer(job: Exclude<SpreadRequest, { kind: 'model' }>): void {
  if (!current || current.id !== job.model) throw new Error(`the spread worker has no model ${job.model}; this is a bug`);
  if (!current.model) throw new Error(current.error);
  if (job.kind === 'trials') {
    const block = runTrials(current.model, job.seed, job.from, job.to);
    const reply: SpreadReply = { kind: 'trials', model: job.model, job: job.job, block };
    parentPort?.postMessage(reply, [block.rising.buffer as ArrayBuffer, block.falling.buffer as ArrayBuffer, block.chatter.buffer as ArrayBuffer]);
    return;
  }
  const reply: SpreadReply = { kind: 'worst', model: job.model, job: job.job, worst: worstCase(current.model, current.options) };
  parentPort?.postMessage(reply);
}

parentPort?.on('message', (msg: SpreadRequest) => {
  if (msg.kind === 'model') {
    // The same design and options as the last run: keep the model (and the code compiled for it).
    if (current?.model && current.key === msg.key) {
      current.id = msg.model;
      return;
    }
    try {
      current = { id: msg.model, key: msg.key, model: buildSpreadModel(msg.design, msg.options), options: msg.options, error: '' };
    } catch (e) {
      // Reported with the first job of this model, where the pool waits for an answer.
      current = { id: msg.model, key: msg.key, model: null, options: msg.options, error: (e as Error).message };
    }
    return;
  }
  try {
    answer(msg);
  } catch (e) {
    const reply: SpreadReply = { kind: 'failed', model: msg.model, job: msg.job, message: (e as Error).message };
    parentPort?.postMessage(reply);
  }
});

parentPort?.postMessage({ kind: 'ready' } satisfies SpreadReply);
