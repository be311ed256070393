/**
 * Species sets for systems with several main elements (alloys, issue 18). Reads the library only;
 * computes no thermodynamics.
 */
import { type LibrarySpecies, speciesFor, type SpeciesForOptions } from './library.js';

/**
 * The species of a system with several main elements (an alloy): every species of each element's
 * one-element set (speciesFor, ligand species once) plus the compounds of the "mixed" file whose
 * elements all lie within {main elements, ligands, H, O} and which hold at least two main elements.
 * Order: each element's set in the order given, then the mixed compounds in library order.
 * Example: speciesForElements(lib, ['Fe', 'Cr']) → Fe, Fe^2+, …, Cr, Cr^3+, …, FeCr2O4.
 */
export function speciesForElements(
  lib: readonly LibrarySpecies[],
  elements: readonly string[],
  ligands: readonly string[] = [],
  opts: SpeciesForOptions = {},
): LibrarySpecies[] {
  const out: LibrarySpecies[] = [];
  const seen = new Set<LibrarySpecies>();
  for (const e of elements) {
    for (const s of speciesFor(lib, e, ligands, opts)) {
      if (!seen.has(s)) out.push(s);
      seen.add(s);
    }
  }
  const allowed = new Set<string>([...elements, ...ligands, 'H', 'O']);
  for (const s of lib) {
    if (!s.mixed || (s.metastable && !opts.metastable)) continue;
    const els = Object.keys(s.elements);
    if (els.every((e) => allowed.has(e)) && els.filter((e) => elements.includes(e)).length >= 2) out.push(s);
  }
  return out;
}
