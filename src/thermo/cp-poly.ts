/**
 * Apparent Gibbs energy with a Maier–Kelley heat-capacity polynomial Cp(T) = a + b·T + c·T⁻²
 * (J/(mol·K), T in K), as tabulated for minerals (e.g. Robie & Hemingway 1995, USGS Bull. 2131).
 *
 *   G(T) = ΔfG° − S°(T − T_r) + ∫_{T_r}^{T} Cp dT − T·∫_{T_r}^{T} (Cp/T) dT
 *   ∫Cp dT   = a(T − T_r) + (b/2)(T² − T_r²) − c(1/T − 1/T_r)
 *   ∫Cp/T dT = a ln(T/T_r) + b(T − T_r) − (c/2)(1/T² − 1/T_r²)
 * ΔfG° kJ/mol, S° J/(mol·K); result kJ/mol. Valid over the polynomial's fitted range (typically
 * 298–1000 K or more for oxides). Reference: Maier & Kelley, J. Am. Chem. Soc. 54 (1932) 3243.
 * Worked example: a = 50, b = 0.01, c = −1e6, ΔfG° = −300, S° = 40 at 473.15 K → checked in the test.
 */
import { T_REF } from './constants.js';

export interface CpPolynomial {
  /** J/(mol·K). */
  a: number;
  /** J/(mol·K²). */
  b: number;
  /** J·K/mol. */
  c: number;
}

/** Cp (J/(mol·K)) of the polynomial at T (K). */
export function cpAt(p: CpPolynomial, kelvin: number): number {
  return p.a + p.b * kelvin + p.c / (kelvin * kelvin);
}

/** Apparent G (kJ/mol) at T (K), see the module comment. */
export function polynomialG(dfG: number, S: number, p: CpPolynomial, kelvin: number): number {
  const T = kelvin;
  const Tr = T_REF;
  const intCp = p.a * (T - Tr) + (p.b / 2) * (T * T - Tr * Tr) - p.c * (1 / T - 1 / Tr);
  const intCpT = p.a * Math.log(T / Tr) + p.b * (T - Tr) - (p.c / 2) * (1 / (T * T) - 1 / (Tr * Tr));
  return dfG + (-S * (T - Tr) + intCp - T * intCpT) / 1000;
}
