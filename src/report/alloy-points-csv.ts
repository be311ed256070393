/**
 * `probe --points` rows for an alloy file (issue 18): per logged point the assemblage (its members
 * joined with " + ", as in the figure's labels: a neutral dissolved species tagged "(aq)"), the
 * verdict, the dissolving elements and, when the point lies on a boundary, the species that tie.
 * Layout as the fixed-activity rows (points-csv.ts): the carried input columns first (renamed
 * `in_NAME` if they clash), then ours, the `error` column last; the separator is the input's. User
 * text (carried cells, messages) is neutralised for spreadsheets (io/csv-cell.ts). Computes nothing.
 */
import type { AlloyPointResult } from '../analysis/alloy-points-answer.js';
import { neutraliseCsvCell } from '../io/csv-cell.js';
import { csvField } from '../io/csv-records.js';
import { num8, type PointRow, type PointsHeader } from './points-csv.js';

const HEAD = ['line', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'assemblage', 'verdict', 'dissolving', 'on_boundary_with', 'warnings', 'error'];

function text(s: string, sep: string): string {
  return csvField(neutraliseCsvCell(s), sep);
}

/** The output header: the carried columns, then ours (`potential_mV` for a potential in mV). */
export function alloyPointsHeader(h: PointsHeader, sep: string): string {
  const names = h.extra.map((x) => (HEAD.includes(x.name) || x.name === 'potential_mV' ? `in_${x.name}` : x.name));
  const ours = h.unit === 'mV' ? HEAD.map((n) => (n === 'potential' ? 'potential_mV' : n)) : HEAD;
  return [...names.map((n) => text(n, sep)), ...ours].join(sep) + '\n';
}

/** One answered row; `warnings` are joined with " | ", the dissolving elements with ", ". */
export function alloyPointsRow(row: PointRow, scale: string, r: AlloyPointResult, warnings: readonly string[], sep: string): string {
  const cells = row.extra.map((c) => text(c, sep));
  cells.push(
    String(row.line),
    row.given.pH ?? num8(row.pH),
    row.given.potential ?? num8(row.unit === 'mV' ? row.potential * 1000 : row.potential),
    csvField(scale, sep),
    num8(r.E),
    num8(r.celsius),
    csvField(r.label, sep),
    r.verdict,
    csvField(r.dissolving.join(', '), sep),
    csvField(r.ties.join(', '), sep),
    warnings.length ? text(warnings.join(' | '), sep) : '',
    '',
  );
  return cells.join(sep) + '\n';
}

/** A row that could not be answered: carried columns, the line, and the error column. */
export function alloyPointsErrorRow(extra: readonly string[], line: number, message: string, sep: string): string {
  const cells = extra.map((c) => text(c, sep));
  cells.push(String(line), ...Array<string>(HEAD.length - 2).fill(''), text(message, sep));
  return cells.join(sep) + '\n';
}
