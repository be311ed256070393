/**
 * `probe --points` rows in composition mode (the bath as made up): per logged point the
 * predominant form, its verdict and the total dissolved element. Layout as the fixed-activity rows
 * (report/points-csv.ts): the carried input columns first (renamed `in_NAME` if they clash), then
 * ours, the `error` column last; the separator is the input's. A `status` failed row carries
 * verdict `unknown`, no form, no dissolved total and the solver's reason. User text (carried
 * cells, messages) is neutralised for spreadsheets (io/csv-cell.ts). Computes nothing.
 */
import type { CompositionProbeResult } from '../analysis/composition-probe.js';
import { csvField } from '../io/csv-records.js';
import { num8, type PointRow, type PointsHeader } from './points-csv.js';
import { pointsCsvFrame } from './points-csv-frame.js';

const FRAME = pointsCsvFrame(['line', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'status', 'predominant', 'verdict', 'dissolved_mol_per_kg', 'threshold_mol_per_kg', 'reason', 'warnings', 'error']);

/** The output header: the carried columns, then ours (`potential_mV` for a potential in mV). */
export function compositionPointsHeader(h: PointsHeader, sep: string): string {
  return FRAME.header(h, sep);
}

/** One answered (or failed-to-solve) row; `warnings` are joined with " | ". */
export function compositionPointsRow(row: PointRow, scale: string, r: CompositionProbeResult, warnings: readonly string[], sep: string): string {
  const cells = FRAME.lead(row, scale, r.E, r.temperature.celsius, sep);
  cells.push(
    r.status,
    csvField(r.predominant ?? '', sep),
    r.verdict,
    num8(r.dissolved),
    num8(r.threshold),
    FRAME.text(r.reason ?? '', sep),
    warnings.length ? FRAME.text(warnings.join(' | '), sep) : '',
    '',
  );
  return cells.join(sep) + '\n';
}

/** A row that could not be answered: carried columns, the line, and the error column. */
export function compositionPointsErrorRow(extra: readonly string[], line: number, message: string, sep: string): string {
  return FRAME.errorRow(extra, line, message, sep);
}
