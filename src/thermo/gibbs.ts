/**
 * Apparent standard Gibbs energy of a species at temperature T.
 *
 * Formula (Helgeson's apparent convention, constant heat capacity):
 *   G(T) = ΔfG° − S°·(T − T_r) + Cp°·[(T − T_r) − T·ln(T/T_r)]
 * with ΔfG° in kJ/mol and S°, Cp° in J/(mol·K) at T_r = 298.15 K, 1 bar; result in kJ/mol.
 * With Cp° = 0 it reduces to ΔfG° − S°(T − T_r), so that for any balanced reaction
 * ΔrG(T) = ΔrH° − T·ΔrS° exactly (the constant-ΔH, constant-ΔS approximation).
 * Validity: the constant-Cp form is good to a few kJ/mol over 0–300 °C for most species; the
 * constant-ΔH/ΔS form only over a modest range (tens of K) around 25 °C.
 * Reference: H.C. Helgeson et al., Am. J. Sci. 281 (1981) 1249 (apparent Gibbs energy convention);
 * any thermodynamics text for the constant-Cp integration.
 */
import { T_REF } from './constants.js';

export interface ThermoData {
  /** ΔfG° at 298.15 K, kJ/mol. */
  dfG: number;
  /** ΔfH° at 298.15 K, kJ/mol. */
  dfH?: number;
  /** S° at 298.15 K, J/(mol·K). */
  S?: number;
  /** Cp° at 298.15 K, J/(mol·K), taken constant. */
  Cp?: number;
}

/** How G is carried from 25 °C to T. */
export type Extrapolation = 'cp' | 'constant-h-s';

/**
 * Apparent G(T) in kJ/mol (see module comment). `S` must be known unless T = T_r.
 * Worked example: H2O(l), ΔfG° = −237.129, S° = 69.91, Cp° = 75.291 at 80 °C (353.15 K):
 *   −237.129 − 0.06991·55 + 0.075291·(55 − 353.15·ln(353.15/298.15)) = −241.334 kJ/mol.
 */
export function apparentG(d: ThermoData, kelvin: number, mode: Extrapolation = 'cp'): number {
  const dT = kelvin - T_REF;
  if (Math.abs(dT) < 1e-12) return d.dfG;
  if (d.S === undefined) throw new Error('apparentG: S° is required away from 298.15 K');
  let g = d.dfG - (d.S * dT) / 1000;
  if (mode === 'cp' && d.Cp !== undefined) {
    g += (d.Cp * (dT - kelvin * Math.log(kelvin / T_REF))) / 1000;
  }
  return g;
}

/**
 * Apparent enthalpy H(T) in kJ/mol with constant Cp: ΔfH° + Cp°·(T − T_r). Needs dfH.
 * Worked example: H2O(l) at 80 °C: −285.830 + 0.075291·55 = −281.689 kJ/mol.
 */
export function apparentH(d: ThermoData, kelvin: number, mode: Extrapolation = 'cp'): number {
  if (d.dfH === undefined) throw new Error('apparentH: ΔfH° is required');
  const cp = mode === 'cp' ? d.Cp ?? 0 : 0;
  return d.dfH + (cp * (kelvin - T_REF)) / 1000;
}

/**
 * Entropy S(T) in J/(mol·K) with constant Cp: S° + Cp°·ln(T/T_r).
 * Worked example: H2O(l) at 80 °C: 69.91 + 75.291·ln(353.15/298.15) = 82.66 J/(mol·K).
 */
export function entropyAt(d: ThermoData, kelvin: number, mode: Extrapolation = 'cp'): number {
  if (d.S === undefined) throw new Error('entropyAt: S° is required');
  const cp = mode === 'cp' ? d.Cp ?? 0 : 0;
  return d.S + cp * Math.log(kelvin / T_REF);
}

/**
 * Third-law entropy S° (J/(mol·K)) of a species from ΔfG° and ΔfH° (kJ/mol):
 *   ΔfS° = (ΔfH° − ΔfG°)/T_r,  S° = ΔfS° + Σ n_el·S°(el) − (z/2)·S°(H2, g)
 * where S°(el) are the elements' standard entropies per mole of atoms and the last term applies
 * the conventional ionic scale (H+ has S° = 0: its formation ½H2 → H+ + e⁻ carries −½S°(H2)).
 * Worked example: H+ (ΔfG° = ΔfH° = 0, z = 1): 0 + S°(H) − ½S°(H2) = 0.
 */
export function entropyFromFormation(
  dfG: number,
  dfH: number,
  elements: Record<string, number>,
  charge: number,
  elementEntropy: (symbol: string) => number | undefined,
): number {
  let s = ((dfH - dfG) * 1000) / T_REF;
  for (const [el, n] of Object.entries(elements)) {
    const se = elementEntropy(el);
    if (se === undefined) throw new Error(`no standard entropy for element ${el}`);
    s += n * se;
  }
  const sH = elementEntropy('H');
  if (sH === undefined) throw new Error('no standard entropy for H');
  return s - charge * sH; // (z/2)·S°(H2) = z·S°(H per atom)
}
