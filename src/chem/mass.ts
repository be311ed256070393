/**
 * Molar mass of a parsed formula.
 */
import { ELEMENTS } from './elements.js';
import { type Formula, FormulaError } from './parse.js';

/**
 * Molar mass M = Σ nᵢ·Aᵣ(i) in g/mol, from the IUPAC 2021 abridged/conventional standard atomic
 * weights (see elements.ts). The electron mass (5.49×10⁻⁴ g/mol per unit charge) is neglected.
 * Worked example: H2O → 2×1.008 + 15.999 = 18.015 g/mol.
 * Throws FormulaError if an element has no standard atomic weight (e.g. Tc, Pu).
 */
export function molarMass(f: Formula): number {
  let m = 0;
  for (const [el, n] of Object.entries(f.elements)) {
    const w = ELEMENTS.get(el)?.weight;
    if (w === null || w === undefined) {
      const at = f.text.indexOf(el);
      throw new FormulaError(
        f.text,
        at >= 0 ? at + 1 : 1,
        'element with a standard atomic weight',
        `${el} has none in IUPAC 2021; give the molar mass explicitly`,
      );
    }
    m += n * w;
  }
  return m;
}
