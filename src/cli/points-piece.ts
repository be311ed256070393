/**
 * One piece of a long `probe --points` input (whole records with the line number of the first,
 * io/csv-cut.ts) answered into output bytes exactly as the single-thread run writes them — in a
 * worker thread (points-worker.ts) or, for the main thread's share, in points-pool.ts.
 *
 * Steps per piece: 1. read its records one at a time (CsvRecordReader.each, started at the piece's
 * line; the last piece of the input also ends the reader, for a last line without a line end);
 * 2. each record to its output as soon as it is read (points-records.ts recordLines, with the
 * run's separator and header), so that no piece's records are alive at once; 3. the bytes
 * with the piece's row counts, or the error that stops the run (a --strict bad row: the
 * InputError's parts, rebuilt by the pool).
 */
import { InputError } from '../errors.js';
import { type CsvRecord, CsvRecordReader } from '../io/csv-records.js';
import { RowBytes } from '../report/row-bytes.js';
import { fixedActivityRows, recordLines } from './points-records.js';
import type { PieceJob, PieceResult, PointsWorkerData } from './points-pool.js';

/** Answers pieces with its own answerer built from `data` (see the module comment). */
export function pieceAnswerer(data: PointsWorkerData): { answer: (job: PieceJob) => PieceResult; give: (b: ArrayBuffer) => void } {
  const answerer = fixedActivityRows(data.spec, data.ref, data.name);
  const lines = recordLines(data.name, data.header.unit, data.strict, answerer);
  lines.sep = data.sep;
  lines.header = data.header;
  const out = new RowBytes(1 << 20);
  const write = (r: CsvRecord): void => lines.writeRecord(r, out);
  /**
   * Output buffers handed back by the main thread once written: reused, so that the main thread
   * does not hold many dead buffers between its (rare) garbage collections.
   */
  const spare: ArrayBuffer[] = [];

  function answer(job: PieceJob): PieceResult {
    const rows0 = lines.rows;
    const failed0 = lines.failed;
    try {
      // Steps 1–2, a record at a time: each dies young (never promoted).
      const reader = new CsvRecordReader(data.sep, data.name, job.line);
      reader.each(job.text, write);
      if (job.last) reader.endEach(write);
    } catch (e) {
      out.take();
      if (e instanceof InputError) return { id: job.id, error: { kind: 'input', file: e.file, field: e.field, expected: e.expected, got: e.got } };
      return { id: job.id, error: { kind: 'other', message: e instanceof Error ? e.message : String(e) } };
    }
    // Step 3: the bytes copied out (the writer's buffer is reused for the next piece) into a buffer
    // the main thread gave back after writing an earlier piece, or a new one.
    const b = out.take();
    let room = spare.pop();
    if (!room || room.byteLength < b.length) room = new ArrayBuffer(b.length + (b.length >> 2));
    const bytes = new Uint8Array(room, 0, b.length);
    bytes.set(b);
    return { id: job.id, bytes, rows: lines.rows - rows0, failed: lines.failed - failed0 };
  }
  return { answer, give: (b) => void spare.push(b) };
}
