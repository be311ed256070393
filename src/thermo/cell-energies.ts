/**
 * Reaction energies of the `cell` calculator at one temperature: ΔrG, ΔrH, ΔrS and ΔrCp of the
 * resolved species (net coefficients ν, products positive; H⁺ and e⁻ zero on the conventional scale).
 *
 *   ΔrX(T) = Σ ν_i X_i(T)   for X = G (apparent), H (apparent), S, Cp
 *
 * Modes:
 *   'best' (default) — each species' own model (the resolver's `propertiesAt`, system/carry.ts:
 *     IAPWS for H2O(l), revised HKF for aqueous species, Maier–Kelley or constant Cp otherwise);
 *     when some species have no model (a caller's own lookup), 'cp' for the reaction, with a warning.
 *   'cp', 'constant-h-s' — the constant-Cp or constant ΔH/ΔS forms for every species (thermo/gibbs.ts);
 *     where some S° are missing, the reaction-level route ΔrS° = (ΔrH° − ΔrG°)/T_r.
 * Units: kJ/mol for G and H, J/(mol·K) for S and Cp. Validity: the species models' 0–300 °C (liquid
 * water path: 1 atm below 100 °C, saturation pressure above). Worked example (test): H2O(l) = H⁺ + OH⁻
 * at 25 °C gives ΔrG = 79.89 kJ/mol, log K = −14.00 (IAPWS R11-07 pKw 13.995).
 * Reference: Helgeson, Kirkham & Flowers, Am. J. Sci. 281 (1981) 1249 (apparent convention).
 */
import { ReactionError } from '../chem/reaction-parse.js';
import { KELVIN, T_REF } from './constants.js';
import { apparentG, apparentH, entropyAt, type Extrapolation } from './gibbs.js';

/** A species' properties at T by its own temperature model (from the resolver). */
export interface SpeciesAtT {
  /** Apparent G, kJ/mol; undefined where the species cannot be carried to T. */
  G?: number;
  /** Apparent H, kJ/mol (where ΔfH° is known). */
  H?: number;
  /** S and Cp at T, J/(mol·K). */
  S?: number;
  Cp?: number;
  /** The temperature model used (system/carry.ts labels). */
  model: string;
  estimated: boolean;
}

export interface EnergyInput {
  nu: number;
  name: string;
  data: { dfG: number; dfH?: number; S?: number; Cp?: number; propertiesAt?: (celsius: number) => SpeciesAtT };
}

export type CellExtrapolation = Extrapolation | 'best';

export interface Energies {
  dG: number;
  dH: number | null;
  dS: number | null;
  dCp: number | null;
}

/** Sum of ν·x over the species, null when any x is missing. */
function sum(items: readonly { nu: number; x: number | undefined }[]): number | null {
  let s = 0;
  for (const { nu, x } of items) {
    if (x === undefined || !Number.isFinite(x)) return null;
    s += nu * x;
  }
  return s;
}

/** Step 1 ('best'): each species by its own model (every species has `propertiesAt`). */
function bestEnergies(rs: readonly EnergyInput[], reaction: string, celsius: number, warnings: string[]): Energies {
  const T = celsius + KELVIN;
  const at25 = Math.abs(T - T_REF) < 1e-9;
  const rows: SpeciesAtT[] = [];
  const estimated: string[] = [];
  for (const r of rs) {
    let p: SpeciesAtT;
    try {
      p = r.data.propertiesAt!(celsius);
    } catch (e) {
      if (e instanceof RangeError) throw new ReactionError(reaction, "a temperature in the species model's liquid-water range (or extrapolation cp)", `${celsius} °C (${e.message})`);
      throw e;
    }
    if (p.G === undefined) throw new ReactionError(reaction, 'S° or ΔfH° for every species away from 25 °C', `only ΔfG° for ${r.name}`);
    if (p.estimated) estimated.push(r.name);
    rows.push(p);
  }
  if (estimated.length && !at25) warnings.push(`carried to temperature with estimated data (S° or equation-of-state parameters): ${estimated.join(', ')}`);
  const of = (k: keyof Pick<SpeciesAtT, 'G' | 'H' | 'S' | 'Cp'>) => sum(rs.map((r, i) => ({ nu: r.nu, x: rows[i]![k] })));
  return { dG: of('G')!, dH: of('H'), dS: of('S'), dCp: of('Cp') };
}

/** Step 1 ('cp' or 'constant-h-s'): the constant-Cp forms; the reaction-level route where S° is missing. */
function constantEnergies(rs: readonly EnergyInput[], reaction: string, celsius: number, mode: Extrapolation, warnings: string[]): Energies {
  const T = celsius + KELVIN;
  const at25 = Math.abs(T - T_REF) < 1e-9;
  const noS = rs.filter((r) => r.data.S === undefined).map((r) => r.name);
  const noH = rs.filter((r) => r.data.dfH === undefined).map((r) => r.name);
  // The constant-Cp forms take a missing Cp° as 0 (warned beyond 50 K).
  const dCpConst = mode === 'cp' ? rs.reduce((a, r) => a + r.nu * (r.data.Cp ?? 0), 0) : 0;
  if (noS.length === 0) {
    let dG = 0;
    let dS = 0;
    let dH: number | null = 0;
    for (const { nu, data } of rs) {
      const d = { ...data, S: data.S! };
      dG += nu * apparentG(d, T, mode);
      dS += nu * entropyAt(d, T, mode);
      if (dH !== null) dH = data.dfH === undefined ? null : dH + nu * apparentH(d, T, mode);
    }
    return { dG, dH, dS, dCp: dCpConst };
  }
  const G0 = rs.reduce((a, r) => a + r.nu * r.data.dfG, 0);
  if (noH.length > 0) {
    if (!at25) throw new ReactionError(reaction, 'S° or ΔfH° for every species away from 25 °C', `only ΔfG° for ${noH.filter((x) => noS.includes(x)).join(', ')}`);
    return { dG: G0, dH: null, dS: null, dCp: null };
  }
  // Reaction-level route when some S° are missing: ΔrS° = (ΔrH° − ΔrG°)/T_r, then constant ΔCp.
  const H0 = rs.reduce((a, r) => a + r.nu * r.data.dfH!, 0);
  const S0 = ((H0 - G0) * 1000) / T_REF;
  const dCp = mode === 'cp' ? rs.reduce((a, r) => a + r.nu * (r.data.Cp ?? 0), 0) : 0;
  const dH = H0 + (dCp * (T - T_REF)) / 1000;
  const dS = S0 + dCp * Math.log(T / T_REF);
  if (!at25) warnings.push(`no S° for ${noS.join(', ')}: ΔrS° taken from (ΔrH° − ΔrG°)/298.15 K`);
  return { dG: dH - (T * dS) / 1000, dH, dS, dCp: mode === 'cp' ? dCp : 0 };
}

/** ΔrG, ΔrH, ΔrS and ΔrCp at `celsius` (module comment), with the data-coverage warnings. */
export function reactionEnergies(rs: readonly EnergyInput[], reaction: string, celsius: number, mode: CellExtrapolation, warnings: string[]): Energies {
  if (mode === 'best' && rs.every((r) => r.data.propertiesAt)) return bestEnergies(rs, reaction, celsius, warnings);
  if (mode === 'best' && Math.abs(celsius - 25) > 1e-9) {
    warnings.push(`no species model for ${rs.filter((r) => !r.data.propertiesAt).map((r) => r.name).join(', ')}: constant Cp° used for the whole reaction`);
  }
  const cm: Extrapolation = mode === 'best' ? 'cp' : mode;
  const e = constantEnergies(rs, reaction, celsius, cm, warnings);
  if (Math.abs(celsius - 25) > 50) {
    if (cm === 'cp') {
      const noCp = rs.filter((r) => r.data.Cp === undefined).map((r) => r.name);
      if (noCp.length > 0) warnings.push(`no Cp° for ${noCp.join(', ')}: taken as 0 at ${celsius} °C, more than 50 K from 25 °C`);
    } else {
      warnings.push(`constant ΔrH and ΔrS used ${Math.abs(celsius - 25).toFixed(0)} K from 25 °C: expect errors of some mV`);
    }
  }
  return e;
}
