/**
 * The plating window as plain text for people: a heading with the conditions, one table row per
 * window, the first solid above it and the notes. Computes nothing.
 */
import type { WindowResult } from '../analysis/window.js';
import { formulaForPeople as fp, textForPeople } from '../chem/present.js';
import type { DiagramModel } from '../model.js';
import { elementAmountText, ligandAmountTexts } from './format.js';
import { table } from './table.js';

/** "Plating window for Ni at 25 °C (dissolved Ni 0.1; N 1); potentials in V vs SHE." */
export function windowHeading(m: DiagramModel): string {
  return `Plating window for ${m.element} at ${m.temperature.celsius} °C (dissolved ${m.element} ${elementAmountText(m, true)}${Object.keys(m.ligands).length ? `; ligand totals ${ligandAmountTexts(m, true).join(', ')}` : ''}); potentials in V vs SHE.`;
}

export function windowText(r: WindowResult, head: string): string {
  const v = (x: number) => `${x >= 0 ? '+' : ''}${x.toFixed(3)}`;
  const warn = r.warnings.length ? `warnings:\n${r.warnings.map((w) => `  ${textForPeople(w)}`).join('\n')}\n` : '';
  if (!r.windows.length) {
    const why = r.notes.filter((n) => n.startsWith('No window')).map(textForPeople).join('\n');
    return `${head}\nNo pH range in the diagram where a dissolved form of ${r.element} lies directly above the metal.\n${why.replace(/^No window: /, 'Why: ')}\n${warn}`;
  }
  const rows = r.windows.map((w) => [
    `${w.pH[0].toFixed(2)}–${w.pH[1].toFixed(2)}`,
    w.dissolved.map(fp).join(', '),
    `${v(w.deposition[0].E)} … ${v(w.deposition[w.deposition.length - 1].E)}`,
    `${v(w.marginToHydrogen.atLowPH)} … ${v(w.marginToHydrogen.atHighPH)}`,
    `${w.boundedBy.low === undefined || w.boundedBy.low === null ? 'edge' : fp(w.boundedBy.low)} / ${w.boundedBy.high === undefined || w.boundedBy.high === null ? 'edge' : fp(w.boundedBy.high)}`,
  ]);
  const t = table(['pH range', 'dissolved form', 'E_dep at ends / V vs SHE', 'E_dep − E(H₂) / V', 'bounded by (low / high pH)'], rows);
  const fs = r.firstSolid ? `First solid above the window: ${fp(r.firstSolid.species)} from pH ${r.firstSolid.pH.toFixed(2)}.` : 'No solid appears above the window within the diagram.';
  return `${head}\n\n${t}\n\n${fs}\n${r.notes.map((n) => `Note: ${textForPeople(n)}`).join('\n')}\nEquilibrium thermodynamics only — not kinetics; check against the bath supplier's data and a qualified plating professional.\n${warn}`;
}
