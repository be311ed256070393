/**
 * Revised Helgeson–Kirkham–Flowers equation of state: apparent standard partial molal Gibbs
 * energy G(T, P) of an aqueous species (Benson–Helgeson convention: G(T, P) = ΔfG°(T_r, P_r) +
 * [G(T, P) − G(T_r, P_r)] of the species itself).
 *
 *   G = ΔfG° − S°(T − T_r) − c1[T ln(T/T_r) − T + T_r] + a1(P − P_r) + a2 ln((Ψ + P)/(Ψ + P_r))
 *       − c2{[1/(T − Θ) − 1/(T_r − Θ)]·[(Θ − T)/Θ] − (T/Θ²)·ln[T_r(T − Θ)/(T(T_r − Θ))]}
 *       + [1/(T − Θ)]·[a3(P − P_r) + a4 ln((Ψ + P)/(Ψ + P_r))]
 *       − ω(Z + 1) + ω_r(Z_r + 1) + ω_r·Y_r·(T − T_r)
 * with Θ = 228 K, Ψ = 2600 bar, T_r = 298.15 K, P_r = 1 bar, Z = −1/ε and Y_r = (∂Z/∂T)_P at T_r, P_r
 * (born.ts). At T = T_r, P = P_r it returns ΔfG°; −∂G/∂T there is S° (checked in the test).
 * For a charged species ω changes with T and P through the g-function (g-function.ts):
 *   r_e,ref = z²/(ω_r/η + z/3.082),  r_e = r_e,ref + |z|·g,  ω = η(z²/r_e − z/(3.082 + g)),
 * η = 1.66027e5 Å·cal/mol; H+ has ω = 0 and all parameters zero by convention.
 * Units: parameters as tabulated in the compilations (their scaled form): a1·10 (cal/(mol·bar)),
 * a2·10⁻² (cal/mol), a3 (cal·K/(mol·bar)), a4·10⁻⁴ (cal·K/mol), c1 (cal/(mol·K)), c2·10⁻⁴ (cal·K/mol),
 * ω·10⁻⁵ (cal/mol) — i.e. the file holds a1 = 1.839 for a1 = 0.1839 cal/(mol·bar). ΔfG° in kJ/mol,
 * S° in J/(mol·K); the result in kJ/mol (4.184 J/cal).
 * Validity: 0–350 °C, liquid water, up to 5 kbar (here up to 1 kbar, IF97 region 1 limit).
 * References: Helgeson, Kirkham & Flowers, Am. J. Sci. 281 (1981) 1249; Tanger & Helgeson,
 * Am. J. Sci. 288 (1988) 19; Shock, Oelkers, Johnson, Sverjensky & Helgeson, J. Chem. Soc. Faraday
 * Trans. 88 (1992) 803 (g-function).
 */
import { T_REF } from './constants.js';
import { bornFunctions, bornReference } from './born.js';
import { gFunction } from './g-function.js';

/** HKF parameters as tabulated (scaled units, see the module comment). */
export interface HkfParameters {
  a1: number;
  a2: number;
  a3: number;
  a4: number;
  c1: number;
  c2: number;
  omega: number;
}

export const HKF_KEYS: readonly (keyof HkfParameters)[] = ['a1', 'a2', 'a3', 'a4', 'c1', 'c2', 'omega'];

export const THETA = 228;
export const PSI = 2600;
export const P_REF_BAR = 1;
export const ETA = 1.66027e5;
export const CAL = 4.184;

/** Parameters in plain cal-based units (the scale factors applied). */
export function unscaled(p: HkfParameters): HkfParameters {
  return { a1: p.a1 / 10, a2: p.a2 * 1e2, a3: p.a3, a4: p.a4 * 1e4, c1: p.c1, c2: p.c2 * 1e4, omega: p.omega * 1e5 };
}

/** The state of the solvent the species is in. */
export interface SolventState {
  kelvin: number;
  pressureMPa: number;
  /** Liquid density, kg/m³. */
  density: number;
}

/** ω (cal/mol) at T, P from ω_r (cal/mol) and the charge (see the module comment). */
export function omegaAt(omegaRef: number, charge: number, celsius: number, pressureBar: number, density: number): number {
  if (charge === 0 || omegaRef === 0) return omegaRef;
  const g = gFunction(celsius, pressureBar, density);
  if (g === 0) return omegaRef;
  const z = charge;
  const reRef = (z * z) / (omegaRef / ETA + z / 3.082);
  const re = reRef + Math.abs(z) * g;
  return ETA * ((z * z) / re - z / (3.082 + g));
}

/**
 * Apparent G(T, P) in kJ/mol (see the module comment).
 * Worked example: Cl⁻ at 200 °C, saturation (15.55 bar) — value checked in the test against the
 * formula coded independently there.
 */
export function hkfG(dfG: number, S: number, params: HkfParameters, charge: number, st: SolventState): number {
  const p = unscaled(params);
  const T = st.kelvin;
  const P = st.pressureMPa * 10;
  const Tr = T_REF;
  const Pr = P_REF_BAR;
  const sCal = S / CAL;
  const ref = bornReference();
  const born = bornFunctions(T, st.pressureMPa);
  const omega = omegaAt(p.omega, charge, T - 273.15, P, st.density);
  // Step 1: entropy and non-solvation heat capacity terms.
  let g = (dfG * 1000) / CAL - sCal * (T - Tr) - p.c1 * (T * Math.log(T / Tr) - T + Tr);
  g -= p.c2 * ((1 / (T - THETA) - 1 / (Tr - THETA)) * ((THETA - T) / THETA) - (T / (THETA * THETA)) * Math.log((Tr * (T - THETA)) / (T * (Tr - THETA))));
  // Step 2: non-solvation volume terms.
  const lnP = Math.log((PSI + P) / (PSI + Pr));
  g += p.a1 * (P - Pr) + p.a2 * lnP + (p.a3 * (P - Pr) + p.a4 * lnP) / (T - THETA);
  // Step 3: solvation (Born) term.
  g += -omega * (born.Z + 1) + p.omega * (ref.Z + 1) + p.omega * ref.Y * (T - Tr);
  return (g * CAL) / 1000;
}

/**
 * Standard partial molal heat capacity at T_r, P_r (cal/(mol·K)) from the parameters:
 *   Cp° = c1 + c2/(T_r − Θ)² + ω_r·T_r·X_r   (Tanger & Helgeson 1988; g-function terms vanish at T_r).
 * Used to fit c1 to a known Cp° (hkf-estimate.ts).
 */
export function hkfCpRef(p: HkfParameters): number {
  const u = unscaled(p);
  return u.c1 + u.c2 / (T_REF - THETA) ** 2 + u.omega * T_REF * bornReference().X;
}
