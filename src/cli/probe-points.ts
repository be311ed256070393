/**
 * `ephmap probe FILE --points LOG.csv|- [-o OUT.csv|-] [--delimiter auto|,|;|tab] [--unit V|mV]
 * [--strict]`: a logged series answered row by row while it streams.
 *
 * Steps: 1. open the input (a file, or standard input for `-`) and the output (standard output by
 * default or for `-`; a file through a temporary renamed at the end); 2. read the header (the
 * first line that is not blank or a `#` comment — comments only above it; the separator from
 * --delimiter or, for `auto`, `,` else `;` else tab, as the header line has it); 3. for every
 * record: read the row, answer it
 * (analysis/points-answer.ts) and write its line, in input order, flushing after each input chunk;
 * 4. at the end: exit status 4 when some rows could not be answered (each says why in its `error`
 * column, or — composition mode — says status failed); with --strict the first bad row stops the
 * run with exit status 2 and, for a file output, nothing is written.
 *
 * What answers a row is a RowAnswerer: the fixed-activity one here (analysis/points-answer.ts), or
 * the composition-mode one (cli/probe-composition.ts).
 */
import { createReadStream, statSync } from 'node:fs';
import { EphmapError, InputError, PartialError } from '../errors.js';
import { CsvRecordReader, type CsvRecord, MAX_RECORD } from '../io/csv-records.js';
import { fileSink, type OutputSink, stdoutSink } from '../io/stream-output.js';
import { refuseInputsAsOutputs, requireExtension } from '../io/path-safety.js';
import { pointsAnswerer } from '../analysis/points-answer.js';
import { type PointRow, type PointsHeader, type PotentialUnit, type RowError, pointsErrorRow, pointsOutputHeader, pointsRowLine, readPointRow, writePointsRow, readPointsHeader, rowErrorText } from '../report/points-csv.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { RowBytes } from '../report/row-bytes.js';
import { progressBar } from './progress.js';

export interface PointsOptions {
  points: string;
  output?: string;
  delimiter?: string;
  unit?: string;
  strict?: boolean;
}

/**
 * Input chunk and output batch (bytes). Rows are written into one reused byte buffer
 * (report/row-bytes.ts), so only a chunk's records die young; chunks stay small enough that they
 * are not promoted (10⁶ rows: peak RSS ~89 MB and 4.4 s CPU with 64 kB chunks and 256 kB batches;
 * ~135 MB and no faster with 256 kB chunks; ~86 MB and 5.4 s CPU with 8 kB chunks, 64 kB batches).
 */
const IN_CHUNK = 1 << 16;
const OUT_BATCH = 1 << 18;

const SEPARATORS: Record<string, string> = { ',': ',', ';': ';', tab: '\t', '\t': '\t' };

function separatorFor(option: string | undefined, headerLine: string): string {
  if (option === undefined || option === 'auto') {
    if (headerLine.includes(',')) return ',';
    if (headerLine.includes(';')) return ';';
    return headerLine.includes('\t') ? '\t' : ',';
  }
  const s = Object.hasOwn(SEPARATORS, option) ? SEPARATORS[option] : undefined;
  if (!s) throw new InputError('command line', '--delimiter', 'auto, "," , ";" or tab', option);
  return s;
}

function unitOf(option: string | undefined): PotentialUnit | undefined {
  if (option === undefined) return undefined;
  if (option === 'V' || option === 'mV') return option;
  throw new InputError('command line', '--unit', 'V or mV', option);
}

/**
 * What answers the rows of a series: the output header for the input's (it may refuse the header
 * with an InputError), one row's output line — `failed` when the line is written but holds no
 * answer (counted for exit status 4, never stopped by --strict: the row itself is well formed) —
 * or why the row cannot be answered, and the line written for such a row.
 */
export interface RowAnswerer {
  header(h: PointsHeader, sep: string): string;
  row(row: PointRow, sep: string): { text: string; failed?: boolean } | { error: string };
  errorRow(extra: readonly string[], line: number, message: string, sep: string): string;
  /**
   * Optional, instead of `row` for speed: the row's line written into `out` (report/row-bytes.ts),
   * or why the row cannot be answered (nothing written then).
   */
  write?(row: PointRow, sep: string, out: RowBytes): { error: string } | undefined;
  /** Where the output says why a row has no answer (the PartialError names it). */
  failedIn?: string;
}

/** The fixed-activity answerer: `probe --ph --potential` on the diagram at each row's condition. */
export function fixedActivityRows(spec: SystemSpec, ref: string | CustomReference | undefined, name: string): RowAnswerer {
  const answerer = pointsAnswerer(spec, ref, name);
  return {
    header: pointsOutputHeader,
    row(row, sep) {
      const a = answerer.row(row);
      return 'error' in a ? a : { text: pointsRowLine(row, a.scale, a.E, a.fields, a.more, sep) };
    },
    write(row, sep, out) {
      const a = answerer.row(row);
      if ('error' in a) return a;
      writePointsRow(out, row, a.scale, a.E, a.fields, a.more, sep);
      return undefined;
    },
    errorRow: pointsErrorRow,
  };
}

/** Step 3: each record to its output text (the header's, a row's answer, or a row's error). */
function recordLines(name: string, unit: PotentialUnit | undefined, strict: boolean, answerer: RowAnswerer) {
  const st = { sep: ',', header: undefined as PointsHeader | undefined, rows: 0, failed: 0, writeRecord };
  function failedRow(r: CsvRecord, e: RowError, plain?: string): string {
    const line = r.line;
    if (strict) throw plain !== undefined ? new InputError(name, `line ${line}`, 'a row the system can answer', plain) : new InputError(name, e.field, e.expected, e.got);
    st.failed++;
    // The carried cells, taken only for a failed row (an answered row carries them in `row.extra`).
    const extra = st.header!.extra.map((x) => r.fields[x.index] ?? '');
    return answerer.errorRow(extra, line, plain ?? rowErrorText(e), st.sep);
  }
  /** The record's output into `out` (answerers with `write` write the row themselves). */
  function writeRecord(r: CsvRecord, out: RowBytes): void {
    if (answerer.write && st.header && !r.error && r.fields.length === st.header.width) {
      st.rows++;
      const row = readPointRow(r.fields, r.line, st.header, st.sep !== ',');
      if (!('extra' in row)) return out.text(failedRow(r, row));
      const e = answerer.write(row, st.sep, out);
      if (e) out.text(failedRow(r, { field: `line ${r.line}`, expected: '' }, e.error));
      return;
    }
    out.text(lineFor(r));
  }
  function lineFor(r: CsvRecord): string {
    if (r.fields.length === 1 && r.fields[0].trim() === '') return '';
    const h = st.header;
    if (!h) {
      if (r.fields[0].trimStart().startsWith('#')) return '';
      if (r.error) throw new InputError(name, `line ${r.line} (header)`, r.error);
      st.header = readPointsHeader(r.fields, name, unit);
      return answerer.header(st.header, st.sep);
    }
    // After the header every record is a row (a `#` line there is answered or refused, never dropped).
    st.rows++;
    if (r.error) return failedRow(r, { field: `line ${r.line}`, expected: r.error });
    if (r.fields.length !== h.width) return failedRow(r, { field: `line ${r.line}`, expected: `${h.width} cells as in the header`, got: String(r.fields.length) });
    const row = readPointRow(r.fields, r.line, h, st.sep !== ',');
    if (!('extra' in row)) return failedRow(r, row);
    const a = answerer.row(row, st.sep);
    if ('error' in a) return failedRow(r, { field: `line ${r.line}`, expected: '' }, a.error);
    if (a.failed) st.failed++;
    return a.text;
  }
  return st;
}

/**
 * Runs the whole series (see the module comment); `rows` makes the answerer from the input's name
 * (default: fixed activity).
 */
export async function runPoints(file: string, spec: SystemSpec, ref: string | CustomReference | undefined, o: PointsOptions, rows?: (name: string) => RowAnswerer): Promise<void> {
  const unit = unitOf(o.unit);
  if (o.delimiter !== undefined) separatorFor(o.delimiter, '');
  const name = o.points === '-' ? 'standard input' : o.points;
  const toFile = o.output !== undefined && o.output !== '-';
  if (toFile) {
    requireExtension(o.output!, ['.csv'], '--output');
    refuseInputsAsOutputs([{ path: o.output!, option: '--output' }], [{ path: file, option: '<file>' }, ...(o.points === '-' ? [] : [{ path: o.points, option: '--points' }])]);
  }
  // Step 1: input and output.
  let size = 0;
  if (o.points !== '-') {
    try {
      const st = statSync(o.points);
      if (!st.isFile() && !st.isFIFO()) throw new Error('not a file');
      size = st.isFile() ? st.size : 0;
    } catch {
      throw new InputError(o.points, '', 'a readable CSV file', 'a path that is not a readable file');
    }
  }
  const input: NodeJS.ReadableStream = o.points === '-' ? process.stdin : createReadStream(o.points, { highWaterMark: IN_CHUNK });
  (input as NodeJS.ReadableStream & { setEncoding(e: string): void }).setEncoding('utf8');
  const sink: OutputSink = toFile ? await fileSink(o.output!) : stdoutSink();
  const answerer = rows ? rows(name) : fixedActivityRows(spec, ref, name);
  const bar = progressBar(process.stderr, size);
  let reader: CsvRecordReader | undefined;
  let head = '';
  let bytes = 0;
  const records: CsvRecord[] = [];
  const lines = recordLines(name, unit, o.strict === true, answerer);
  // Two buffers in turn: one is written out while the next rows go into the other.
  const buffers = [new RowBytes(OUT_BATCH + (OUT_BATCH >> 2)), new RowBytes(OUT_BATCH + (OUT_BATCH >> 2))];
  let out = buffers[0];
  let pending: Promise<void> | undefined;
  const flush = async (): Promise<void> => {
    if (pending) await pending; // the other buffer is free again
    if (!out.length) return;
    pending = sink.write(out.take());
    pending.catch(() => undefined); // awaited at the next flush or at the end
    out = out === buffers[0] ? buffers[1] : buffers[0];
  };
  try {
    for await (const chunk of input as AsyncIterable<string>) {
      bytes += Buffer.byteLength(chunk);
      // Step 2: the separator, once the header line is complete.
      if (!reader) {
        head += chunk;
        const first = head.split(/\r\n|\n|\r/).find((l, k, all) => k < all.length - 1 && l.trim() !== '' && !l.trimStart().startsWith('#'));
        if (first === undefined) {
          if (head.length > MAX_RECORD) throw new InputError(name, 'header', `a header line of at most ${MAX_RECORD} characters`);
          continue;
        }
        lines.sep = separatorFor(o.delimiter, first);
        reader = new CsvRecordReader(lines.sep, name);
        reader.push(head, records);
        head = '';
      } else reader.push(chunk, records);
      // Written in batches of about OUT_BATCH bytes, whatever the input chunk's size (standard
      // input comes in pipe-sized chunks); the buffer is reused once its write has settled.
      for (const r of records) {
        lines.writeRecord(r, out);
        if (out.length >= OUT_BATCH) await flush();
      }
      records.length = 0;
      // What this chunk answered is written now (a pipe's rows appear as they come).
      if (out.length) await flush();
      bar.update(bytes, lines.rows);
    }
    if (!reader) {
      lines.sep = separatorFor(o.delimiter, head);
      reader = new CsvRecordReader(lines.sep, name);
      reader.push(head, records);
    }
    reader.end(records);
    for (const r of records) lines.writeRecord(r, out);
    if (!lines.header) throw new InputError(name, '', 'a CSV with a header row (pH, potential[, temperature]) and data rows', 'no header');
    if (lines.rows === 0) throw new InputError(name, '', 'at least one data row after the header');
    await flush();
    await flush(); // waits for the last write
    bar.done();
    await sink.commit();
  } catch (e) {
    bar.done();
    await pending?.catch(() => undefined); // no write in flight while the output is dropped
    await sink.abort();
    if (!(e instanceof EphmapError) && typeof (e as NodeJS.ErrnoException).code === 'string' && (e as NodeJS.ErrnoException).code!.startsWith('E')) throw new InputError(o.points, '', 'a readable CSV file', 'a file that cannot be read');
    throw e;
  }
  if (toFile) process.stdout.write(`wrote ${o.output} (${lines.rows} rows${lines.failed ? `, ${lines.failed} not answered` : ''})\n`);
  // Step 4.
  if (lines.failed) throw new PartialError(`${lines.failed} of ${lines.rows} rows of ${name} could not be answered (see their ${answerer.failedIn ?? 'error column'})`);
}
