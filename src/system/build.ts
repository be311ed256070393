/**
 * From a validated SystemSpec to the solver's input: resolve species (inline, by library name or
 * the library's set for the element and ligands), check their composition, carry their data to T
 * and attach the activities used.
 */
import { type Formula, formulaAscii, parseFormula, splitPhase } from '../chem/formula.js';
import { formulaMatches } from '../chem/match.js';
import { LIGAND_DEFAULTS } from '../data/ligand-sets.js';
import { type LibrarySpecies, findSpecies, loadLibrary, pickAlternative, speciesFor } from '../data/library.js';
import type { Phase } from '../model.js';
import type { LigandInput, SolverInput, SolverSpecies } from '../solve/types.js';
import { KELVIN } from '../thermo/constants.js';
import type { CpPolynomial } from '../thermo/cp-poly.js';
import type { ThermoData } from '../thermo/gibbs.js';
import type { HkfParameters } from '../thermo/hkf.js';
import { type Carried, type CarryContext, carrySpecies } from './carry.js';
import { InputError } from './errors.js';
import type { SystemSpec } from './spec.js';
import { type Amount, molality, type SolutionAtT, solutionAt } from './solution.js';
import { groupElements, placeSpecies, speciesActivity } from './species-placement.js';

export { groupElements } from './species-placement.js';

/** A species resolved to data, before activities. */
export interface ResolvedSpecies extends ThermoData {
  formula: string;
  phase: Phase;
  name?: string;
  source?: string;
  recalled?: boolean;
  activity?: number;
  concentration?: Amount;
  pressure?: number;
  f: Formula;
  field: string;
  /** Taken from the library's set without the user naming it. */
  implicit?: boolean;
  /** Comes from the built-in library (its S° may then be estimated; see carry.ts). */
  library?: boolean;
  hkf?: HkfParameters;
  cpPolynomial?: CpPolynomial;
}

export interface BuiltSystem {
  input: SolverInput;
  /** Sources cited by the species used, deduplicated. */
  sources: string[];
  warnings: string[];
  /** Role of each solver species for reports: ligand element or 'main'. */
  water: { H2O: ResolvedSpecies; H2: ResolvedSpecies; O2: ResolvedSpecies };
  /** Water properties, ionic strength and activity model at T. */
  solution: SolutionAtT;
  /**
   * Per main species (same order as input.species): true for a dissolved species whose activity
   * follows the system's amount of the element (no activity or concentration of its own), i.e. the
   * species an activity family changes.
   */
  followsAmount: boolean[];
}

const WATER_FORMULAS: Record<string, 'H2O' | 'H2' | 'O2'> = { 'H2O|l': 'H2O', 'H2|g': 'H2', 'O2|g': 'O2' };

export function fromLibrary(s: LibrarySpecies, field: string): ResolvedSpecies {
  return {
    formula: s.formula,
    phase: s.phase,
    name: s.name,
    dfG: s.dfG,
    dfH: s.dfH,
    S: s.S,
    Cp: s.Cp,
    source: s.sourceText,
    recalled: s.recalled,
    f: { text: s.formula, elements: s.elements, charge: s.charge },
    field,
    library: true,
    ...(s.hkf ? { hkf: s.hkf } : {}),
    ...(s.cpPolynomial ? { cpPolynomial: s.cpPolynomial } : {}),
  };
}

/**
 * The system's species without those named under `exclude` (a formula with or without a phase tag,
 * or a name). A name found nowhere is refused; one only absent from this system is a warning.
 */
function applyExclusions(spec: SystemSpec, list0: ResolvedSpecies[], lib: readonly LibrarySpecies[], warnings: string[]): ResolvedSpecies[] {
  let list = list0;
  const hadMain = list.some((s) => (s.f.elements[spec.element] ?? 0) > 0);
  for (const ex of spec.exclude) {
    const { formula, phase } = splitPhase(ex);
    const before = list.length;
    list = list.filter((s) => !((formulaMatches(formula, s.formula) && (!phase || phase === s.phase)) || s.name === ex));
    if (list.length === before) {
      // A known species that is simply not in this system (e.g. a metastable phase) is harmless;
      // a name that matches nothing anywhere is most likely a typing error.
      let known: LibrarySpecies | undefined;
      try {
        known = findSpecies(lib, ex);
      } catch {
        known = undefined;
      }
      if (!known) throw new InputError(spec.file, 'exclude', 'formulas or names of species in the system or the library', JSON.stringify(ex));
      warnings.push(`exclude: ${ex} is not in this system; nothing left out`);
    }
  }
  if (hadMain && !list.some((s) => (s.f.elements[spec.element] ?? 0) > 0)) {
    throw new InputError(spec.file, 'exclude', `a list that leaves at least one species containing ${spec.element}`, `every species of ${spec.element} left out`);
  }
  return list;
}

export function resolveSpecies(spec: SystemSpec, warnings: string[] = []): { main: ResolvedSpecies[]; water: BuiltSystem['water'] } {
  const lib = loadLibrary();
  const ligandEls = Object.values(spec.ligandGroups).flatMap((g) => Object.keys(g));
  let list: ResolvedSpecies[];
  const water: Partial<BuiltSystem['water']> = {};
  if (spec.species) {
    list = [];
    // Each species once: by library name and formula, or from the library and inline, alike.
    const seen = new Map<string, string>();
    for (const s of spec.species) {
      let r: ResolvedSpecies;
      if (s.fromLibrary) {
        const hit = findSpecies(lib, s.fromLibrary);
        if (!hit) throw new InputError(spec.file, s.field, 'a species of the built-in library (formula or name) or an object with formula, phase and dfG', JSON.stringify(s.fromLibrary));
        r = fromLibrary(hit, s.field);
        if (s.activity !== undefined) r.activity = s.activity;
        if (s.concentration !== undefined) r.concentration = s.concentration;
        if (s.pressure !== undefined) r.pressure = s.pressure;
      } else {
        r = { ...s, dfG: s.dfG!, f: parseFormula(s.formula) };
      }
      // The same species however it is spelled (Fe+2 inline, Fe^2+ from the library).
      const key = `${formulaAscii(r.f.text)}|${r.phase}`;
      const first = seen.get(key);
      const given = `${s.field} (${s.fromLibrary ? JSON.stringify(s.fromLibrary) : 'inline'})`;
      if (first !== undefined) {
        throw new InputError(spec.file, s.field, `each species once: ${r.formula} (${r.phase}) is given both at ${first} and at ${given}; remove one of the two`);
      }
      seen.set(key, given);
      const wkey = WATER_FORMULAS[`${r.f.text}|${r.phase}`];
      if (wkey) water[wkey] = r;
      else list.push(r);
    }
  } else {
    const metaAll = spec.metastable === true;
    list = speciesFor(lib, spec.element, ligandEls, { metastable: metaAll, celsius: spec.temperature }).map((s) => ({ ...fromLibrary(s, `library ${s.file}: ${s.formula}`), implicit: true }));
    list = list.filter((s) => keepLigandSpecies(spec, s));
    if (Array.isArray(spec.metastable)) {
      for (const m of spec.metastable) {
        const hit = findSpecies(lib, m);
        if (!hit) throw new InputError(spec.file, 'metastable', 'formulas or names of metastable library species', JSON.stringify(m));
        if (!list.some((x) => x.formula === hit.formula && x.phase === hit.phase)) list.push(fromLibrary(hit, `library ${hit.file}: ${hit.formula}`));
      }
    }
  }
  for (const key of ['H2O', 'H2', 'O2'] as const) {
    if (!water[key]) {
      const hit = findSpecies(lib, key === 'H2O' ? 'H2O(l)' : `${key}(g)`);
      if (!hit) throw new Error(`built-in water data lack ${key}`);
      water[key] = fromLibrary(hit, `library: ${key}`);
    }
  }
  list = applyExclusions(spec, list, lib, warnings);
  // Alternatives from other compilations.
  for (const [formula, id] of Object.entries(spec.pick)) {
    const k = list.findIndex((s) => formulaMatches(splitPhase(formula).formula, s.formula) && (!splitPhase(formula).phase || splitPhase(formula).phase === s.phase));
    if (k < 0) throw new InputError(spec.file, `pick.${formula}`, 'a formula of a species in the system', JSON.stringify(formula));
    const hit = findSpecies(lib, formula);
    let alt: LibrarySpecies | undefined;
    try {
      alt = hit ? pickAlternative(hit, id) : undefined;
    } catch {
      alt = undefined;
    }
    if (!alt) {
      const ids = hit?.alternatives?.map((a) => a.id).join(', ') || 'none';
      throw new InputError(spec.file, `pick.${formula}`, `an alternative id of ${formula} (${ids})`, JSON.stringify(id));
    }
    list[k] = { ...fromLibrary(alt, list[k].field), activity: list[k].activity };
  }
  return { main: list, water: water as BuiltSystem['water'] };
}

/**
 * Library mode: a ligand's own species (no main element) are its default family unless the system
 * file says otherwise (data/ligand-sets.ts); species that do not group into whole ligand units
 * (e.g. CO2 when the ligand is the CN group) are left out.
 */
function keepLigandSpecies(spec: SystemSpec, s: ResolvedSpecies): boolean {
  const grouped = groupElements(s.f.elements, spec.ligandGroups);
  if (!grouped) return false;
  if (!keepMixedLigand(spec, grouped)) return false;
  if ((s.f.elements[spec.element] ?? 0) > 0) return true;
  const L = Object.keys(spec.ligandGroups).find((k) => (grouped[k] ?? 0) > 0);
  if (!L) return true;
  const choice = spec.ligandSpecies[L];
  if (choice === 'all') return true;
  if (Array.isArray(choice)) return choice.some((x) => formulaMatches(splitPhase(x).formula, s.formula) && (!splitPhase(x).phase || splitPhase(x).phase === s.phase));
  const def = LIGAND_DEFAULTS[L];
  return def ? s.phase === 'aq' && def.species.some((x) => formulaMatches(x, s.formula)) : true;
}

/**
 * A species (of the main element or of the ligands alone) that holds two or more separately declared ligands (e.g. Fe(CN)6-4
 * when the file declares C and N, i.e. carbonate and ammonia) is a compound of a group the file did
 * not declare: carbonate and ammonia do not become cyanide in a cooling water. It is kept only when
 * that group is itself a declared ligand (`CN`; then it groups to one ligand and never reaches
 * here as a mix) or when every ligand it holds has `ligandSpecies: all` (the file asks for every
 * redox change of those ligands).
 */
function keepMixedLigand(spec: SystemSpec, grouped: Record<string, number>): boolean {
  const held = Object.keys(spec.ligandGroups).filter((L) => (grouped[L] ?? 0) > 0);
  if (held.length < 2) return true;
  return held.every((L) => spec.ligandSpecies[L] === 'all');
}

/**
 * A species as a warning names it: its formula, with the phase tag when it has no charge
 * ("Zn(OH)2(aq)", "Ni(OH)2(s)"), so that the aqueous and the solid form are told apart and text
 * for people prints it in Unicode (textForPeople re-spells tagged and charged formulas only).
 */
function warningName(s: ResolvedSpecies): string {
  return s.f.charge === 0 ? `${s.formula}(${s.phase})` : s.formula;
}

/**
 * Carry a species to T (carry.ts). A species that cannot be carried (an inline species with only
 * ΔfG°) stays in the system as 'undetermined': its 25 °C ΔfG° is used for the GEOMETRY only (where
 * its field would lie if G did not change with T), its region is marked undetermined and gets no
 * verdict, and a warning naming it goes into every output.
 */
export function gAt(s: ResolvedSpecies, spec: SystemSpec, ctx: Omit<CarryContext, 'constantG'>, warnings: string[]): Carried & { G: number } {
  const c = carrySpecies(s, { ...ctx, constantG: constantG(spec, s.formula) });
  const named = warningName(s);
  if (c.G === undefined) {
    warnings.push(`${UNDET_WARN}${named}`);
    return { ...c, G: s.dfG, model: 'undetermined' };
  }
  if (!Number.isFinite(c.G)) {
    throw new InputError(spec.file, `${s.field} (${s.formula})`, `temperature data that give a finite G at ${spec.temperature} °C (check its hkf or cpPolynomial values)`);
  }
  if (Math.abs(spec.temperature - 25) > 1e-9) {
    if (c.model === 'constant-g') warnings.push(`${CONST_G_WARN}${named}`);
    if (c.model === 'constant-h-s' && Math.abs(spec.temperature - 25) > 50) warnings.push(`${CP_WARN}${named}`);
    if (c.estimated) warnings.push(`${EST_WARN}${named}`);
  }
  return c as Carried & { G: number };
}

/** The warning for a temperature above the data's usual range, at the temperature built (°C). */
export function hotWarning(celsius: number): string[] {
  return celsius > 300 ? [`temperature ${celsius} °C is above 300 °C: data extrapolated beyond their usual range`] : [];
}

export function buildSystem(spec: SystemSpec): BuiltSystem {
  // The file's warnings, and the one for this temperature (a logged row may set another than the file's).
  const warnings = [...spec.warnings, ...hotWarning(spec.temperature)];
  const kelvin = spec.temperature + KELVIN;
  const { main: resolved, water } = resolveSpecies(spec, warnings);
  const sol = solutionAt(spec.file, spec.temperature, spec.pressure, spec.solution);
  warnings.push(...sol.warnings);
  const ctx = { mode: spec.extrapolation, water: sol.water, lib: loadLibrary() };
  const corrected = spec.solution.ionicStrength > 0 && spec.solution.model !== 'ideal';
  /** Activity (and molality, log γ) of a dissolved species from the amount given for it. */
  const dissolved = (a: Amount & { isDefault?: boolean }, z: number, asFormula: string) => {
    if (a.kind === 'activity' && !(a.isDefault && corrected)) return { act: a.value, logGamma: 0, molality: undefined as number | undefined };
    const m = a.kind === 'activity' ? a.value : molality(a, asFormula, sol.water.density);
    const lg = sol.logGamma(z);
    return { act: m * 10 ** lg, logGamma: lg, molality: m };
  };
  const ligandEls = Object.keys(spec.ligands);
  const allowed = new Set([spec.element, ...ligandEls, 'H', 'O']);
  const groupEls = new Set(Object.values(spec.ligandGroups).flatMap((g) => Object.keys(g)));
  const main: SolverSpecies[] = [];
  const followsAmount: boolean[] = [];
  const ligandSpecies = new Map<string, SolverSpecies[]>(ligandEls.map((L) => [L, []]));
  const sources = new Set<string>();
  for (const s0 of resolved) {
    const { s, hasMain, lig } = placeSpecies(spec, s0, allowed, groupEls, ligandEls);
    const carried = gAt(s, spec, ctx, warnings);
    const G = carried.G;
    const { act, logA, lg, mol } = speciesActivity(spec, s, hasMain, lig, dissolved);
    const sv: SolverSpecies = {
      formula: s.formula,
      phase: s.phase,
      name: s.name,
      elements: s.f.elements,
      charge: s.f.charge,
      G,
      logActivity: logA,
      activity: act,
      source: s.source,
      temperatureModel: carried.model,
    };
    if (carried.estimated) sv.estimated = true;
    if (lg !== undefined && (lg !== 0 || mol !== undefined)) sv.logGamma = lg;
    if (mol !== undefined) sv.molality = mol;
    if (s.source) sources.add(s.source);
    if (hasMain) {
      main.push(sv);
      followsAmount.push(s.phase === 'aq' && s.activity === undefined && s.concentration === undefined);
    } else ligandSpecies.get(lig!)!.push(sv);
  }
  if (main.length === 0) throw new InputError(spec.file, 'species', `at least one species containing ${spec.element}`);
  const ligands: LigandInput[] = ligandEls.map((L) => {
    const sp = ligandSpecies.get(L)!;
    if (sp.length === 0) throw new InputError(spec.file, `ligands.${L}`, `species of ${L} without ${spec.element} in the data (none found)`);
    return { element: L, activity: spec.ligands[L], species: sp };
  });
  const wG = {
    H2O: gAt(water.H2O, spec, ctx, warnings).G,
    H2: gAt(water.H2, spec, ctx, warnings).G,
    O2: gAt(water.O2, spec, ctx, warnings).G,
  };
  for (const w of Object.values(water)) if (w.source) sources.add(w.source);
  return {
    input: {
      element: spec.element,
      kelvin,
      species: main,
      ligands,
      water: wG,
      pressures: { H2: spec.gases.H2, O2: spec.gases.O2 },
      pH: spec.pH,
      E: spec.E,
    },
    sources: [...sources].sort(),
    warnings: collapseCpWarnings(warnings),
    water,
    solution: sol,
    followsAmount,
  };
}

const CP_WARN = 'no Cp: ';
const CONST_G_WARN = 'constant G: ';
const EST_WARN = 'estimated: ';
const UNDET_WARN = 'undetermined: ';

/** The user's explicit override: take ΔfG° as constant with T for this species (no S°, no ΔfH°). */
function constantG(spec: SystemSpec, formula: string): boolean {
  return spec.assumeConstantG === true || (Array.isArray(spec.assumeConstantG) && spec.assumeConstantG.includes(formula));
}

/**
 * Start of the warning naming the species that could not be carried to T (only ΔfG° given): their
 * fields are placed with the 25 °C ΔfG° and carry no verdict. Outputs match on the model's
 * `temperatureModel: 'undetermined'`, never on this text.
 */
export const UNDETERMINED_CAVEAT =
  'undetermined away from 25 °C (only ΔfG° given, no S° or ΔfH°; field placed with the 25 °C ΔfG°, no verdict there): ';

/** One warning for all species used without Cp far from 25 °C. */
export function collapseCpWarnings(ws: string[]): string[] {
  const cp = ws.filter((w) => w.startsWith(CP_WARN)).map((w) => w.slice(CP_WARN.length));
  const rest = ws.filter((w) => !w.startsWith(CP_WARN) && !w.startsWith(CONST_G_WARN) && !w.startsWith(EST_WARN) && !w.startsWith(UNDET_WARN));
  const und = ws.filter((w) => w.startsWith(UNDET_WARN)).map((w) => w.slice(UNDET_WARN.length));
  if (und.length) rest.unshift(`${UNDETERMINED_CAVEAT}${[...new Set(und)].join(', ')}`);
  const est = ws.filter((w) => w.startsWith(EST_WARN)).map((w) => w.slice(EST_WARN.length));
  if (est.length) rest.push(`carried to temperature with estimated data (S° or equation-of-state parameters; see species/README.md): ${[...new Set(est)].join(', ')}`);
  const cg = ws.filter((w) => w.startsWith(CONST_G_WARN)).map((w) => w.slice(CONST_G_WARN.length));
  if (cg.length) rest.push(`ΔfG° taken as constant with temperature (assumeConstantG; no S° or ΔfH°, a rough assumption): ${[...new Set(cg)].join(', ')}`);
  if (cp.length) rest.push(`species without Cp° used more than 50 K from 25 °C (constant ΔH and ΔS for them): ${[...new Set(cp)].join(', ')}`);
  return rest;
}
