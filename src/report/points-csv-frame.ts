/**
 * The frame shared by the `probe --points` row writers of composition and alloy files: the carried
 * input columns first (renamed `in_NAME` if they clash with ours), then the six leading columns
 * every kind has (line, pH, potential as given, scale, E vs SHE, temperature), the kind's own
 * columns, the `error` column last; user text neutralised for spreadsheets (io/csv-cell.ts).
 * A factory per column list. Computes nothing.
 */
import { neutraliseCsvCell } from '../io/csv-cell.js';
import { csvField } from '../io/csv-records.js';
import { num8, type PointRow, type PointsHeader } from './points-csv.js';

export interface PointsCsvFrame {
  /** The output header line (`potential_mV` for a potential in mV). */
  header(h: PointsHeader, sep: string): string;
  /** The carried cells and the six leading cells of an answered row. */
  lead(row: PointRow, scale: string, E: number, celsius: number, sep: string): string[];
  /** A row that could not be answered: carried cells, the line, empty cells, the error. */
  errorRow(extra: readonly string[], line: number, message: string, sep: string): string;
  /** A user-text cell (neutralised, quoted as needed). */
  text(s: string, sep: string): string;
}

export function pointsCsvFrame(head: readonly string[]): PointsCsvFrame {
  const text = (s: string, sep: string): string => csvField(neutraliseCsvCell(s), sep);
  return {
    text,
    header(h, sep) {
      const names = h.extra.map((x) => (head.includes(x.name) || x.name === 'potential_mV' ? `in_${x.name}` : x.name));
      const ours = h.unit === 'mV' ? head.map((n) => (n === 'potential' ? 'potential_mV' : n)) : head;
      return [...names.map((n) => text(n, sep)), ...ours].join(sep) + '\n';
    },
    lead(row, scale, E, celsius, sep) {
      return [
        ...row.extra.map((c) => text(c, sep)),
        String(row.line),
        row.given.pH ?? num8(row.pH),
        row.given.potential ?? num8(row.unit === 'mV' ? row.potential * 1000 : row.potential),
        csvField(scale, sep),
        num8(E),
        num8(celsius),
      ];
    },
    errorRow(extra, line, message, sep) {
      return [...extra.map((c) => text(c, sep)), String(line), ...Array<string>(head.length - 2).fill(''), text(message, sep)].join(sep) + '\n';
    },
  };
}
