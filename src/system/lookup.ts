/**
 * Species lookup for the `cell` calculator: the built-in library by formula and phase, and a
 * system file's inline species (with data) in front of it.
 */
import { parseFormula, type Phase } from '../chem/formula.js';
import { formulaMatches } from '../chem/match.js';
import { findAllSpecies, loadLibrary } from '../data/library.js';
import type { SpeciesLookup } from '../thermo/cell.js';
import type { SpeciesAtT } from '../thermo/cell-energies.js';
import type { CpPolynomial } from '../thermo/cp-poly.js';
import type { HkfParameters } from '../thermo/hkf.js';
import { waterState } from '../thermo/water.js';
import type { ResolvedSpecies } from './build.js';
import { carryProperties } from './carry.js';
import { readSystemFile } from './read.js';
import { readSpec } from './spec.js';

/** Phase preferred when the reaction text names none: solid, then liquid, dissolved, gas. */
const PHASE_PREFERENCE = ['s', 'l', 'aq', 'g'];

interface ModelData {
  formula: string;
  phase: Phase;
  dfG: number;
  dfH?: number;
  S?: number;
  Cp?: number;
  hkf?: HkfParameters;
  cpPolynomial?: CpPolynomial;
}

/**
 * G, H, S, Cp of a species at a temperature (°C) by its own model (system/carry.ts, the default
 * 'best' extrapolation) on the liquid-water path (1 atm below 100 °C, saturation pressure above).
 * G undefined where the species cannot be carried (only ΔfG°, away from 25 °C).
 */
function propertiesAt(d: ModelData, library: boolean): (celsius: number) => SpeciesAtT {
  const f = parseFormula(d.formula);
  const r: ResolvedSpecies = {
    formula: d.formula, phase: d.phase, dfG: d.dfG, dfH: d.dfH, S: d.S, Cp: d.Cp, field: d.formula, library,
    f: { text: d.formula, elements: f.elements, charge: f.charge },
    ...(d.hkf ? { hkf: d.hkf } : {}),
    ...(d.cpPolynomial ? { cpPolynomial: d.cpPolynomial } : {}),
  };
  return (celsius) => {
    const ctx = { mode: 'best' as const, water: waterState(celsius), lib: loadLibrary(), constantG: false };
    const p = carryProperties(r, ctx);
    // Only ΔfG° at 25 °C: the tabulated value, no derivatives.
    if (p.model === 'tabulated') return { G: p.G, model: p.model, estimated: false };
    return { G: p.G, H: p.H, S: p.S, Cp: p.Cp, model: p.model, estimated: p.estimated };
  };
}

/** Species from the built-in library: by formula and phase (a default phase when none is given). */
export const libraryLookup: SpeciesLookup = (formula, phase) => {
  const key = phase ? `${formula}(${phase})` : formula;
  const hits = findAllSpecies(loadLibrary(), key);
  const hit = [...hits].sort((a, b) => PHASE_PREFERENCE.indexOf(a.phase) - PHASE_PREFERENCE.indexOf(b.phase))[0];
  if (!hit) return undefined;
  return { dfG: hit.dfG, dfH: hit.dfH, S: hit.S, Cp: hit.Cp, elements: hit.elements, charge: hit.charge, phase: hit.phase, source: hit.sourceText, propertiesAt: propertiesAt(hit, true) };
};

/** Species of a system file's inline list (with data) first, then the fallback lookup. Reads the file now. */
export function fileLookup(path: string, fallback: SpeciesLookup): SpeciesLookup {
  const spec = readSpec(readSystemFile(path), path);
  const inline = (spec.species ?? []).filter((x) => !x.fromLibrary && x.dfG !== undefined);
  return (formula, phase) => {
    const hit = inline.find((x) => formulaMatches(formula, x.formula) && (phase === undefined || x.phase === phase));
    if (!hit) return fallback(formula, phase);
    const f = parseFormula(hit.formula);
    return {
      dfG: hit.dfG!, dfH: hit.dfH, S: hit.S, Cp: hit.Cp, elements: f.elements, charge: f.charge, phase: hit.phase, source: hit.source ?? path,
      propertiesAt: propertiesAt({ ...hit, dfG: hit.dfG! }, false),
    };
  };
}
