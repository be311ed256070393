/**
 * Plain-text report of the `cell` calculator for people: a heading (reaction, n, direction, sign
 * convention), an aligned table with one row per temperature (units in the headers), the data
 * sources and the warnings. Draws nothing and computes nothing.
 */
import { formulaForPeople, reactionForPeople, textForPeople } from '../chem/present.js';
import type { CellResult } from '../thermo/cell.js';
import { table } from './table.js';

const fix = (v: number | null, digits: number, plus = false): string =>
  v === null ? '—' : `${plus && v >= 0 ? '+' : ''}${v.toFixed(digits)}`;

/** Text report for one or more rows of the same reaction (throws RangeError on no rows). */
export function cellText(rows: readonly CellResult[]): string {
  const first = rows[0];
  if (!first) throw new RangeError('cellText: no rows');
  const half = first.kind === 'half';
  const redox = first.kind !== 'chemical';
  const ref = first.reference;
  const cond = first.atConditions;
  const header = ['T/°C', 'ΔrG°/(kJ/mol)', 'ΔrH°/(kJ/mol)', 'ΔrS°/(J/(mol·K))', 'ΔrCp°/(J/(mol·K))', 'log K'];
  if (redox) header.push(half ? 'E°/(V vs SHE)' : 'E_eq/V', half ? 'E_tn/(V vs SHE)' : 'E_tn/V', 'dE/dT/(mV/K)');
  if (ref) header.push(`E°/(V vs ${ref.label})`, `E_tn/(V vs ${ref.label})`);
  if (cond) header.push('ΔrG/(kJ/mol) at a', ...(redox ? [half ? 'E/(V vs SHE) at a' : 'E/V at a (signed)'] : []));
  const body = rows.map((r) => {
    const row = [String(Number(r.temperature.celsius.toPrecision(10))), fix(r.deltaG, 3), fix(r.deltaH, 3), fix(r.deltaS, 2), fix(r.deltaCp, 2), fix(r.logK, 3)];
    if (redox) {
      row.push(fix(r.equilibriumPotential, 4, half), fix(r.thermoneutralPotential, 4, half), fix(r.dEdT === null ? null : r.dEdT * 1000, 4, true));
    }
    if (ref) row.push(fix(r.reference?.equilibriumPotential ?? null, 4, true), fix(r.reference?.thermoneutralPotential ?? null, 4, true));
    if (r.atConditions) row.push(fix(r.atConditions.deltaG, 3), ...(redox ? [fix(r.atConditions.potential, 4, true)] : []));
    return row;
  });
  const nFrom = first.nFrom === 'written' ? 'electrons written' : first.nFrom === 'given' ? 'given' : 'from oxidation states';
  const what = !redox
    ? 'reaction without electron transfer (no potentials)'
    : half
    ? `half-reaction, n = ${first.n} (${nFrom}), written as ${first.direction === 'reduction' ? 'a reduction' : 'an oxidation'}`
    : `full reaction, n = ${first.n} (${nFrom}), ${first.direction}${first.direction === 'electrolytic' ? ' (must be driven)' : ' (delivers work)'}`;
  const lines = [`reaction: ${reactionForPeople(first.reaction)}`, what, `convention: ${first.convention}`];
  if (ref) lines.push(`reference: ${ref.label}, ${fix(ref.offset, 4, true)} V vs SHE at ${first.temperature.celsius} °C`);
  if (cond) lines.push(`at: ${Object.entries(cond.activities).map(([k, v]) => `${formulaForPeople(k)} = ${v}`).join(', ')} (others at unit activity, gases 1 bar); log Q = ${cond.logQ.toFixed(4)}`);
  lines.push('', table(header, body, header.map((_, k) => k >= 0)), '', 'data:');
  for (const s of first.species) {
    lines.push(`  ${s.coefficient > 0 ? '+' : ''}${Number(s.coefficient.toPrecision(10))} ${formulaForPeople(s.formula + (s.phase ? `(${s.phase})` : ''))}: ${s.source}`);
  }
  const warnings = [...new Set(rows.flatMap((r) => r.warnings))];
  if (warnings.length > 0) lines.push('', 'warnings:', ...warnings.map((w) => `  ${textForPeople(w)}`));
  return `${lines.join('\n')}\n`;
}
