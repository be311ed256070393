/**
 * `probe --points` rows for an alloy file (issue 18): per logged point the assemblage (its members
 * joined with " + ", as in the figure's labels: a neutral dissolved species tagged "(aq)"), the
 * verdict, the dissolving elements and, when the point lies on a boundary, the species that tie.
 * Layout as the fixed-activity rows (points-csv.ts): the carried input columns first (renamed
 * `in_NAME` if they clash), then ours, the `error` column last; the separator is the input's. User
 * text (carried cells, messages) is neutralised for spreadsheets (io/csv-cell.ts). Computes nothing.
 */
import type { AlloyPointResult } from '../analysis/alloy-points-answer.js';
import { csvField } from '../io/csv-records.js';
import type { PointRow, PointsHeader } from './points-csv.js';
import { pointsCsvFrame } from './points-csv-frame.js';

const FRAME = pointsCsvFrame(['line', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'assemblage', 'verdict', 'dissolving', 'on_boundary_with', 'warnings', 'error']);

/** The output header: the carried columns, then ours (`potential_mV` for a potential in mV). */
export function alloyPointsHeader(h: PointsHeader, sep: string): string {
  return FRAME.header(h, sep);
}

/** One answered row; `warnings` are joined with " | ", the dissolving elements with ", ". */
export function alloyPointsRow(row: PointRow, scale: string, r: AlloyPointResult, warnings: readonly string[], sep: string): string {
  const cells = FRAME.lead(row, scale, r.E, r.celsius, sep);
  cells.push(
    csvField(r.label, sep),
    r.verdict,
    csvField(r.dissolving.join(', '), sep),
    csvField(r.ties.join(', '), sep),
    warnings.length ? FRAME.text(warnings.join(' | '), sep) : '',
    '',
  );
  return cells.join(sep) + '\n';
}

/** A row that could not be answered: carried columns, the line, and the error column. */
export function alloyPointsErrorRow(extra: readonly string[], line: number, message: string, sep: string): string {
  return FRAME.errorRow(extra, line, message, sep);
}
