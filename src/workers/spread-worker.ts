/**
 * Worker thread entry of the spread pool (bundled to dist/spread-worker.js). Builds the spread model
 * once from its worker data, then answers jobs: trial ranges and the worst-case search.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { buildSpreadModel, runTrials, worstCase } from '../engine/spread';
import type { SpreadJob, SpreadReply, SpreadWorkerData } from './spread-protocol';

const data = workerData as SpreadWorkerData;
const model = buildSpreadModel(data.design, data.options);

parentPort?.on('message', (job: SpreadJob) => {
  let reply: SpreadReply;
  try {
    if (job.kind === 'trials') {
      const block = runTrials(model, job.seed, job.from, job.to);
      reply = { kind: 'trials', job: job.job, block };
      parentPort?.postMessage(reply, [block.rising.buffer as ArrayBuffer, block.falling.buffer as ArrayBuffer, block.chatter.buffer as ArrayBuffer]);
      return;
    }
    reply = { kind: 'worst', job: job.job, worst: worstCase(model, data.options) };
  } catch (e) {
    reply = { kind: 'failed', job: job.job, message: (e as Error).message };
  }
  parentPort?.postMessage(reply);
});
