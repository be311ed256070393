/**
 * How the input text of a `probe --points` run reaches the answering step, once the separator is
 * known: `plainFeed` reads records here and answers them in this thread; `piecesFeed` (long files,
 * points-pool.ts) cuts the text at record boundaries (io/csv-cut.ts) — record by record up to the
 * header, which is read here, then the rest of that chunk as one piece and pieces of PIECE_CHARS
 * from then on — and has the pieces after the header answered by the main thread and a worker,
 * written in order with at most `inFlight` pieces in flight.
 */
import { CsvCutter, type CsvPiece } from '../io/csv-cut.js';
import type { CsvRecord, CsvRecordReader } from '../io/csv-records.js';
import type { PointsOutput } from './points-output.js';
import { PIECE_CHARS, type PointsWorkerData, PointsPool, workerEntry } from './points-pool.js';
import type { recordLines } from './points-records.js';

export interface Feed {
  /** The next input text. */
  take(text: string): Promise<void>;
  /** At the end of input: everything answered and written (the records reader's `end` is the caller's). */
  end(): Promise<void>;
  /** Stops the workers, if any. */
  close(): Promise<void>;
}

interface FeedParts {
  reader: CsvRecordReader;
  records: CsvRecord[];
  lines: ReturnType<typeof recordLines>;
  output: PointsOutput;
}

/** Records read and answered in this thread, each as soon as it is read (CsvRecordReader.each). */
export function plainFeed({ reader, lines, output }: FeedParts): Feed {
  const write = (r: CsvRecord): void => lines.writeRecord(r, output.out);
  return {
    take: (text) => {
      reader.each(text, write);
      return output.flush();
    },
    end: async () => undefined,
    close: async () => undefined,
  };
}

/** Pieces answered by the main thread and a worker (see the module comment). */
export function piecesFeed(parts: FeedParts, name: string, inFlight: number, data: (p: FeedParts) => PointsWorkerData): Feed {
  const { reader, records, lines, output } = parts;
  const cutter = new CsvCutter(lines.sep, name, 1);
  let pool: PointsPool | undefined;
  const written = async (): Promise<void> => {
    const r = await pool!.next();
    await output.bytes(r.piece.bytes, r.written);
    lines.rows += r.piece.rows;
    lines.failed += r.piece.failed;
  };
  const piece = async (p: CsvPiece, last: boolean): Promise<void> => {
    if (!lines.header) {
      reader.push(p.text, records);
      if (last) reader.end(records);
      return output.records(records, lines);
    }
    pool ??= new PointsPool(workerEntry()!, data(parts), 1, true);
    pool.submit(p.text, p.line, last);
    while (pool.inFlight >= inFlight) await written();
  };
  return {
    async take(text) {
      const ps = cutter.push(text);
      let k = 0;
      for (; k < ps.length && !lines.header; k++) await piece(ps[k], false);
      if (lines.header) cutter.setTarget(PIECE_CHARS);
      if (k < ps.length) await piece({ text: ps.slice(k).map((p) => p.text).join(''), line: ps[k].line }, false);
    },
    async end() {
      const rest = cutter.end();
      if (rest) await piece(rest, true);
      while (pool?.inFlight) await written();
    },
    close: async () => pool?.close(),
  };
}
