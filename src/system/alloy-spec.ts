/**
 * System files with several main elements (issue 18): the key `elements` maps each main element to
 * its mole fraction in the alloy, instead of `element`:
 *
 *   elements: {Fe: 0.70, Cr: 0.18, Ni: 0.12}
 *   activity: 1e-6                      # threshold of every element's dissolved species, or
 *   activity: {Fe: 1e-6, Cr: 1e-8, Ni: 1e-6}   # one per element (every element named)
 *
 * Rules: 1–6 elements, symbols other than H and O and not also ligands; each amount a positive
 * number. Amounts are proportions, always divided by their sum; when they do not sum to 1 within
 * 1e-6 (e.g. atom percent {Fe: 70, Cr: 18, Ni: 12}) a note says they were normalised. Every other
 * key (temperature, ligands, pH, E, exclude, pick, gases, ...) means what it means for one element
 * and is validated by readSpec; `species` (inline data) and `concentration` are not accepted with
 * `elements` yet (a clear error, not a silent fallback).
 */
import { isElement } from '../chem/elements.js';
import { Fields } from './fields.js';
import { readSpec, type SystemSpec } from './spec.js';

export interface AlloySpec {
  /** The common keys, validated as for one element (its `element`/`activity` are the first element's). */
  base: SystemSpec;
  /** Main element → mole fraction (normalised, sums to 1), in the file's order. */
  composition: Record<string, number>;
  /** Main element → threshold activity of its dissolved species. */
  activities: Record<string, number>;
  /** True where `activity` was not given (default 1e-6 for every element). */
  activityIsDefault: boolean;
  warnings: string[];
}

export const MAX_ALLOY_ELEMENTS = 6;
const DEFAULT_ACTIVITY = 1e-6;

/** True when parsed system-file data use `elements` (several main elements). */
export function isAlloyData(data: unknown): boolean {
  return typeof data === 'object' && data !== null && !Array.isArray(data) && (data as Record<string, unknown>).elements !== undefined;
}

export function readAlloySpec(data: unknown, file: string): AlloySpec {
  const f = new Fields(file);
  if (!isAlloyData(data)) f.fail('elements', 'a map of main element → mole fraction, e.g. {Fe: 0.7, Cr: 0.18, Ni: 0.12}');
  const o = data as Record<string, unknown>;
  if (o.element !== undefined) f.fail('element', 'either element (one main element) or elements (several), not both', o.element);
  if (o.species !== undefined) f.fail('species', 'no inline species with elements yet (the built-in library is used); leave the key out', o.species);
  if (o.concentration !== undefined) f.fail('concentration', 'a threshold activity (activity) with elements; concentrations are not supported there yet', o.concentration);
  const raw = o.elements;
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) f.fail('elements', 'a map of main element → mole fraction, e.g. {Fe: 0.7, Cr: 0.18, Ni: 0.12}', raw);
  const entries = Object.entries(raw as Record<string, unknown>);
  if (entries.length === 0 || entries.length > MAX_ALLOY_ELEMENTS) f.fail('elements', `1 to ${MAX_ALLOY_ELEMENTS} main elements`, raw);
  const ligandKeys = o.ligands && typeof o.ligands === 'object' && !Array.isArray(o.ligands) ? Object.keys(o.ligands) : [];
  const amounts: Record<string, number> = {};
  for (const [el, v] of entries) {
    if (!isElement(el)) f.fail(`elements.${el}`, 'an element symbol such as "Fe" as key (case matters)', el);
    if (el === 'H' || el === 'O') f.fail(`elements.${el}`, 'an element other than H or O (water is always present)', el);
    if (ligandKeys.includes(el)) f.fail(`ligands.${el}`, 'a ligand that is not also a main element under elements', el);
    amounts[el] = f.number(v, `elements.${el}`, { positive: true, max: 1e6 });
  }
  const warnings: string[] = [];
  const total = Object.values(amounts).reduce((s, x) => s + x, 0);
  if (Math.abs(total - 1) > 1e-6) warnings.push(`elements: the amounts sum to ${total}, not 1; normalised to mole fractions`);
  const composition = Object.fromEntries(Object.entries(amounts).map(([e, x]) => [e, x / total]));
  const els = Object.keys(composition);

  // Threshold activities: one number for all, or one per element.
  const activities: Record<string, number> = {};
  const act = o.activity;
  if (act !== null && typeof act === 'object' && !Array.isArray(act)) {
    const a = f.object(act, 'activity', els);
    for (const e of els) {
      if (a[e] === undefined) f.fail(`activity.${e}`, `the threshold activity of dissolved ${e} (every element under elements needs one)`);
      activities[e] = f.number(a[e], `activity.${e}`, { positive: true, max: 100 });
    }
  } else {
    const a = f.optNumber(act, 'activity', DEFAULT_ACTIVITY, { positive: true, max: 100 });
    for (const e of els) activities[e] = a;
  }
  // Every other key as for one element: the first element stands in for `element`.
  const { elements: _e, activity: _a, ...rest } = o;
  const base = readSpec({ ...rest, element: els[0], activity: activities[els[0]] }, file);
  for (const k of Object.keys(base.ligandGroups)) {
    for (const el of Object.keys(base.ligandGroups[k])) {
      if (els.includes(el)) f.fail(`ligands.${k}`, 'a ligand without any main element under elements, H or O', k);
    }
  }
  return { base, composition, activities, activityIsDefault: act === undefined, warnings: [...warnings, ...base.warnings] };
}
