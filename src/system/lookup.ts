/**
 * Species lookup for the `cell` calculator: the built-in library by formula and phase, and a
 * system file's inline species (with data) in front of it.
 */
import { parseFormula } from '../chem/formula.js';
import { findAllSpecies, loadLibrary } from '../data/library.js';
import type { SpeciesLookup } from '../thermo/cell.js';
import { readSystemFile } from './read.js';
import { readSpec } from './spec.js';

/** Phase preferred when the reaction text names none: solid, then liquid, dissolved, gas. */
const PHASE_PREFERENCE = ['s', 'l', 'aq', 'g'];

/** Species from the built-in library: by formula and phase (a default phase when none is given). */
export const libraryLookup: SpeciesLookup = (formula, phase) => {
  const key = phase ? `${formula}(${phase})` : formula;
  const hits = findAllSpecies(loadLibrary(), key);
  const hit = [...hits].sort((a, b) => PHASE_PREFERENCE.indexOf(a.phase) - PHASE_PREFERENCE.indexOf(b.phase))[0];
  if (!hit) return undefined;
  return { dfG: hit.dfG, dfH: hit.dfH, S: hit.S, Cp: hit.Cp, elements: hit.elements, charge: hit.charge, phase: hit.phase, source: hit.sourceText };
};

/** Species of a system file's inline list (with data) first, then the fallback lookup. Reads the file now. */
export function fileLookup(path: string, fallback: SpeciesLookup): SpeciesLookup {
  const spec = readSpec(readSystemFile(path), path);
  const inline = (spec.species ?? []).filter((x) => !x.fromLibrary && x.dfG !== undefined);
  return (formula, phase) => {
    const hit = inline.find((x) => x.formula === formula && (phase === undefined || x.phase === phase));
    if (!hit) return fallback(formula, phase);
    const f = parseFormula(hit.formula);
    return { dfG: hit.dfG!, dfH: hit.dfH, S: hit.S, Cp: hit.Cp, elements: f.elements, charge: f.charge, phase: hit.phase, source: hit.source ?? path };
  };
}
