/**
 * Logged operating data for `probe --points`: read a CSV of pH, potential and an optional
 * temperature column; write one result row per input row.
 * Accepted headers (case-insensitive): pH; potential | E | E_V; temperature | T | t_C. Other
 * columns (e.g. a time stamp) are carried through in the output as `label`.
 */
import { Fields } from '../system/fields.js';
import type { ProbeResult } from '../analysis/probe.js';

export interface PointRow {
  line: number;
  pH: number;
  potential: number;
  temperature?: number;
  label?: string;
}

export function parsePointsCsv(text: string, file: string): PointRow[] {
  const f = new Fields(file);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const lines = text.split(/\r?\n/).map((l) => l.trim());
  const first = lines.findIndex((l) => l !== '' && !l.startsWith('#'));
  if (first < 0) f.fail('', 'a CSV with a header row (pH, potential[, temperature]) and data rows', 'an empty file');
  const sep = lines[first].includes(';') && !lines[first].includes(',') ? ';' : ',';
  const head = lines[first].split(sep).map((h) => h.trim().toLowerCase());
  const find = (names: string[]) => head.findIndex((h) => names.includes(h));
  const iPH = find(['ph']);
  const iE = find(['potential', 'e', 'e_v', 'e/v', 'potential_v']);
  const iT = find(['temperature', 't', 't_c', 'temperature_c']);
  const iL = head.findIndex((_, k) => k !== iPH && k !== iE && k !== iT);
  if (iPH < 0 || iE < 0) f.fail('header', 'columns named pH and potential (optionally temperature)', lines[first]);
  const rows: PointRow[] = [];
  for (let k = first + 1; k < lines.length; k++) {
    const l = lines[k];
    if (l === '' || l.startsWith('#')) continue;
    const cells = l.split(sep).map((c) => c.trim());
    const num = (i: number, what: string) => {
      const x = Number(cells[i]);
      if (cells[i] === undefined || cells[i] === '' || !Number.isFinite(x)) f.fail(`line ${k + 1} ${what}`, 'a number', cells[i] ?? 'nothing');
      return x;
    };
    const row: PointRow = { line: k + 1, pH: num(iPH, 'pH'), potential: num(iE, 'potential') };
    if (iT >= 0 && cells[iT] !== '') row.temperature = num(iT, 'temperature');
    if (iL >= 0 && cells[iL]) row.label = cells[iL];
    rows.push(row);
    if (rows.length > 1_000_000) f.fail('', 'at most 1,000,000 rows');
  }
  if (!rows.length) f.fail('', 'at least one data row after the header');
  return rows;
}

const HEAD = ['line', 'label', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'predominant', 'verdict', 'runner_up', 'margin_kJ_per_mol', 'distance_mV', 'distance_pH', 'nearest_boundary', 'advice', 'warnings'];

function cell(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? String(Number(v.toPrecision(8))) : v;
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function pointsCsv(rows: { row: PointRow; scale: string; result: ProbeResult }[]): string {
  const out = [HEAD.join(',')];
  for (const { row, scale, result: r } of rows) {
    out.push(
      [row.line, row.label ?? '', row.pH, row.potential, scale, r.E, r.temperature.celsius, r.predominant, r.verdict, r.runnerUp, r.margin.kJPerMol, r.distance.mV, r.distance.pH, r.nearestBoundary?.reaction ?? '', r.advice, r.warnings.join(' | ')]
        .map(cell)
        .join(','),
    );
  }
  return `${out.join('\n')}\n`;
}
