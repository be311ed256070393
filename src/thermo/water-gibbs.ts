/**
 * Apparent Gibbs energy of liquid water H2O(l) at T and P from the IAPWS-IF97 region 1 Gibbs
 * function, anchored to the library's ΔfG° and third-law S° at 25 °C, 1 bar.
 *
 *   G(T, P) = ΔfG° + M·[g(T, P) − g(T_r, P_r)] − s₀·(T − T_r),   s₀ = S° − M·s(T_r, P_r)
 * where g, s are IF97's specific Gibbs energy and entropy (kJ/kg, kJ/(kg·K), zero at the triple
 * point liquid) and M = 0.018015268 kg/mol. The s₀ term moves IF97's entropy zero to the third-law
 * scale, so −∂G/∂T = S°(T) on that scale (at T_r it is the library's S°). Result in kJ/mol.
 * Validity: IF97 region 1 (0–350 °C, p_σ ≤ p ≤ 100 MPa).
 * Reference: IAPWS R7-97 (2012) region 1; Helgeson et al. (1981) apparent convention.
 * Worked example: ΔfG° = −237.129, S° = 69.91, 200 °C at p_σ = 1.5549 MPa → −251.9 kJ/mol (test).
 */
import { T_REF } from './constants.js';
import { P_REF_MPA } from './born.js';
import { M_WATER } from './water.js';
import { if97Region1SpecificEntropy, if97Region1SpecificGibbs } from './water-if97.js';

/** Apparent G of H2O(l), kJ/mol; dfG kJ/mol, S J/(mol·K), T K, P MPa. */
export function waterApparentG(dfG: number, S: number, kelvin: number, pressureMPa: number): number {
  const gRef = if97Region1SpecificGibbs(T_REF, P_REF_MPA);
  const s0 = S / 1000 - M_WATER * if97Region1SpecificEntropy(T_REF, P_REF_MPA);
  return dfG + M_WATER * (if97Region1SpecificGibbs(kelvin, pressureMPa) - gRef) - s0 * (kelvin - T_REF);
}
