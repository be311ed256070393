/**
 * A whole logged series read at once (for verbs that answer every row before writing, e.g. the
 * composition-mode `probe --points`): the same header and row rules as the streaming reader
 * (src/cli/probe-points.ts) — RFC 4180 records, `,` else `;` else tab, decimal commas with `;` or
 * tab — but a bad row is an InputError naming the line and column, since nothing is written yet.
 * Columns other than pH, potential, temperature and ionic strength are joined into `label`.
 */
import { InputError } from '../errors.js';
import { type CsvRecord, CsvRecordReader } from '../io/csv-records.js';
import { type PointRow, type PointsHeader, readPointRow, readPointsHeader } from './points-csv.js';

export type LabelledPointRow = PointRow & { label?: string };

const blank = (r: CsvRecord) => r.fields.every((f) => f.trim() === '');

export function parsePointsCsv(text: string, file: string): LabelledPointRow[] {
  // Step 1: the separator from the header line.
  const first = text.split(/\r\n|\n|\r/).find((l) => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? '';
  const sep = first.includes(',') ? ',' : first.includes(';') ? ';' : first.includes('\t') ? '\t' : ',';
  // Step 2: records.
  const reader = new CsvRecordReader(sep, file);
  const records: CsvRecord[] = [];
  reader.push(text, records);
  reader.end(records);
  // Step 3: the header, then rows.
  let header: PointsHeader | undefined;
  const rows: LabelledPointRow[] = [];
  for (const r of records) {
    if (r.error) throw new InputError(file, `line ${r.line}`, 'a well-formed CSV record', r.error);
    if (blank(r)) continue;
    if (!header) {
      if ((r.fields[0] ?? '').trimStart().startsWith('#')) continue;
      header = readPointsHeader(r.fields, file, undefined);
      continue;
    }
    const row = readPointRow(r.fields, r.line, header, sep !== ',');
    if (!('pH' in row)) throw new InputError(file, row.field, row.expected, row.got);
    const label = row.extra.filter((x) => x.trim() !== '').join(' ');
    rows.push(label ? { ...row, label } : row);
    if (rows.length > 1_000_000) throw new InputError(file, '', 'at most 1,000,000 rows');
  }
  if (!header) throw new InputError(file, '', 'a CSV with a header row (pH, potential[, temperature]) and data rows', 'no header');
  if (!rows.length) throw new InputError(file, '', 'at least one data row after the header');
  return rows;
}
