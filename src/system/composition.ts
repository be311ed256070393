/**
 * The `composition` key: a bath as it is made up. A map from the main element and each ligand
 * (an element, or a neutral group such as CN, as under `ligands`) to its total amount in mol/kg of
 * water: a number (mol/kg) or a concentration string ("60 mg/L", "0.2 mol/kg", "5 g/L as Ag").
 * Its presence switches the file to composition mode, where `activity`, `concentration` and
 * `ligands` have no meaning and are refused. `ionicStrength: auto` takes the ionic strength from
 * the computed speciation itself (see src/solve/speciation/point.ts).
 */
import { isElement } from '../chem/elements.js';
import { FormulaError, parseFormula } from '../chem/formula.js';
import type { Fields } from './fields.js';
import { type Amount, checkAsHolds, readAmount } from './solution.js';

export interface CompositionSpec {
  /** Total of the main element, as written (a number is mol/kg). */
  element: Amount;
  /** Ligand key → total, as written (a number is mol/kg). */
  ligands: Record<string, Amount>;
  /** `ionicStrength: auto`: ionic strength from the speciation at each point. */
  autoIonicStrength: boolean;
  /** The user's own iso-solubility levels, mol/kg (the `solubilityLevels` key). */
  levels?: number[];
}

/** What composition mode sets in the rest of the spec: ligand groups and placeholder ligand amounts. */
export interface CompositionRead {
  composition: CompositionSpec;
  ligandGroups: Record<string, Record<string, number>>;
  /** `o` with `ionicStrength: auto` removed, for the ordinary solution settings. */
  rest: Record<string, unknown>;
}

const REFUSED = ['activity', 'concentration', 'ligands'] as const;

/** A total: a plain number is mol/kg here (not an activity); strings carry their unit. */
function readTotal(f: Fields, v: unknown, field: string): Amount {
  const a = readAmount(f, v, field);
  checkAsHolds(f, a, field.slice(field.lastIndexOf('.') + 1), field);
  return a.kind === 'activity' ? { kind: 'molality', value: a.value } : a;
}

/** The ligand key's element composition (an element maps to itself, CN to {C: 1, N: 1}). */
function groupOf(f: Fields, k: string, field: string): Record<string, number> {
  const what = 'the main element or a ligand: an element symbol (e.g. S, Cl, N) or a neutral group formula such as CN as key';
  if (isElement(k)) return { [k]: 1 };
  try {
    const g = parseFormula(k);
    if (g.charge !== 0 || Object.keys(g.elements).length < 2) f.fail(field, what, k);
    return g.elements;
  } catch (e) {
    if (e instanceof FormulaError) f.fail(field, what, k);
    throw e;
  }
}

export function readComposition(f: Fields, o: Record<string, unknown>, element: string): CompositionRead {
  for (const k of REFUSED) {
    if (o[k] !== undefined) f.fail(k, `no ${k} key in composition mode (the composition key gives the totals; remove ${k})`);
  }
  const raw = o.composition;
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) {
    f.fail('composition', `a map of the main element and each ligand → total in mol/kg, e.g. {${element}: 0.2, CN: 0.6}`, raw);
  }
  const map = raw as Record<string, unknown>;
  if (map[element] === undefined) f.fail(`composition.${element}`, `the total of the main element ${element} (mol/kg or a concentration string)`);
  const ligands: Record<string, Amount> = {};
  const ligandGroups: Record<string, Record<string, number>> = {};
  for (const [k, v] of Object.entries(map)) {
    if (k === element) continue;
    const field = `composition.${k}`;
    const comp = groupOf(f, k, field);
    for (const el of Object.keys(comp)) {
      if (el === element || el === 'H' || el === 'O') f.fail(field, 'a ligand without the main element, H or O', k);
      for (const [other, oc] of Object.entries(ligandGroups)) {
        if (oc[el]) f.fail(field, `ligands that share no element (${el} is already in ${other})`, k);
      }
    }
    ligandGroups[k] = comp;
    ligands[k] = readTotal(f, v, field);
  }
  const rest = { ...o };
  const autoI = o.ionicStrength === 'auto';
  if (autoI) {
    if (o.background !== undefined) f.fail('background', 'either ionicStrength: auto or background, not both');
    delete rest.ionicStrength;
  }
  return { composition: { element: readTotal(f, map[element], `composition.${element}`), ligands, autoIonicStrength: autoI }, ligandGroups, rest };
}
