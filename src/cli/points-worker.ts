/**
 * Worker-thread entry for long `probe --points` runs (started by points-pool.ts, bundled as
 * dist/cli/points-worker.mjs): answers the pieces it is sent (points-piece.ts) with its own copy of
 * the run's system, reference, separator and header (read once by the main thread), and reuses the
 * output buffers the main thread gives back.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { pieceAnswerer } from './points-piece.js';
import type { PieceJob, PointsWorkerData } from './points-pool.js';

const pieces = pieceAnswerer(workerData as PointsWorkerData);

parentPort!.on('message', (m: PieceJob | { give: ArrayBuffer }) => {
  if ('give' in m) return pieces.give(m.give);
  const r = pieces.answer(m);
  parentPort!.postMessage(r, 'bytes' in r ? [r.bytes.buffer as ArrayBuffer] : []);
});
