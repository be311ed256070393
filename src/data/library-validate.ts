/**
 * Validation of one parsed species file (format: species/README.md, schema/species.schema.json).
 * Every problem throws a LibraryError naming the file and the field at fault; a valid file yields
 * its species with provenance (file, citations) and composition (elements, charge from the formula).
 * Steps: 1. file-level keys, element, sources map; 2. per entry: keys, formula and phase, values and
 * their sources (checkValues), parameter blocks, flags, alternatives; 3. the loaded species.
 */
import { parseFormula, splitPhase, FormulaError } from '../chem/formula.js';
import type { Phase } from '../model.js';
import { checkParameterBlock, HKF_FIELDS, POLY_FIELDS } from './parameter-blocks.js';
import { LibraryError, type LibrarySpecies, MIXED_FILE_ELEMENT, type SpeciesRecord, VALUE_KEYS } from './library-types.js';

const PHASES: readonly Phase[] = ['s', 'l', 'g', 'aq'];
const FILE_KEYS = new Set(['$schema', 'element', 'sources', 'species']);
const SPECIES_KEYS = new Set([
  'formula', 'phase', 'name', 'dfG', 'dfH', 'S', 'Cp', 'source', 'sources', 'recalled',
  'uncertainty', 'metastable', 'stableBelow', 'stableAbove', 'alternatives', 'note', 'aliases', 'hkf', 'cpPolynomial',
]);
const ALT_KEYS = new Set(['id', 'dfG', 'dfH', 'S', 'Cp', 'source', 'sources', 'recalled', 'uncertainty', 'note']);
const ELEMENT_RE = /^[A-Z][a-z]?$/;
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
  // Step 1: the file's own fields.
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

  // Step 2–3: each entry checked and loaded.
  return (d.species as unknown[]).map((raw, i) => checkEntry(file, i, raw, sourceMap, mixed));
}

/** Checks entry `i` of a file and returns it as a loaded species (step 2–3 of the module comment). */
function checkEntry(file: string, i: number, raw: unknown, sourceMap: Readonly<Record<string, string>>, mixed: boolean): LibrarySpecies {
  const fail = (field: string, msg: string): never => {
    throw new LibraryError(file, field, msg);
  };
  let at = `species[${i}]`;
  if (!isObject(raw)) fail(at, 'must be an object');
  const o = raw as Record<string, unknown>;
  if (typeof o.formula === 'string') at = `species[${i}] (${o.formula})`;
  for (const k of Object.keys(o)) if (!SPECIES_KEYS.has(k)) fail(`${at}.${k}`, 'unknown field');
  if (!isText(o.formula)) fail(`${at}.formula`, 'required, a formula such as "Fe^2+"');
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
  for (const k of ['stableBelow', 'stableAbove'] as const) {
    const v = o[k];
    if (v !== undefined && (typeof v !== 'number' || !Number.isFinite(v) || v < 0 || v > 350)) fail(`${at}.${k}`, 'a temperature in °C from 0 to 350');
  }
  if (o.metastable === true && (o.stableBelow !== undefined || o.stableAbove !== undefined)) fail(`${at}.metastable`, 'not together with stableBelow/stableAbove (those already say where the species is metastable)');
  if (o.aliases !== undefined) {
    if (!Array.isArray(o.aliases) || !o.aliases.every(isText)) fail(`${at}.aliases`, 'must be an array of non-empty strings');
  }
  if (o.alternatives !== undefined) checkAlternatives(file, at, o.alternatives, sourceMap);
  if (mixed && Object.keys(parsed.elements).filter((e) => e !== 'H' && e !== 'O').length < 2) {
    fail(`${at}.formula`, 'a compound of two or more elements other than H and O (this is a "mixed" file)');
  }
  const rec = o as unknown as SpeciesRecord;
  const valueSourceText = rec.sources
    ? Object.fromEntries(Object.entries(rec.sources).map(([k, v]) => [k, sourceMap[v as string]!]))
    : undefined;
  return {
    ...rec,
    file,
    sourceText: sourceMap[rec.source]!,
    ...(valueSourceText ? { valueSourceText } : {}),
    sourceMap,
    elements: parsed.elements,
    charge: parsed.charge,
    ...(mixed ? { mixed: true as const } : {}),
  };
}

/** Checks an entry's `alternatives` array (`at` names the entry in messages). */
function checkAlternatives(file: string, at: string, alternatives: unknown, sourceMap: Readonly<Record<string, string>>): void {
  const fail = (field: string, msg: string): never => {
    throw new LibraryError(file, field, msg);
  };
  if (!Array.isArray(alternatives)) fail(`${at}.alternatives`, 'must be an array');
  const ids = new Set<string>();
  (alternatives as unknown[]).forEach((a, j) => {
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
