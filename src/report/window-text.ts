/**
 * The plating window as plain text for people: a heading with the conditions, one table row per
 * window, the first solid above it and the notes. Computes nothing.
 */
import type { WindowResult } from '../analysis/window.js';
import type { ScaledWindowResult } from '../analysis/window-scale.js';
import { formulaForPeople as fp, textForPeople } from '../chem/present.js';
import type { DiagramModel } from '../model.js';
import { elementAmountText, ligandAmountTexts } from './format.js';
import { table } from './table.js';

/**
 * The scale sentence ending a window heading: "potentials in V vs SHE." or, on an electrode's
 * scale, "potentials in V vs SCE, which lies at +0.241 V vs SHE at 25 °C."
 */
export function windowScaleText(ref: ScaledWindowResult['reference'] | undefined, celsius: number): string {
  if (!ref) return 'potentials in V vs SHE.';
  if (ref.offset === undefined) return `potentials in V vs ${ref.label}, at each point's own pH (${celsius} °C).`;
  return `potentials in V vs ${ref.label}, which lies at ${ref.offset >= 0 ? '+' : '−'}${Math.abs(ref.offset).toFixed(3)} V vs SHE at ${celsius} °C.`;
}

/** "Plating window for Ni at 25 °C (dissolved Ni 0.1; N 1); potentials in V vs SHE." */
export function windowHeading(m: DiagramModel, ref?: ScaledWindowResult['reference']): string {
  return `Plating window for ${m.element} at ${m.temperature.celsius} °C (dissolved ${m.element} ${elementAmountText(m, true)}${Object.keys(m.ligands).length ? `; ligand totals ${ligandAmountTexts(m, true).join(', ')}` : ''}); ${windowScaleText(ref, m.temperature.celsius)}`;
}

/** The window as text; deposition potentials on the result's reference scale when it has one. */
export function windowText(r: WindowResult | ScaledWindowResult, head: string): string {
  const v = (x: number) => `${x >= 0 ? '+' : ''}${x.toFixed(3)}`;
  const scale = 'reference' in r ? r.reference.label : 'SHE';
  const onScale = (p: { E: number; Eref?: number }) => p.Eref ?? p.E;
  const warn = r.warnings.length ? `warnings:\n${r.warnings.map((w) => `  ${textForPeople(w)}`).join('\n')}\n` : '';
  if (!r.windows.length) {
    const why = r.notes.filter((n) => n.startsWith('No window')).map(textForPeople).join('\n');
    return `${head}\nNo pH range in the diagram where a dissolved form of ${r.element} lies directly above the metal.\n${why.replace(/^No window: /, 'Why: ')}\n${warn}`;
  }
  const rows = r.windows.map((w) => [
    `${w.pH[0].toFixed(2)}–${w.pH[1].toFixed(2)}`,
    w.dissolved.map(fp).join(', '),
    `${v(onScale(w.deposition[0]))} … ${v(onScale(w.deposition[w.deposition.length - 1]))}`,
    // The margin's range over the window (its least value may lie inside it, e.g. at a ligand's
    // pKa where E_dep turns), not its values at the ends: the same figures as the margin note.
    `${v(w.marginToHydrogen.min)} … ${v(w.marginToHydrogen.max)}`,
    `${w.boundedBy.low == null ? 'edge' : fp(w.boundedBy.low)} / ${w.boundedBy.high == null ? 'edge' : fp(w.boundedBy.high)}`,
  ]);
  const t = table(['pH range', 'dissolved form', `E_dep at ends / V vs ${scale}`, 'E_dep − E(H₂) min … max / V', 'bounded by (low / high pH)'], rows);
  const fs = r.firstSolid ? `First solid above the window: ${fp(r.firstSolid.species)} from pH ${r.firstSolid.pH.toFixed(2)}.` : 'No solid appears above the window within the diagram.';
  return `${head}\n\n${t}\n\n${fs}\n${r.notes.map((n) => `Note: ${textForPeople(n)}`).join('\n')}\nEquilibrium thermodynamics only — not kinetics; check against the bath supplier's data and a qualified plating professional.\n${warn}`;
}
