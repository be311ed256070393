/**
 * Standard partial molal heat capacity and volume of an aqueous species at 25 °C, 1 bar from its
 * revised HKF parameters, with the Born functions the compilations used (not this project's IAPWS
 * permittivity): the compilations list Cp° and V° beside the parameters, so recomputing them from
 * the parameters is an independent check of a recalled or typed parameter set (tests/data).
 *
 *   Cp° = c1 + c2/(T_r − Θ)² + ω·T_r·X_r                                  (cal/(mol·K))
 *   V°  = a1 + a2/(Ψ + P_r) + [a3 + a4/(Ψ + P_r)]/(T_r − Θ) − ω·Q_r        (cal/(mol·bar); ×41.84 → cm³/mol)
 * with T_r = 298.15 K, P_r = 1 bar, Θ = 228 K, Ψ = 2600 bar; the g-function terms vanish at T_r, P_r
 * (ω = ω_r there, ∂ω/∂T = ∂ω/∂P = 0). Born functions at T_r, P_r as tabulated by Tanger & Helgeson,
 * Am. J. Sci. 288 (1988) 19 and used by Shock & Helgeson, GCA 52 (1988) 2009:
 * X_r = −3.090·10⁻⁷ K⁻², Q_r = 5.903·10⁻⁷ bar⁻¹ (recalled).
 * Units in: the tabulated (scaled) parameters of hkf.ts. Out: Cp° in J/(mol·K), V° in cm³/mol.
 * Validity: 25 °C, 1 bar only.
 * Worked example: Cl⁻ (SH88: a1 4.032, a2 4.801, a3 5.563, a4 −2.847, c1 −4.4, c2 −5.714, ω 1.456)
 * → Cp° = −123.1 J/(mol·K) (−29.43 cal), V° = 17.79 cm³/mol; SH88 list −29.44 cal and 17.79 (test).
 */
import { T_REF } from './constants.js';
import { CAL, type HkfParameters, PSI, P_REF_BAR, THETA, unscaled } from './hkf.js';

/** Born functions at 25 °C, 1 bar as tabulated with the HKF compilations (see the module comment). */
export const HKF_TABLE_BORN = { X: -3.09e-7, Q: 5.903e-7 } as const;

/** cm³ per (cal/bar): 1 cal = 4.184 J, 1 J/bar = 10 cm³. */
const CM3_PER_CAL_BAR = CAL * 10;

/** Cp° (J/(mol·K)) and V° (cm³/mol) at 25 °C, 1 bar (see the module comment). */
export function hkfReferenceProperties(params: HkfParameters, born: { X: number; Q: number } = HKF_TABLE_BORN): { Cp: number; V: number } {
  const p = unscaled(params);
  const dT = T_REF - THETA;
  const pp = PSI + P_REF_BAR;
  // Step 1: heat capacity, non-solvation plus Born term.
  const cp = p.c1 + p.c2 / (dT * dT) + p.omega * T_REF * born.X;
  // Step 2: volume, non-solvation plus Born term.
  const v = p.a1 + p.a2 / pp + (p.a3 + p.a4 / pp) / dT - p.omega * born.Q;
  return { Cp: cp * CAL, V: v * CM3_PER_CAL_BAR };
}
