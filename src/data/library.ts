/**
 * The built-in species library: loading, validation and look-up of the JSON files in species/.
 *
 * File format (one file per element, see species/README.md and schema/species.schema.json):
 *   { "$schema"?, "element", "sources": { key: citation }, "species": [ SpeciesRecord, ... ] }
 * A file whose `element` is "mixed" (species/mixed.json) holds compounds of two or more elements
 * other than H and O (spinels such as FeCr2O4, delafossite CuFeO2): they are marked `mixed` and enter
 * only systems with several main elements (speciesForElements), never a one-element system.
 * Units: ΔfG°, ΔfH° in kJ/mol; S°, Cp° in J/(mol·K); 298.15 K, 1 bar; aqueous ions on the
 * conventional scale (H+(aq): ΔfG° = ΔfH° = S° = Cp° = 0).
 *
 * Every file is validated when loaded; any problem throws a LibraryError naming the file and field.
 * This module only reads and checks data: it computes no thermodynamics.
 */
import { EXIT, EphmapError, type ExitStatus } from '../errors.js';
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseFormula, splitPhase, sameFormula, FormulaError } from '../chem/formula.js';
import type { Phase } from '../model.js';
import { checkParameterBlock, type CpPolynomialRecord, HKF_FIELDS, type HkfRecord, POLY_FIELDS } from './parameter-blocks.js';
export type { CpPolynomialRecord, HkfRecord } from './parameter-blocks.js';

/** The thermodynamic values one compilation gives for a species. */
export interface SpeciesValues {
  /** Standard Gibbs energy of formation, kJ/mol (required). */
  dfG: number;
  /** Standard enthalpy of formation, kJ/mol. */
  dfH?: number;
  /** Standard (or conventional partial molar, for ions) entropy, J/(mol·K). */
  S?: number;
  /** Standard heat capacity, J/(mol·K). */
  Cp?: number;
}

export type ValueKey = keyof SpeciesValues;
export const VALUE_KEYS: readonly ValueKey[] = ['dfG', 'dfH', 'S', 'Cp'];

/** Another compilation's values for the same species (the main entry is the default). */
export interface SpeciesAlternative extends SpeciesValues {
  id: string;
  /** Key of the file's `sources` map. */
  source: string;
  sources?: Partial<Record<ValueKey, string>>;
  recalled?: boolean;
  uncertainty?: Partial<Record<ValueKey, number>>;
  note?: string;
}

/** One species entry exactly as written in a species file. */
export interface SpeciesRecord extends SpeciesValues {
  /** Formula in ephmap notation without phase tag, e.g. `Fe+2`, `Fe(OH)2+`, `HFeO2-`. */
  formula: string;
  phase: Phase;
  name: string;
  /** Key of the file's `sources` map. */
  source: string;
  /** Per-value source overrides, e.g. { "Cp": "CODATA89" }. */
  sources?: Partial<Record<ValueKey, string>>;
  /** True where the values were recalled rather than read from the source. */
  recalled?: boolean;
  /** Standard uncertainties where the source gives them (kJ/mol or J/(mol·K)). */
  uncertainty?: Partial<Record<ValueKey, number>>;
  /** Excluded from systems unless metastable phases are asked for. */
  metastable?: boolean;
  alternatives?: SpeciesAlternative[];
  note?: string;
  aliases?: string[];
  /** Revised HKF parameters (aqueous species), tabulated units (see src/thermo/hkf.ts). */
  hkf?: HkfRecord;
  /** Maier–Kelley heat capacity a + bT + cT⁻², J/(mol·K) (solids, liquids, gases). */
  cpPolynomial?: CpPolynomialRecord;
}

/** A whole species file. */
export interface SpeciesFile {
  $schema?: string;
  element: string;
  sources: Record<string, string>;
  species: SpeciesRecord[];
}

/** A species of the loaded library: the file's fields plus where it came from and its composition. */
export interface LibrarySpecies extends SpeciesRecord {
  /** Basename of the file it came from, e.g. `Fe.json`. */
  file: string;
  /** Full citation of `source`, resolved from the file's `sources` map. */
  sourceText: string;
  /** Citation per value where `sources` overrides the main source. */
  valueSourceText?: Partial<Record<ValueKey, string>>;
  /** The file's whole `sources` map (used to resolve alternatives). */
  sourceMap: Readonly<Record<string, string>>;
  /** Element → atom count, from parseFormula. */
  elements: Record<string, number>;
  /** Charge number, from parseFormula. */
  charge: number;
  /** Id of the alternative whose values this copy carries (set by pickAlternative). */
  alternative?: string;
  /** From a file whose `element` is "mixed": enters only systems with several main elements. */
  mixed?: true;
}

/** A species file (or the library as a whole) breaks the format (input error, exit status 2). */
export class LibraryError extends EphmapError {
  readonly code = 'library';
  readonly exitStatus: ExitStatus = EXIT.input;
  readonly file: string;
  readonly field: string;
  constructor(file: string, field: string, message: string) {
    super(`species library ${file}: ${field}: ${message}`);
    this.name = 'LibraryError';
    this.file = file;
    this.field = field;
  }
}

const PHASES: readonly Phase[] = ['s', 'l', 'g', 'aq'];
const FILE_KEYS = new Set(['$schema', 'element', 'sources', 'species']);
const SPECIES_KEYS = new Set([
  'formula', 'phase', 'name', 'dfG', 'dfH', 'S', 'Cp', 'source', 'sources', 'recalled',
  'uncertainty', 'metastable', 'alternatives', 'note', 'aliases', 'hkf', 'cpPolynomial',
]);
const ALT_KEYS = new Set(['id', 'dfG', 'dfH', 'S', 'Cp', 'source', 'sources', 'recalled', 'uncertainty', 'note']);
const ELEMENT_RE = /^[A-Z][a-z]?$/;
/** The `element` of a file of compounds of several elements (see the module comment). */
export const MIXED_FILE_ELEMENT = 'mixed';
const KEY_RE = /^[A-Za-z][A-Za-z0-9_-]*$/;

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const isText = (v: unknown): v is string => typeof v === 'string' && v.trim().length > 0;

/** Checks the fields shared by species entries and alternatives. `at` names the entry in messages. */
function checkValues(
  file: string,
  at: string,
  o: Record<string, unknown>,
  sources: Record<string, string>,
): void {
  const fail = (field: string, msg: string): never => {
    throw new LibraryError(file, `${at}.${field}`, msg);
  };
  if (!isNum(o.dfG)) fail('dfG', 'required, a finite number in kJ/mol');
  for (const k of ['dfH', 'S', 'Cp'] as const) {
    if (o[k] !== undefined && !isNum(o[k])) fail(k, 'must be a finite number');
  }
  if (!isText(o.source)) fail('source', 'required, a key of the file\'s "sources" map');
  if (!Object.prototype.hasOwnProperty.call(sources, o.source as string)) {
    fail('source', `"${String(o.source)}" is not a key of the file's "sources" map`);
  }
  if (o.sources !== undefined) {
    if (!isObject(o.sources)) fail('sources', 'must be an object { value: source key }');
    for (const [k, v] of Object.entries(o.sources as Record<string, unknown>)) {
      if (!(VALUE_KEYS as readonly string[]).includes(k)) fail(`sources.${k}`, `unknown value; use one of ${VALUE_KEYS.join(', ')}`);
      if (typeof v !== 'string' || !Object.prototype.hasOwnProperty.call(sources, v)) {
        fail(`sources.${k}`, `"${String(v)}" is not a key of the file's "sources" map`);
      }
      if (o[k] === undefined) fail(`sources.${k}`, `names a source for ${k}, which the entry does not give`);
    }
  }
  if (o.recalled !== undefined && typeof o.recalled !== 'boolean') fail('recalled', 'must be true or false');
  if (o.uncertainty !== undefined) {
    if (!isObject(o.uncertainty)) fail('uncertainty', 'must be an object { value: number }');
    for (const [k, v] of Object.entries(o.uncertainty as Record<string, unknown>)) {
      if (!(VALUE_KEYS as readonly string[]).includes(k)) fail(`uncertainty.${k}`, `unknown value; use one of ${VALUE_KEYS.join(', ')}`);
      if (!isNum(v) || v <= 0) fail(`uncertainty.${k}`, 'must be a positive number');
    }
  }
  if (o.note !== undefined && !isText(o.note)) fail('note', 'must be a non-empty string');
}

/**
 * Validates one parsed species file and returns its species with provenance and composition.
 * Throws LibraryError naming the file and the field at fault.
 */
export function validateSpeciesFile(file: string, data: unknown): LibrarySpecies[] {
  const fail = (field: string, msg: string): never => {
    throw new LibraryError(file, field, msg);
  };
  if (!isObject(data)) fail('(file)', 'must be a JSON object');
  const d = data as Record<string, unknown>;
  for (const k of Object.keys(d)) if (!FILE_KEYS.has(k)) fail(k, 'unknown field');
  if (d.$schema !== undefined && typeof d.$schema !== 'string') fail('$schema', 'must be a string');
  const mixed = d.element === MIXED_FILE_ELEMENT;
  if (typeof d.element !== 'string' || !(mixed || ELEMENT_RE.test(d.element))) fail('element', 'required, an element symbol such as "Fe" (or "mixed" for compounds of several elements)');
  if (!isObject(d.sources) || Object.keys(d.sources).length === 0) fail('sources', 'required, a non-empty object { key: citation }');
  const sources = d.sources as Record<string, unknown>;
  for (const [k, v] of Object.entries(sources)) {
    if (!KEY_RE.test(k)) fail(`sources.${k}`, 'key must start with a letter and hold only letters, digits, "_" or "-"');
    if (!isText(v)) fail(`sources.${k}`, 'must be a non-empty citation');
  }
  const sourceMap = Object.freeze({ ...(sources as Record<string, string>) });
  if (!Array.isArray(d.species) || d.species.length === 0) fail('species', 'required, a non-empty array');

  const out: LibrarySpecies[] = [];
  (d.species as unknown[]).forEach((raw, i) => {
    let at = `species[${i}]`;
    if (!isObject(raw)) fail(at, 'must be an object');
    const o = raw as Record<string, unknown>;
    if (typeof o.formula === 'string') at = `species[${i}] (${o.formula})`;
    for (const k of Object.keys(o)) if (!SPECIES_KEYS.has(k)) fail(`${at}.${k}`, 'unknown field');
    if (!isText(o.formula)) fail(`${at}.formula`, 'required, a formula such as "Fe+2"');
    const formula = o.formula as string;
    if (splitPhase(formula).phase !== undefined) fail(`${at}.formula`, 'must not carry a phase tag; put it in "phase"');
    let parsed;
    try {
      parsed = parseFormula(formula);
    } catch (e) {
      if (e instanceof FormulaError) fail(`${at}.formula`, e.message);
      throw e;
    }
    if (!PHASES.includes(o.phase as Phase)) fail(`${at}.phase`, `required, one of ${PHASES.join(', ')}`);
    if (parsed.charge !== 0 && o.phase !== 'aq') fail(`${at}.phase`, 'a charged species must be "aq"');
    if (!isText(o.name)) fail(`${at}.name`, 'required, a non-empty string');
    checkValues(file, at, o, sourceMap);
    if (o.hkf !== undefined) {
      if (o.phase !== 'aq') fail(`${at}.hkf`, 'only aqueous species take HKF parameters');
      checkParameterBlock(o.hkf, HKF_FIELDS, sourceMap, (f, m) => fail(f ? `${at}.hkf.${f}` : `${at}.hkf`, m));
    }
    if (o.cpPolynomial !== undefined) {
      if (o.phase === 'aq') fail(`${at}.cpPolynomial`, 'aqueous species take "hkf" parameters, not a heat-capacity polynomial');
      checkParameterBlock(o.cpPolynomial, POLY_FIELDS, sourceMap, (f, m) => fail(f ? `${at}.cpPolynomial.${f}` : `${at}.cpPolynomial`, m));
    }
    if (o.metastable !== undefined && typeof o.metastable !== 'boolean') fail(`${at}.metastable`, 'must be true or false');
    if (o.aliases !== undefined) {
      if (!Array.isArray(o.aliases) || !o.aliases.every(isText)) fail(`${at}.aliases`, 'must be an array of non-empty strings');
    }
    if (o.alternatives !== undefined) {
      if (!Array.isArray(o.alternatives)) fail(`${at}.alternatives`, 'must be an array');
      const ids = new Set<string>();
      (o.alternatives as unknown[]).forEach((a, j) => {
        const aat = `${at}.alternatives[${j}]`;
        if (!isObject(a)) fail(aat, 'must be an object');
        const ao = a as Record<string, unknown>;
        for (const k of Object.keys(ao)) if (!ALT_KEYS.has(k)) fail(`${aat}.${k}`, 'unknown field');
        if (!isText(ao.id) || !KEY_RE.test(ao.id as string)) fail(`${aat}.id`, 'required, a short identifier such as "PK95"');
        if (ids.has(ao.id as string)) fail(`${aat}.id`, `duplicate alternative id "${String(ao.id)}"`);
        ids.add(ao.id as string);
        checkValues(file, aat, ao, sourceMap);
      });
    }
    if (mixed && Object.keys(parsed.elements).filter((e) => e !== 'H' && e !== 'O').length < 2) {
      fail(`${at}.formula`, 'a compound of two or more elements other than H and O (this is a "mixed" file)');
    }
    const rec = o as unknown as SpeciesRecord;
    const valueSourceText = rec.sources
      ? Object.fromEntries(Object.entries(rec.sources).map(([k, v]) => [k, sourceMap[v as string]!]))
      : undefined;
    out.push({
      ...rec,
      file,
      sourceText: sourceMap[rec.source]!,
      ...(valueSourceText ? { valueSourceText } : {}),
      sourceMap,
      elements: parsed.elements,
      charge: parsed.charge,
      ...(mixed ? { mixed: true as const } : {}),
    });
  });
  return out;
}

function deepFreeze<T>(o: T): T {
  if (typeof o === 'object' && o !== null && !Object.isFrozen(o)) {
    Object.freeze(o);
    for (const v of Object.values(o as Record<string, unknown>)) deepFreeze(v);
  }
  return o;
}

/** The package's species/ folder, found relative to this module (works from src/ and dist/). */
export function defaultSpeciesDir(): string {
  return fileURLToPath(new URL('../../species/', import.meta.url));
}

const cache = new Map<string, readonly LibrarySpecies[]>();

/**
 * Loads and validates every *.json file of `dir` (default: the package's species/ folder), pooling
 * their species. The result is cached per folder; species objects are frozen (use pickAlternative
 * for a modified copy). Throws LibraryError on any invalid file, on a formula+phase present twice,
 * or when the folder holds no species file.
 */
export function loadLibrary(dir?: string): LibrarySpecies[] {
  const folder = resolve(dir ?? defaultSpeciesDir());
  const hit = cache.get(folder);
  if (hit) return [...hit];
  let names: string[];
  try {
    names = readdirSync(folder).filter((n) => n.endsWith('.json')).sort();
  } catch (e) {
    throw new LibraryError(folder, '(folder)', `cannot read: ${(e as Error).message}`);
  }
  if (names.length === 0) throw new LibraryError(folder, '(folder)', 'holds no species file (*.json)');
  const all: LibrarySpecies[] = [];
  const seen = new Map<string, string>();
  for (const name of names) {
    const file = basename(name);
    let data: unknown;
    try {
      data = JSON.parse(readFileSync(join(folder, name), 'utf8'));
    } catch (e) {
      throw new LibraryError(file, '(file)', `not valid JSON: ${(e as Error).message}`);
    }
    for (const sp of validateSpeciesFile(file, data)) {
      const key = `${sp.formula}(${sp.phase})`;
      const prev = seen.get(key);
      if (prev !== undefined) {
        throw new LibraryError(file, `species ${key}`, `already defined in ${prev}; give other compilations as "alternatives"`);
      }
      seen.set(key, file);
      all.push(deepFreeze(sp));
    }
  }
  cache.set(folder, all);
  return [...all];
}

/** Forgets cached libraries (for tests and for tools that edit species files). */
export function clearLibraryCache(): void {
  cache.clear();
}

/** Phase preference when a formula without phase tag matches several entries (e.g. H2O, CO2, H2S). */
const PHASE_PREFERENCE: readonly Phase[] = ['s', 'l', 'aq', 'g'];

/**
 * All species matching `key`: by formula, with or without phase tag (`Fe2O3`, `Fe2O3(s)`,
 * `Fe+2(aq)`; exact text first, else same composition and charge), otherwise by name or alias
 * (case-insensitive, surrounding whitespace ignored). Formula matches are ordered by phase
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
    (s) => s.name.toLowerCase() === lower || (s.aliases ?? []).some((a) => a.trim().toLowerCase() === lower),
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
}

/**
 * The species of the system {element, ligands, H, O}: every library species whose elements are all
 * within that set and which contains the main element or a ligand element. Water's own species
 * (only H and O) and compounds of the "mixed" file are not returned. Metastable species are left out
 * unless opts.metastable is true.
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
    if (s.metastable && !opts.metastable) return false;
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
