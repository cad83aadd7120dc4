/**
 * Worker-thread entry of tradeoffInWorker: draws the trade-off curves of one job (design's
 * tradeoffCurves, the same function the calling thread would run) and posts progress and the
 * curves back. Bundled as its own entry (dist/design-worker.js).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { tradeoffCurves } from '../design/index.js';
import type { TradeoffJob, TradeoffMessage } from './tradeoffInWorker.js';

const job = workerData as TradeoffJob;
const post = (m: TradeoffMessage) => parentPort!.postMessage(m);
const curves = tradeoffCurves(job.project, job.stageCounts, job.center, {
  ...(job.bits !== undefined && { bits: job.bits }),
  ...(job.ripples && { ripples: job.ripples }),
  onProgress: (fraction) => post({ kind: 'progress', fraction }),
});
post({ kind: 'done', curves });
