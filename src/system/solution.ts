/**
 * The aqueous solution at T: water properties (IAPWS), ionic strength (given, or from a background
 * electrolyte), the activity-coefficient model, and how amounts given in the system file become
 * activities: an activity is used as is; a concentration (mol/kg, or mg/L via the molar mass) is
 * multiplied by γ(z) at the ionic strength. The top-level default threshold (10⁻⁶, when `activity`
 * is not set) counts as a molality once an ionic strength is given, so that it is corrected too.
 */
import { molarMass, parseFormula } from '../chem/formula.js';
import { KELVIN } from '../thermo/constants.js';
import { activityModel, type ActivityModelName, backgroundElectrolyte, debyeHuckelParameters, ionicStrength, mgPerLitreToMolal } from '../thermo/activity.js';
import { type WaterState, waterState } from '../thermo/water.js';
import { InputError } from './errors.js';
import { Fields } from './fields.js';

/** An amount as written in a file: an activity (plain number) or a concentration with a unit. */
export interface Amount {
  kind: 'activity' | 'molality' | 'mg/L';
  value: number;
  /** For mg/L: the formula whose molar mass converts it (the element, "as Fe", or the species). */
  as?: string;
}

export interface SolutionSettings {
  model: ActivityModelName;
  ionicStrength: number;
  /** How the ionic strength was obtained, for reports. */
  ionicStrengthFrom: string;
  ionSize: number;
}

export interface SolutionAtT {
  water: WaterState;
  A: number;
  B: number;
  settings: SolutionSettings;
  logGamma: (z: number) => number;
  warnings: string[];
}

/** Salts for `background`, as ions (charge, count). Formula units; common practice. */
const SALTS: Record<string, [number, number][]> = {
  NaCl: [[1, 1], [-1, 1]],
  KCl: [[1, 1], [-1, 1]],
  NaNO3: [[1, 1], [-1, 1]],
  KNO3: [[1, 1], [-1, 1]],
  NaClO4: [[1, 1], [-1, 1]],
  NH4Cl: [[1, 1], [-1, 1]],
  NaHCO3: [[1, 1], [-1, 1]],
  NaOH: [[1, 1], [-1, 1]],
  KOH: [[1, 1], [-1, 1]],
  Na2SO4: [[1, 2], [-2, 1]],
  K2SO4: [[1, 2], [-2, 1]],
  '(NH4)2SO4': [[1, 2], [-2, 1]],
  Na2CO3: [[1, 2], [-2, 1]],
  CaCl2: [[2, 1], [-1, 2]],
  MgCl2: [[2, 1], [-1, 2]],
  MgSO4: [[2, 1], [-2, 1]],
  CuSO4: [[2, 1], [-2, 1]],
  ZnSO4: [[2, 1], [-2, 1]],
  NiSO4: [[2, 1], [-2, 1]],
  ZnCl2: [[2, 1], [-1, 2]],
  NiCl2: [[2, 1], [-1, 2]],
};

/** "<number> <unit> [as <formula>]"; the formula may be a hydrate written with ·, . or * (CuSO4·5H2O). */
const AMOUNT_RE = /^\s*([0-9.]+(?:[eE][-+]?\d+)?)\s*(mol\/kg|mmol\/kg|mg\/L|mg\/l|g\/L|g\/l|ppm)\s*(?:as\s+([A-Za-z0-9()+\-·.*]+))?\s*$/;

/** Read an amount: a number is an activity; "1e-4 mol/kg", "5 mg/L", "5 mg/L as Fe" are concentrations. */
export function readAmount(f: Fields, v: unknown, field: string): Amount {
  if (typeof v === 'number') {
    f.number(v, field, { positive: true, max: 100 });
    return { kind: 'activity', value: v };
  }
  const what = 'an activity (number) or a concentration such as "1e-4 mol/kg" or "5 mg/L" (optionally "as Fe")';
  if (typeof v !== 'string') f.fail(field, what, v);
  const m = AMOUNT_RE.exec(v as string);
  if (!m) f.fail(field, what, v);
  const x = Number(m![1]);
  if (!(x > 0) || !Number.isFinite(x)) f.fail(field, `${what}, greater than 0`, v);
  const unit = m![2].toLowerCase();
  const as = m![3];
  if (as) {
    try {
      parseFormula(as);
    } catch {
      f.fail(field, `a formula after "as" (e.g. "as Fe")`, as);
    }
  }
  let a: Amount;
  if (unit === 'mol/kg') a = { kind: 'molality', value: x };
  else if (unit === 'mmol/kg') a = { kind: 'molality', value: x / 1000 };
  else if (unit === 'g/l') a = { kind: 'mg/L', value: x * 1000, as };
  else a = { kind: 'mg/L', value: x, as }; // mg/L, ppm (dilute water: 1 ppm ≈ 1 mg/L)
  // The same bounds as a plain number: at most 100 mol/kg; by mass at most 1e6 mg/L (1 kg/L).
  if (a.kind === 'molality' && a.value > MAX_MOLALITY) f.fail(field, `a concentration of at most ${MAX_MOLALITY} mol/kg`, v);
  if (a.kind === 'mg/L' && a.value > MAX_MG_PER_L) f.fail(field, `a concentration of at most ${MAX_MG_PER_L} mg/L (1 kg/L)`, v);
  return a;
}

/** Upper bounds of a concentration given as text: the molality bound of a plain number, and by mass 1 kg/L. */
export const MAX_MOLALITY = 100;
export const MAX_MG_PER_L = 1e6;

export function readSolutionSettings(f: Fields, o: Record<string, unknown>): SolutionSettings {
  let I = 0;
  let from = 'not given (ideal solution)';
  if (o.ionicStrength !== undefined && o.background !== undefined) {
    f.fail('background', 'either ionicStrength or background, not both');
  }
  if (o.ionicStrength !== undefined) {
    I = f.number(o.ionicStrength, 'ionicStrength', { min: 0, max: 10 });
    from = 'given';
  }
  if (o.background !== undefined) {
    const parts: string[] = [];
    for (const [k, v] of f.entries(o.background, 'background', 'a map of salt or ion → mol/kg, e.g. {NaCl: 0.5}')) {
      const m = f.number(v, `background.${k}`, { min: 0, max: 10 });
      const salt = Object.hasOwn(SALTS, k) ? SALTS[k] : undefined;
      if (salt) {
        I += backgroundElectrolyte(salt.map(([charge, count]) => ({ charge, count })), m);
      } else {
        let z = 0;
        try {
          z = parseFormula(k).charge;
        } catch {
          z = 0;
        }
        if (z === 0) f.fail(`background.${k}`, `a salt (${Object.keys(SALTS).join(', ')}) or an ion with its charge (e.g. Na+, SO4-2)`, k);
        I += ionicStrength([{ charge: z, molality: m }]);
      }
      parts.push(`${m} mol/kg ${k}`);
    }
    from = `background ${parts.join(' + ')}`;
  }
  const given = o.ionicStrength !== undefined || o.background !== undefined;
  const model = o.activityModel === undefined ? (given ? 'davies' : 'ideal') : f.oneOf(o.activityModel, 'activityModel', ['davies', 'debye-huckel', 'ideal'] as const);
  const ionSize = f.optNumber(o.ionSize, 'ionSize', 4, { min: 1, max: 12 });
  return { model, ionicStrength: I, ionicStrengthFrom: from, ionSize };
}

export function solutionAt(file: string, celsius: number, pressureMPa: number | undefined, s: SolutionSettings): SolutionAtT {
  let water: WaterState;
  try {
    water = waterState(celsius, pressureMPa);
  } catch (e) {
    throw new InputError(file, pressureMPa !== undefined ? 'pressure' : 'temperature', (e as Error).message.replace(/^[^:]*:\s*/, ''));
  }
  const { A, B } = debyeHuckelParameters(celsius + KELVIN, water.density, water.permittivity);
  const m = activityModel(s.model, { ionicStrength: s.ionicStrength, A, B, ionSizeAngstrom: s.ionSize });
  return { water, A, B, settings: s, logGamma: (z) => m.logGamma(z), warnings: m.warnings };
}

/**
 * How many units of `unit` (an element, a group such as CN, or a species' formula) one formula unit
 * of `as` holds: the least over the unit's elements of count in `as` / count in `unit`, rounded
 * down — 2 for CN in Zn(CN)2, 1 for C in HCO3, 2 for N in NH4NO3. At least 1, so that a species'
 * concentration given "as Fe" keeps meaning one species per Fe atom.
 */
export function unitsPerFormula(as: string, unit: string): number {
  const a = parseFormula(as).elements;
  const u = Object.entries(parseFormula(unit).elements);
  const n = Math.min(...u.map(([el, k]) => Math.floor((a[el] ?? 0) / k)));
  return Number.isFinite(n) && n >= 1 ? n : 1;
}

/**
 * Refuses an amount of `component` (the element, or a ligand such as Cl or CN) given "as" a formula
 * that holds none of it ("20 mg/L as Fe" for chloride), which no conversion can make sense of.
 */
export function checkAsHolds(f: Fields, a: Amount, component: string, field: string): void {
  if (a.as === undefined) return;
  const have = parseFormula(a.as).elements;
  const need = Object.entries(parseFormula(component).elements);
  if (need.some(([el, k]) => (have[el] ?? 0) < k)) f.fail(field, `a formula holding ${component} after "as" (e.g. "as ${component}")`, a.as);
}

/**
 * Molality of an amount given as mg/L: of the fallback formula (the element, the ligand or the
 * species), with the molar mass of `as` when given times the units of the fallback that one `as`
 * holds — 60 g/L as Zn(CN)2 is 60/117.4 mol/L of Zn but twice that of CN.
 */
export function molality(a: Amount, fallbackFormula: string, densityKgM3: number): number {
  if (a.kind === 'molality') return a.value;
  const per = a.as === undefined ? 1 : unitsPerFormula(a.as, fallbackFormula);
  return per * mgPerLitreToMolal(a.value, molarMass(parseFormula(a.as ?? fallbackFormula)), densityKgM3);
}
