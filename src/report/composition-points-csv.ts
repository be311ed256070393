/**
 * `probe --points` rows in composition mode: per logged point the predominant form, its verdict
 * and the total dissolved element; `status` failed rows carry verdict `unknown`, no form and the
 * reason. The logged label is neutralised for spreadsheets (io/csv-cell.ts). Computes nothing.
 */
import type { CompositionProbeResult } from '../analysis/composition-probe.js';
import { neutraliseCsvCell } from '../io/csv-cell.js';
import type { LabelledPointRow as PointRow } from './points-read.js';

const HEAD = ['line', 'label', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'status', 'predominant', 'verdict', 'dissolved_mol_per_kg', 'threshold_mol_per_kg', 'reason'];

function cell(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? String(Number(v.toPrecision(8))) : v;
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function compositionPointsCsv(rows: { row: PointRow; scale: string; result: CompositionProbeResult }[]): string {
  const out = [HEAD.join(',')];
  for (const { row, scale, result: r } of rows) {
    out.push([row.line, neutraliseCsvCell(row.label ?? ''), row.pH, row.potential, scale, r.E, r.temperature.celsius, r.status, r.predominant, r.verdict, r.dissolved, r.threshold, r.reason ?? ''].map(cell).join(','));
  }
  return `${out.join('\n')}\n`;
}
