/**
 * Worker-thread entry of monteCarloParallel: claims slices of the samples (one atomic counter shared
 * with every thread) until none is left, posting each finished slice's table, then 'done'. Bundle
 * it as its own entry (dist/tolerance-worker.js).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { evaluateSamples } from './evaluateSamples.js';
import type { WorkerJob, WorkerMessage } from './parallel.js';

const job = workerData as WorkerJob;
const post = (m: WorkerMessage, transfer: ArrayBuffer[] = []) => parentPort!.postMessage(m, transfer);
const slices = Math.ceil(job.count / job.slice);
for (let index = Atomics.add(job.claims, 0, 1); index < slices; index = Atomics.add(job.claims, 0, 1)) {
  const first = index * job.slice;
  const table = evaluateSamples(job.circuit, job.parameters, job.plan, job.deviates, first, Math.min(job.count, first + job.slice));
  const buffers = [table.worstRipple, table.droop, table.settlingTime, ...(table.inl ? [table.inl] : []), ...(table.gain ? [table.gain] : [])].map(
    (a) => a.buffer as ArrayBuffer,
  );
  post({ kind: 'slice', index, table }, buffers);
}
post({ kind: 'done' });
