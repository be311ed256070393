/**
 * From an AlloySpec to the alloy solver's input (issue 18): the species of every main element, the
 * mixed compounds of the library that hold two or more of them, and the ligand species — each carried
 * to T by the same code as a one-element system (build.ts).
 *
 * Steps:
 *  1. per main element, buildSystem on the common keys with that element and its threshold activity
 *     (so its species, activities and G(T) are exactly those of its own one-element diagram);
 *     exclusions are applied afterwards over the whole set (step 3); `pick` and `metastable` entries
 *     go to the element whose species they name (ligand species: the first element);
 *  2. the mixed compounds (species/mixed.json) whose elements lie within {main elements, ligands, H, O}
 *     (metastable ones when asked for, `pick` alternatives applied), carried to T with gAt; dissolved
 *     ones take the smallest threshold of their metals;
 *  3. `exclude` over all species (formula with or without phase tag, or name), as for one element;
 *  4. the composition and the ligands (from the first element's build; every build has the same).
 */
import { speciesForElements } from '../data/alloy-species.js';
import { findSpecies, type LibrarySpecies, loadLibrary, pickAlternative } from '../data/library.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { SolverSpecies } from '../solve/types.js';
import { splitPhase } from '../chem/formula.js';
import { formulaMatches } from '../chem/match.js';
import { KELVIN } from '../thermo/constants.js';
import type { AlloySpec } from './alloy-spec.js';
import { type BuiltSystem, buildSystem, collapseCpWarnings, fromLibrary, gAt, groupElements } from './build.js';
import { InputError } from './errors.js';
import { UndeterminedError } from '../errors.js';
import type { SystemSpec } from './spec.js';

export interface BuiltAlloy {
  input: AlloyInput;
  /** Sources cited by the species used, deduplicated and sorted. */
  sources: string[];
  warnings: string[];
  water: BuiltSystem['water'];
  solution: BuiltSystem['solution'];
}

/**
 * Which element's build a species named under `pick` or `metastable` belongs to: the element it holds
 * alone; ligand species and names the library does not know go with the first element (whose build
 * then reports an unknown name as for one element); mixed compounds with none (step 2 handles them).
 */
function ownerOf(name: string, els: string[]): string | undefined {
  const hit = findSpecies(loadLibrary(), name);
  const mains = hit ? els.filter((e) => (hit.elements[e] ?? 0) > 0) : [];
  if (mains.length === 0) return els[0];
  return mains.length === 1 ? mains[0] : undefined;
}

/** Step 1: the common keys with one element in place (its activity; picks and metastable names of its own species). */
function elementSpec(spec: AlloySpec, el: string): SystemSpec {
  const els = Object.keys(spec.composition);
  const pick = Object.fromEntries(Object.entries(spec.base.pick).filter(([formula]) => ownerOf(formula, els) === el));
  const meta = spec.base.metastable;
  const a = spec.activities[el];
  return {
    ...spec.base,
    element: el,
    activity: a,
    amount: { kind: 'activity', value: a, isDefault: spec.activityIsDefault },
    exclude: [],
    pick,
    metastable: Array.isArray(meta) ? meta.filter((m) => ownerOf(m, els) === el) : meta,
    warnings: [],
  };
}

/** Step 2: mixed compounds at T. */
function mixedSpecies(spec: AlloySpec, water: BuiltSystem['solution']['water'], warnings: string[]): SolverSpecies[] {
  const ctx = { mode: spec.base.extrapolation, water, lib: loadLibrary() };
  const els = Object.keys(spec.composition);
  const ligandEls = Object.values(spec.base.ligandGroups).flatMap((g) => Object.keys(g));
  const meta = spec.base.metastable;
  const named = (s: LibrarySpecies, list: string[]): boolean => list.some((m) => findSpecies(loadLibrary(), m) === s);
  const mixed = speciesForElements(loadLibrary(), els, ligandEls, { metastable: true })
    .filter((s) => s.mixed && (!s.metastable || meta === true || (Array.isArray(meta) && named(s, meta))));
  const out: SolverSpecies[] = [];
  for (const lib0 of mixed) {
    const altId = Object.entries(spec.base.pick).find(([formula]) => findSpecies(loadLibrary(), formula) === lib0)?.[1];
    let lib = lib0;
    if (altId !== undefined) {
      try {
        lib = pickAlternative(lib0, altId);
      } catch {
        const ids = lib0.alternatives?.map((x) => x.id).join(', ') || 'none';
        throw new InputError(spec.base.file, `pick.${lib0.formula}`, `an alternative id of ${lib0.formula} (${ids})`, JSON.stringify(altId));
      }
    }
    const r = { ...fromLibrary(lib, `library ${lib.file}: ${lib.formula}`), implicit: true };
    const grouped = groupElements(r.f.elements, spec.base.ligandGroups);
    if (!grouped) continue;
    const G = gAt(r, spec.base, ctx, warnings).G;
    const act = r.phase === 'aq' ? Math.min(...els.filter((e) => grouped[e]).map((e) => spec.activities[e])) : r.phase === 'g' ? 1 : undefined;
    out.push({
      formula: r.formula,
      phase: r.phase,
      name: r.name,
      elements: grouped,
      charge: r.f.charge,
      G,
      logActivity: act === undefined ? 0 : Math.log10(act),
      activity: act,
      source: r.source,
    });
  }
  return out;
}

/** Step 3: does an `exclude` entry name this species? */
function excluded(ex: string, s: SolverSpecies): boolean {
  const { formula, phase } = splitPhase(ex);
  return (formulaMatches(formula, s.formula) && (!phase || phase === s.phase)) || s.name === ex;
}

export function buildAlloySystem(spec: AlloySpec): BuiltAlloy {
  const els = Object.keys(spec.composition);
  const kelvin = spec.base.temperature + KELVIN;
  const warnings: string[] = [...spec.warnings];
  const builds = els.map((el) => buildSystem(elementSpec(spec, el)));
  const sources = new Set(builds.flatMap((b) => b.sources));
  for (const b of builds) warnings.push(...b.warnings.filter((w) => !warnings.includes(w)));
  const rawWarnings: string[] = [];
  const mixed = mixedSpecies(spec, builds[0].solution.water, rawWarnings);
  warnings.push(...collapseCpWarnings(rawWarnings));
  for (const s of mixed) if (s.source) sources.add(s.source);
  let species = [...builds.flatMap((b) => b.input.species), ...mixed];
  let ligands = builds[0].input.ligands;
  for (const ex of spec.base.exclude) {
    const before = species.length + ligands.reduce((n, L) => n + L.species.length, 0);
    species = species.filter((s) => !excluded(ex, s));
    ligands = ligands.map((L) => ({ ...L, species: L.species.filter((s) => !excluded(ex, s)) }));
    if (species.length + ligands.reduce((n, L) => n + L.species.length, 0) === before) {
      if (!findSpecies(loadLibrary(), ex)) throw new InputError(spec.base.file, 'exclude', 'formulas or names of species in the system or the library', JSON.stringify(ex));
      warnings.push(`exclude: ${ex} is not in this system; nothing left out`);
    }
  }
  for (const e of els) {
    if (!species.some((s) => (s.elements[e] ?? 0) > 0 && els.every((o) => o === e || !(s.elements[o] ?? 0)))) {
      throw new InputError(spec.base.file, 'exclude', `at least one species of ${e} alone left in the system`);
    }
  }
  for (const L of ligands) {
    if (L.species.length === 0) throw new InputError(spec.base.file, 'exclude', `at least one species of the ligand ${L.element} left in the system`);
  }
  // An assemblage needs every candidate's G at T: a species that cannot be carried there would make
  // any answer a guess, so the whole alloy diagram is refused (exit 4) naming the species.
  const undetermined = [...species, ...ligands.flatMap((L) => L.species)].filter((s) => s.temperatureModel === 'undetermined').map((s) => s.formula);
  if (undetermined.length) {
    throw new UndeterminedError(`${spec.base.file}: no alloy diagram at ${spec.base.temperature} °C: ${[...new Set(undetermined)].join(', ')} cannot be carried to this temperature (ΔfG° only); exclude them or give their ΔfH° and S°`);
  }
  const first = builds[0];
  return {
    input: {
      composition: { ...spec.composition },
      kelvin,
      species,
      ligands,
      water: first.input.water,
      pressures: first.input.pressures,
      pH: first.input.pH,
      E: first.input.E,
    },
    sources: [...sources].sort(),
    warnings: [...new Set(warnings)],
    water: first.water,
    solution: first.solution,
  };
}
