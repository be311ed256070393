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
import type { PotentialUnit } from '../report/points-csv.js';
import { fixedActivityRows, recordLines, type RowAnswerer } from './points-records.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { progressBar } from './progress.js';
import { useWorkers } from './points-pool.js';
import { type Feed, piecesFeed, plainFeed } from './points-pieces.js';
import { PointsOutput } from './points-output.js';

export { fixedActivityRows, type RowAnswerer } from './points-records.js';

export interface PointsOptions {
  points: string;
  output?: string;
  delimiter?: string;
  unit?: string;
  strict?: boolean;
}

/**
 * Input chunk and output batch (bytes). Rows are read one record at a time into one reused row
 * and written into one reused byte buffer (report/row-bytes.ts), so a record dies young whatever
 * the chunk size; 64 kB chunks keep each read and write large enough to be cheap.
 */
const IN_CHUNK = 1 << 16;
const OUT_BATCH = 1 << 18;
/** Pieces answered or being answered at once in a run with a worker (points-pool.ts WORKER_QUEUE). */
const IN_FLIGHT = 4;

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
  let feed: Feed | undefined;
  let head = '';
  let bytes = 0;
  const records: CsvRecord[] = [];
  const lines = recordLines(name, unit, o.strict === true, answerer);
  const output = new PointsOutput(sink, OUT_BATCH);
  // Long file inputs: pieces answered by the main thread and a worker once the header is read.
  const workers = rows ? false : useWorkers(size, true);
  const startFeed = (sep: string): void => {
    lines.sep = sep;
    reader = new CsvRecordReader(sep, name);
    const parts = { reader, records, lines, output };
    feed = workers ? piecesFeed(parts, name, IN_FLIGHT, () => ({ spec, ref, name, sep, header: lines.header!, strict: o.strict === true })) : plainFeed(parts);
  };
  try {
    for await (const chunk of input as AsyncIterable<string>) {
      bytes += Buffer.byteLength(chunk);
      // Step 2: the separator, once the header line is complete.
      if (!feed) {
        head += chunk;
        const first = head.split(/\r\n|\n|\r/).find((l, k, all) => k < all.length - 1 && l.trim() !== '' && !l.trimStart().startsWith('#'));
        if (first === undefined) {
          if (head.length > MAX_RECORD) throw new InputError(name, 'header', `a header line of at most ${MAX_RECORD} characters`);
          continue;
        }
        startFeed(separatorFor(o.delimiter, first));
        await feed!.take(head);
        head = '';
      } else await feed.take(chunk);
      bar.update(bytes, lines.rows);
    }
    if (!feed) {
      startFeed(separatorFor(o.delimiter, head));
      reader!.push(head, records);
    }
    await feed!.end();
    reader!.end(records);
    for (const r of records) lines.writeRecord(r, output.out);
    if (!lines.header) throw new InputError(name, '', 'a CSV with a header row (pH, potential[, temperature]) and data rows', 'no header');
    if (lines.rows === 0) throw new InputError(name, '', 'at least one data row after the header');
    await output.end();
    bar.done();
    await feed!.close();
    await sink.commit();
  } catch (e) {
    bar.done();
    await feed?.close();
    await output.settle(); // no write in flight while the output is dropped
    await sink.abort();
    if (!(e instanceof EphmapError) && typeof (e as NodeJS.ErrnoException).code === 'string' && (e as NodeJS.ErrnoException).code!.startsWith('E')) throw new InputError(o.points, '', 'a readable CSV file', 'a file that cannot be read');
    throw e;
  }
  if (toFile) process.stdout.write(`wrote ${o.output} (${lines.rows} row${lines.rows === 1 ? '' : 's'}${lines.failed ? `, ${lines.failed} not answered` : ''})\n`);
  // Step 4.
  if (lines.failed) throw new PartialError(`${lines.failed} of ${lines.rows} rows of ${name} could not be answered (see their ${answerer.failedIn ?? 'error column'})`);
}
