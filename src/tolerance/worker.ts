/**
 * Worker-thread entry of monteCarloParallel: evaluates one contiguous block of samples and posts
 * progress and the finished table back. Bundle it as its own entry (dist/tolerance-worker.js).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { evaluateSamples } from './evaluateSamples.js';
import type { WorkerJob, WorkerMessage } from './parallel.js';

const job = workerData as WorkerJob;
const post = (m: WorkerMessage, transfer: ArrayBuffer[] = []) => parentPort!.postMessage(m, transfer);
const table = evaluateSamples(job.circuit, job.parameters, job.plan, job.deviates, 0, job.count, (done) =>
  post({ kind: 'progress', done }),
);
const buffers = [table.worstRipple, table.droop, table.settlingTime, ...(table.inl ? [table.inl] : []), ...(table.gain ? [table.gain] : [])].map(
  (a) => a.buffer as ArrayBuffer,
);
post({ kind: 'done', table }, buffers);
