/**
 * Look-up in the loaded species library: by formula, name or alias (findAllSpecies, findSpecies),
 * the species of one element's system (speciesFor), another compilation's values (pickAlternative)
 * and the citations a species rests on. Reads the library only; computes no thermodynamics.
 */
import { parseFormula, splitPhase, sameFormula } from '../chem/formula.js';
import { formulaMatches } from '../chem/match.js';
import type { Phase } from '../model.js';
import type { LibrarySpecies } from './library-types.js';

/** Phase preference when a formula without phase tag matches several entries (e.g. H2O, CO2, H2S). */
const PHASE_PREFERENCE: readonly Phase[] = ['s', 'l', 'aq', 'g'];

/**
 * All species matching `key`: by formula, with or without phase tag (`Fe2O3`, `Fe2O3(s)`,
 * `Fe^2+(aq)`, `Fe²⁺`, the older `Fe+2`; exact text first, else same composition and charge), otherwise by name or alias
 * (case-insensitive, surrounding whitespace ignored; an alias that is a formula, such as `Fe(OH)3^-`,
 * also matches in any notation: `Fe(OH)₃⁻`, `Fe(OH)3-`). Formula matches are ordered by phase
 * preference solid, liquid, aqueous, gas.
 */
export function findAllSpecies(lib: readonly LibrarySpecies[], key: string): LibrarySpecies[] {
  const text = key.trim();
  const { formula, phase } = splitPhase(text);
  const phaseOk = (s: LibrarySpecies): boolean => phase === undefined || s.phase === phase;
  const byPhase = (a: LibrarySpecies, b: LibrarySpecies): number =>
    PHASE_PREFERENCE.indexOf(a.phase) - PHASE_PREFERENCE.indexOf(b.phase);
  let hits = lib.filter((s) => s.formula === formula && phaseOk(s));
  if (hits.length === 0) {
    let parsed;
    try {
      parsed = parseFormula(formula);
    } catch {
      parsed = undefined;
    }
    if (parsed) {
      const p = parsed;
      hits = lib.filter((s) => phaseOk(s) && sameFormula(p, { text: s.formula, elements: s.elements, charge: s.charge }));
    }
  }
  if (hits.length > 0) return [...hits].sort(byPhase);
  const lower = text.toLowerCase();
  return lib.filter(
    (s) => s.name.toLowerCase() === lower || (s.aliases ?? []).some((a) => a.trim().toLowerCase() === lower || formulaMatches(text, a.trim())),
  );
}

/**
 * The species matching `key` (see findAllSpecies), or undefined. When a formula without phase tag
 * matches several phases, the first by preference solid, liquid, aqueous, gas is returned
 * (`H2O` → liquid water, `H2S` → H2S(aq)); give the phase tag to choose (`H2S(g)`).
 */
export function findSpecies(lib: readonly LibrarySpecies[], key: string): LibrarySpecies | undefined {
  return findAllSpecies(lib, key)[0];
}

/** Options of speciesFor. */
export interface SpeciesForOptions {
  /** Include species flagged metastable (default false). */
  metastable?: boolean;
  /** The system temperature, °C: species outside their `stableBelow`/`stableAbove` range count as metastable there (default 25). */
  celsius?: number;
}

/** Whether a species counts as metastable at `celsius`: flagged so, or outside its phase-choice range. */
export function metastableAt(s: Pick<LibrarySpecies, 'metastable' | 'stableBelow' | 'stableAbove'>, celsius = 25): boolean {
  if (s.metastable) return true;
  if (s.stableBelow !== undefined && !(celsius < s.stableBelow)) return true;
  return s.stableAbove !== undefined && celsius < s.stableAbove;
}

/**
 * The species of the system {element, ligands, H, O}: every library species whose elements are all
 * within that set and which contains the main element or a ligand element. Water's own species
 * (only H and O) and compounds of the "mixed" file are not returned. Metastable species (flagged, or
 * outside their stableBelow/stableAbove range at opts.celsius) are left out unless opts.metastable is true.
 * Example: speciesFor(lib, 'Cu', ['S']) → Cu, Cu+2, CuO, ..., Cu2S, CuS, and S, H2S, HS-, SO4-2, ...
 */
export function speciesFor(
  lib: readonly LibrarySpecies[],
  element: string,
  ligands: readonly string[] = [],
  opts: SpeciesForOptions = {},
): LibrarySpecies[] {
  const allowed = new Set<string>([element, ...ligands, 'H', 'O']);
  const wanted = new Set<string>([element, ...ligands]);
  return lib.filter((s) => {
    if (!opts.metastable && metastableAt(s, opts.celsius)) return false;
    if (s.mixed) return false;
    const els = Object.keys(s.elements);
    if (!els.every((e) => allowed.has(e))) return false;
    return els.some((e) => wanted.has(e) && e !== 'H' && e !== 'O');
  });
}

/**
 * A copy of `species` carrying the values of its alternative `id` in place of the default ones.
 * Values the alternative does not give (e.g. ΔfH°, S°, Cp° of a ΔfG°-only alternative) are left
 * out rather than mixed in from the default compilation. `source`, `sourceText`, `sources`,
 * `recalled`, `uncertainty` and `note` are those of the alternative; `alternative` is set to `id`.
 * Throws an Error naming the species and the available ids when `id` is unknown.
 */
export function pickAlternative(species: LibrarySpecies, id: string): LibrarySpecies {
  const alt = (species.alternatives ?? []).find((a) => a.id === id);
  if (!alt) {
    const ids = (species.alternatives ?? []).map((a) => a.id);
    throw new Error(
      `species ${species.formula}(${species.phase}) in ${species.file} has no alternative "${id}"` +
        (ids.length ? `; available: ${ids.join(', ')}` : '; it has no alternatives'),
    );
  }
  const {
    dfH: _h, S: _s, Cp: _c, sources: _src, uncertainty: _u, note: _n, recalled: _r, valueSourceText: _v,
    ...rest
  } = species;
  const copy: LibrarySpecies = {
    ...rest,
    dfG: alt.dfG,
    source: alt.source,
    sourceText: species.sourceMap[alt.source] ?? alt.source,
    alternative: id,
  };
  if (alt.dfH !== undefined) copy.dfH = alt.dfH;
  if (alt.S !== undefined) copy.S = alt.S;
  if (alt.Cp !== undefined) copy.Cp = alt.Cp;
  if (alt.recalled !== undefined) copy.recalled = alt.recalled;
  if (alt.uncertainty) copy.uncertainty = { ...alt.uncertainty };
  if (alt.note) copy.note = alt.note;
  if (alt.sources) {
    copy.sources = { ...alt.sources };
    copy.valueSourceText = Object.fromEntries(
      Object.entries(alt.sources).map(([k, v]) => [k, species.sourceMap[v as string] ?? (v as string)]),
    );
  }
  return copy;
}

/** Every citation a species' values rest on (main source first, then per-value overrides), deduplicated. */
export function speciesCitations(species: LibrarySpecies): string[] {
  return [...new Set([species.sourceText, ...Object.values(species.valueSourceText ?? {})])];
}
