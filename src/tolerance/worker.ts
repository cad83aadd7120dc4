/**
 * Worker-thread entry of monteCarloParallel: claims slices of the samples (claimSlice.ts, one
 * atomic counter shared with every thread) until none is left, posting each finished slice's table,
 * then 'done'. Bundle it as its own entry (dist/tolerance-worker.js).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { claimSlice } from './claimSlice.js';
import { evaluateSamples } from './evaluateSamples.js';
import type { WorkerJob, WorkerMessage } from './parallel.js';

const job = workerData as WorkerJob;
const post = (m: WorkerMessage, transfer: ArrayBuffer[] = []) => parentPort!.postMessage(m, transfer);
for (let s = claimSlice(job.claims, job.slice, job.count); s !== null; s = claimSlice(job.claims, job.slice, job.count)) {
  const table = evaluateSamples(job.circuit, job.parameters, job.plan, job.deviates, s.first, s.last);
  const buffers = [table.worstRipple, table.droop, table.settlingTime, ...(table.inl ? [table.inl] : []), ...(table.gain ? [table.gain] : [])].map(
    (a) => a.buffer as ArrayBuffer,
  );
  post({ kind: 'slice', index: s.index, table }, buffers);
}
post({ kind: 'done' });
