/**
 * The system file contract: keys, types, ranges and defaults. `readSpec` turns parsed JSON/YAML
 * into a validated SystemSpec or throws an InputError naming the file and field.
 *
 * Stable keys (used by independent checks): element, temperature, activity, ligands, pH, E,
 * exclude, species. Further keys are documented in README.md.
 */
import { isElement } from '../chem/elements.js';
import { FormulaError, formulaWarnings, parseFormula } from '../chem/formula.js';
import type { Phase } from '../model.js';
import { InputError } from './errors.js';
import { Fields } from './fields.js';
import { type Amount, checkAsHolds, readAmount, readSolutionSettings, type SolutionSettings } from './solution.js';
import { type Operating, readOperating } from './operating.js';
import type { CpPolynomial } from '../thermo/cp-poly.js';
import { HKF_KEYS, type HkfParameters } from '../thermo/hkf.js';
import { type CompositionSpec, readComposition } from './composition.js';
import { readSolubilityLevels } from './solubility-levels.js';

export interface InlineSpecies {
  formula: string;
  phase: Phase;
  dfG?: number;
  dfH?: number;
  S?: number;
  Cp?: number;
  /** Revised HKF parameters (aqueous), tabulated units (src/thermo/hkf.ts). */
  hkf?: HkfParameters;
  /** Maier–Kelley Cp(T) = a + bT + cT⁻², J/(mol·K) (solids, liquids, gases). */
  cpPolynomial?: CpPolynomial;
  activity?: number;
  /** A concentration given instead of an activity. */
  concentration?: Amount;
  pressure?: number;
  name?: string;
  source?: string;
  /** Where in the file (for messages): species[k]. */
  field: string;
  /** A bare name/formula to take from the library. */
  fromLibrary?: string;
}

export interface SystemSpec {
  file: string;
  element: string;
  temperature: number;
  /** Liquid pressure, MPa (default: 0.101325 below 100 °C, saturation above). */
  pressure?: number;
  activity: number;
  /** How the dissolved amount of the element was given; `isDefault` when neither key was set. */
  amount: Amount & { isDefault: boolean };
  ligands: Record<string, number>;
  ligandAmounts: Record<string, Amount>;
  /** Ligand key → element composition (an element maps to itself; a group such as CN to {C: 1, N: 1}). */
  ligandGroups: Record<string, Record<string, number>>;
  /** Per ligand: 'all' or a list of formulas of its own species to use (library mode). */
  ligandSpecies: Record<string, 'all' | string[]>;
  solution: SolutionSettings;
  pH: [number, number];
  E: [number, number];
  exclude: string[];
  species?: InlineSpecies[];
  gases: { H2: number; O2: number };
  metastable: boolean | string[];
  /** Species (or all, true) whose ΔfG° is taken as constant with T when S° and ΔfH° are missing. */
  assumeConstantG: boolean | string[];
  pick: Record<string, string>;
  extrapolation: 'best' | 'cp' | 'constant-h-s';
  title?: string;
  grid: number;
  /** Reference electrode, verdict reclassifications, operating points, envelopes and paths. */
  operating: Operating;
  /** Everything else the later stages read (figure, points, ...), validated where used. */
  extra: Record<string, unknown>;
  warnings: string[];
  /** Composition mode (src/system/composition.ts): totals of the bath as made up. */
  composition?: CompositionSpec;
}

export const TOP_KEYS = [
  '$schema',
  'element',
  'temperature',
  'pressure',
  'activity',
  'ligands',
  'pH',
  'E',
  'exclude',
  'species',
  'gases',
  'metastable',
  'pick',
  'extrapolation',
  'title',
  'grid',
  'figure',
  'ionicStrength',
  'background',
  'activityModel',
  'ionSize',
  'ligandSpecies',
  'assumeConstantG',
  'concentration',
  'reference',
  'points',
  'boxes',
  'paths',
  'classes',
  'families',
  'platingWindow',
  'description',
  'elements',
  'composition',
  'solubilityLevels',
] as const;

const SPECIES_KEYS = ['formula', 'phase', 'dfG', 'dfH', 'S', 'Cp', 'hkf', 'cpPolynomial', 'activity', 'concentration', 'pressure', 'name', 'source'] as const;

/** The free-text `description` (any value), at most this many characters as JSON. */
export const MAX_DESCRIPTION = 20_000;

/** Temperatures the program accepts, °C (liquid water, IAPWS-IF97 region 1). */
export const T_RANGE = { min: 0, max: 350 };

export function readSpec(data: unknown, file: string): SystemSpec {
  const f = new Fields(file);
  const o = f.object(data, '', TOP_KEYS);
  const warnings: string[] = [];

  // Several main elements are read by readAlloySpec (alloy-spec.ts), not here.
  if (o.elements !== undefined) f.fail('elements', 'one main element (element): a system with several elements (an alloy) is not yet drawn, probed or reported by this command', o.elements);
  if (o.element === undefined) f.fail('element', 'the symbol of the main element, e.g. "Fe"');
  const element = f.string(o.element, 'element', 'an element symbol such as "Fe"', 3);
  if (!isElement(element)) f.fail('element', 'an element symbol such as "Fe" (case matters)', element);
  if (element === 'H' || element === 'O') f.fail('element', 'an element other than H or O (water is always present)', element);

  const comp = o.composition === undefined ? undefined : readComposition(f, o, element);
  const levels = readSolubilityLevels(f, o.solubilityLevels, comp !== undefined);
  if (comp && levels) comp.composition.levels = levels;
  const temperature = f.optNumber(o.temperature, 'temperature', 25, { min: T_RANGE.min, max: T_RANGE.max });
  // The warning above 300 °C is the build's (system/build.ts), at the temperature actually computed.
  const pressure = o.pressure === undefined ? undefined : f.number(o.pressure, 'pressure', { positive: true, max: 100 });
  const activity = f.optNumber(o.activity, 'activity', 1e-6, { positive: true, max: 100 });
  if (o.activity !== undefined && o.concentration !== undefined) f.fail('concentration', 'either activity or concentration, not both');
  let amount: SystemSpec['amount'] = { kind: 'activity', value: activity, isDefault: o.activity === undefined };
  if (o.concentration !== undefined) {
    const a = typeof o.concentration === 'number' ? { kind: 'molality' as const, value: f.number(o.concentration, 'concentration', { positive: true, max: 100 }) } : readAmount(f, o.concentration, 'concentration');
    checkAsHolds(f, a, element, 'concentration');
    amount = { ...a, isDefault: false };
  }
  const solution = readSolutionSettings(f, comp ? comp.rest : o);

  const { ligands, ligandAmounts, ligandGroups } = readLigands(f, o.ligands, element);

  if (comp) {
    // Composition mode: the ligands are the composition's; their totals stand in as amounts.
    Object.assign(ligandGroups, comp.ligandGroups);
    for (const [k, a] of Object.entries(comp.composition.ligands)) {
      ligandAmounts[k] = a;
      ligands[k] = a.value;
    }
  }
  const ligandSpecies: Record<string, 'all' | string[]> = Object.create(null);
  if (o.ligandSpecies !== undefined) {
    for (const [k, v] of f.entries(o.ligandSpecies, 'ligandSpecies', 'a map of ligand → "all" or a list of formulas')) {
      if (!(k in ligandGroups)) f.fail(`ligandSpecies.${k}`, `a ligand named under ligands (${Object.keys(ligandGroups).join(', ') || 'none given'})`, k);
      ligandSpecies[k] = v === 'all' ? 'all' : f.stringList(v, `ligandSpecies.${k}`);
    }
  }
  const pH = f.range(o.pH, 'pH', [0, 14], { min: -3, max: 17, unit: 'pH' });
  const E = f.range(o.E, 'E', [-2, 2], { min: -5, max: 5, unit: 'V vs SHE' });
  const exclude = o.exclude === undefined ? [] : f.stringList(o.exclude, 'exclude');

  const species = o.species === undefined ? undefined : readSpeciesList(f, o.species, warnings);

  let gases = { H2: 1, O2: 1 };
  if (o.gases !== undefined) {
    const g = f.object(o.gases, 'gases', ['H2', 'O2']);
    gases = {
      H2: f.optNumber(g.H2, 'gases.H2', 1, { positive: true, max: 1000 }),
      O2: f.optNumber(g.O2, 'gases.O2', 1, { positive: true, max: 1000 }),
    };
  }
  let metastable: boolean | string[] = false;
  if (o.metastable !== undefined) {
    metastable = typeof o.metastable === 'boolean' ? o.metastable : f.stringList(o.metastable, 'metastable');
  }
  let assumeConstantG: boolean | string[] = false;
  if (o.assumeConstantG !== undefined) {
    assumeConstantG = typeof o.assumeConstantG === 'boolean' ? o.assumeConstantG : f.stringList(o.assumeConstantG, 'assumeConstantG');
  }
  const pick: Record<string, string> = Object.create(null);
  if (o.pick !== undefined) {
    for (const [k, v] of f.entries(o.pick, 'pick', 'a map of formula → alternative id')) pick[k] = f.string(v, `pick.${k}`, 'an alternative id');
  }
  const extrapolation = o.extrapolation === undefined ? 'best' : f.oneOf(o.extrapolation, 'extrapolation', ['best', 'cp', 'constant-h-s'] as const);
  const title = o.title === undefined ? undefined : f.string(o.title, 'title', 'a title text', 200);
  const grid = f.optNumber(o.grid, 'grid', 200, { integer: true, min: 10, max: 4000 });

  if (o.description !== undefined) {
    const n = JSON.stringify(o.description).length;
    if (n > MAX_DESCRIPTION) throw new InputError(file, 'description', `a description of at most ${MAX_DESCRIPTION} characters`, `${n}`);
  }
  const extra: Record<string, unknown> = {};
  // `platingWindow: true` asks `report` for its plating-window section (a bath, not a corrosion case).
  if (o.platingWindow !== undefined) extra.platingWindow = f.boolean(o.platingWindow, 'platingWindow');
  for (const k of ['figure', 'reference', 'points', 'boxes', 'paths', 'classes', 'families', 'description']) {
    if (o[k] !== undefined) extra[k] = o[k];
  }
  return { file, element, temperature, pressure, activity, amount, ligands, ligandAmounts, ligandGroups, ligandSpecies, solution, operating: readOperating(f, extra), pH, E, exclude, species, gases, metastable, assumeConstantG, pick, extrapolation, title, grid, extra, warnings, ...(comp ? { composition: comp.composition } : {}) };
}

/** The `ligands` map: element or neutral group → amount, with each group's composition (no shared element). */
function readLigands(f: Fields, raw: unknown, element: string): { ligands: Record<string, number>; ligandAmounts: Record<string, Amount>; ligandGroups: Record<string, Record<string, number>> } {
  // User maps are built without a prototype (and their keys checked by f.entries).
  const ligands: Record<string, number> = Object.create(null);
  const ligandAmounts: Record<string, Amount> = Object.create(null);
  const ligandGroups: Record<string, Record<string, number>> = Object.create(null);
  if (raw !== undefined) {
    for (const [k, v] of f.entries(raw, 'ligands', 'a map of element symbol → total activity, e.g. {S: 1e-3}')) {
      const what = 'an element symbol (e.g. S, C, Cl, N) or a neutral group formula such as CN as key';
      let comp: Record<string, number>;
      if (isElement(k)) comp = { [k]: 1 };
      else {
        try {
          const g = parseFormula(k);
          if (g.charge !== 0 || Object.keys(g.elements).length < 2) f.fail(`ligands.${k}`, what, k);
          comp = g.elements;
        } catch (e) {
          if (e instanceof FormulaError) f.fail(`ligands.${k}`, what, k);
          throw e;
        }
      }
      for (const el of Object.keys(comp)) {
        if (el === element || el === 'H' || el === 'O') f.fail(`ligands.${k}`, 'a ligand without the main element, H or O', k);
        for (const [other, oc] of Object.entries(ligandGroups)) {
          if (oc[el]) f.fail(`ligands.${k}`, `ligands that share no element (${el} is already in ${other})`, k);
        }
      }
      ligandGroups[k] = comp;
      const a = readAmount(f, v, `ligands.${k}`);
      checkAsHolds(f, a, k, `ligands.${k}`);
      ligandAmounts[k] = a;
      ligands[k] = a.value;
    }
  }
  return { ligands, ligandAmounts, ligandGroups };
}

/** The inline `species` list: each entry read, and every formula+phase given once. */
function readSpeciesList(f: Fields, raw: unknown, warnings: string[]): InlineSpecies[] {
  const list = f.list(raw, 'species', 2000);
  if (list.length === 0) f.fail('species', 'a non-empty list of species (or leave the key out to use the built-in library)', list);
  const species = list.map((s, k) => readSpecies(f, s, `species[${k}]`, warnings));
  const seen = new Map<string, string>();
  for (const s of species) {
    if (s.fromLibrary) continue;
    const key = `${s.formula}|${s.phase}`;
    if (seen.has(key)) f.fail(s.field, `each species once; ${s.formula} (${s.phase}) is already given at ${seen.get(key)}`, s.formula);
    seen.set(key, s.field);
  }
  return species;
}

function readSpecies(f: Fields, raw: unknown, field: string, warnings: string[]): InlineSpecies {
  if (typeof raw === 'string') {
    const name = f.string(raw, field, 'a library species formula or name, or an object with formula, phase and dfG', 100);
    return { formula: name, phase: 'aq', field, fromLibrary: name };
  }
  const o = f.object(raw, field, SPECIES_KEYS);
  const formula = f.string(o.formula, `${field}.formula`, 'a formula such as "Fe^2+" or "Fe2O3"', 100);
  try {
    parseFormula(formula);
  } catch (e) {
    if (e instanceof FormulaError) f.fail(`${field}.formula`, `a valid formula (${e.message})`);
    throw e;
  }
  for (const w of formulaWarnings(formula)) warnings.push(`${f.file}: ${field}.formula: ${w}`);
  const label = `${field} (${formula})`;
  if (o.dfG === undefined) {
    if (o.phase !== undefined || o.dfH !== undefined || o.S !== undefined || o.Cp !== undefined || o.hkf !== undefined || o.cpPolynomial !== undefined) {
      f.fail(`${label}.dfG`, 'ΔfG° in kJ/mol (required for an inline species)');
    }
    // Only a formula (and activity/pressure): take the data from the library.
    const activity = o.activity === undefined ? undefined : f.number(o.activity, `${label}.activity`, { positive: true, max: 100 });
    const pressure = o.pressure === undefined ? undefined : f.number(o.pressure, `${label}.pressure`, { positive: true, max: 1000 });
    const concentration = o.concentration === undefined ? undefined : concentrationOf(f, o.concentration, `${label}.concentration`);
    if (activity !== undefined && concentration) f.fail(`${label}.concentration`, 'either activity or concentration, not both');
    return { formula, phase: 'aq', field, fromLibrary: formula, activity, pressure, concentration };
  }
  const phase = f.oneOf(o.phase, `${label}.phase`, ['s', 'l', 'g', 'aq'] as const);
  const num = (k: string, opts = {}) => (o[k] === undefined ? undefined : f.number(o[k], `${label}.${k}`, { min: -1e5, max: 1e5, ...opts }));
  const sp: InlineSpecies = {
    formula,
    phase,
    dfG: num('dfG'),
    dfH: num('dfH'),
    S: num('S'),
    Cp: num('Cp'),
    activity: o.activity === undefined ? undefined : f.number(o.activity, `${label}.activity`, { positive: true, max: 100 }),
    concentration: o.concentration === undefined ? undefined : concentrationOf(f, o.concentration, `${label}.concentration`),
    pressure: o.pressure === undefined ? undefined : f.number(o.pressure, `${label}.pressure`, { positive: true, max: 1000 }),
    name: o.name === undefined ? undefined : f.string(o.name, `${label}.name`, 'a name', 200),
    source: o.source === undefined ? undefined : f.string(o.source, `${label}.source`, 'a source citation', 1000),
    field,
  };
  if (sp.activity !== undefined && sp.concentration) f.fail(`${label}.concentration`, 'either activity or concentration, not both');
  if (o.hkf !== undefined) {
    if (phase !== 'aq') f.fail(`${label}.hkf`, 'HKF parameters only on dissolved (aq) species');
    const h = f.object(o.hkf, `${label}.hkf`, HKF_KEYS);
    const get = (k: string): number => f.number(h[k], `${label}.hkf.${k}`, { min: -1e6, max: 1e6 });
    sp.hkf = { a1: get('a1'), a2: get('a2'), a3: get('a3'), a4: get('a4'), c1: get('c1'), c2: get('c2'), omega: get('omega') };
  }
  if (o.cpPolynomial !== undefined) {
    if (phase === 'aq') f.fail(`${label}.cpPolynomial`, 'a heat-capacity polynomial only on solids, liquids and gases (use hkf for aq)');
    const c = f.object(o.cpPolynomial, `${label}.cpPolynomial`, ['a', 'b', 'c']);
    const get = (k: string): number => f.number(c[k], `${label}.cpPolynomial.${k}`, { min: -1e9, max: 1e9 });
    sp.cpPolynomial = { a: get('a'), b: get('b'), c: get('c') };
  }
  if ((sp.hkf || sp.cpPolynomial) && sp.S === undefined && sp.dfH === undefined) {
    f.fail(`${label}.S`, 'S° in J/(mol·K) (or dfH) with hkf or cpPolynomial');
  }
  if (sp.concentration && phase !== 'aq') f.fail(`${label}.concentration`, 'a concentration only on dissolved (aq) species');
  if (sp.activity !== undefined && phase !== 'aq') f.fail(`${label}.activity`, 'activity only on dissolved (aq) species; use pressure for gases');
  if (sp.pressure !== undefined && phase !== 'g') f.fail(`${label}.pressure`, 'pressure only on gases (phase "g")');
  return sp;
}

/** A species concentration: a number is mol/kg; a string carries its unit. */
function concentrationOf(f: Fields, v: unknown, field: string): Amount {
  if (typeof v === 'number') return { kind: 'molality', value: f.number(v, field, { positive: true, max: 100 }) };
  const a = readAmount(f, v, field);
  if (a.kind === 'activity') f.fail(field, 'a concentration such as "1e-4 mol/kg" or "5 mg/L"', v);
  return a;
}
