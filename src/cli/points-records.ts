/**
 * The rows of a logged series (`probe --points`) to output bytes, record by record: what answers a
 * row (RowAnswerer; the fixed-activity one here) and the record-to-output step shared by the
 * single-thread run (probe-points.ts) and the worker threads (points-worker.ts).
 */
import { InputError } from '../errors.js';
import type { CsvRecord } from '../io/csv-records.js';
import { pointsAnswerer } from '../analysis/points-answer.js';
import { type PointRow, type PointsHeader, type PotentialUnit, type RowError, newPointRow, pointsErrorRow, pointsOutputHeader, pointsRowLine, readPointRow, writePointsRow, readPointsHeader, rowErrorText } from '../report/points-csv.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import type { RowBytes } from '../report/row-bytes.js';

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

/**
 * Step 3 of probe-points.ts: each record to its output text (the header's, a row's answer, or a
 * row's error). `sep` and `header` are set by the caller (a worker starts with both known).
 */
export function recordLines(name: string, unit: PotentialUnit | undefined, strict: boolean, answerer: RowAnswerer) {
  const st = { sep: ',', header: undefined as PointsHeader | undefined, rows: 0, failed: 0, writeRecord };
  // The fast path reads every row into this one record (answered and written before the next).
  const reused = newPointRow();
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
      const row = readPointRow(r.fields, r.line, st.header, st.sep !== ',', reused);
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

