/**
 * The output side of a `probe --points` run: rows written into two byte buffers in turn (one is
 * written out while the next rows go into the other) — by `records` in batches of about `batch`
 * bytes, by the plain feed (points-pieces.ts) one input chunk's rows at a time — each buffer reused once its
 * write has settled; and pieces already answered elsewhere (points-pool.ts) written in between,
 * in order.
 */
import type { CsvRecord } from '../io/csv-records.js';
import type { OutputSink } from '../io/stream-output.js';
import { RowBytes } from '../report/row-bytes.js';
import type { recordLines } from './points-records.js';

type Lines = ReturnType<typeof recordLines>;

export class PointsOutput {
  private readonly buffers: RowBytes[];
  private buf: RowBytes;
  private pending: Promise<void> | undefined;

  constructor(
    private readonly sink: OutputSink,
    private readonly batch: number,
  ) {
    this.buffers = [new RowBytes(batch + (batch >> 2)), new RowBytes(batch + (batch >> 2))];
    this.buf = this.buffers[0];
  }

  /** The buffer rows are written into now. */
  get out(): RowBytes {
    return this.buf;
  }

  /** Writes the current buffer out (after the previous write has settled) and switches buffers. */
  async flush(): Promise<void> {
    if (this.pending) await this.pending; // the other buffer is free again
    if (!this.buf.length) return;
    this.pending = this.sink.write(this.buf.take());
    this.pending.catch(() => undefined); // awaited at the next flush or at the end
    this.buf = this.buf === this.buffers[0] ? this.buffers[1] : this.buffers[0];
  }

  /** Each record's output (points-records.ts), then all of it written (a pipe's rows appear as they come). */
  async records(records: CsvRecord[], lines: Lines): Promise<void> {
    for (const r of records) {
      lines.writeRecord(r, this.buf);
      if (this.buf.length >= this.batch) await this.flush();
    }
    records.length = 0;
    if (this.buf.length) await this.flush();
  }

  /** Bytes answered elsewhere, after everything before them; `done` once they are written. */
  async bytes(b: Uint8Array, done: () => void): Promise<void> {
    await this.flush();
    if (this.pending) await this.pending;
    this.pending = this.sink.write(b).then(done);
    this.pending.catch(() => undefined);
  }

  /** Everything written (the last write settled). */
  async end(): Promise<void> {
    await this.flush();
    await this.flush();
  }

  /** No write in flight (before the output is dropped). */
  async settle(): Promise<void> {
    await this.pending?.catch(() => undefined);
  }
}
