/**
 * Born functions of water from the project's own IAPWS permittivity (R8-97) and density (IF97
 * region 1), for the solvation term of the revised HKF equation of state.
 *
 *   Z = −1/ε,   Y = (∂Z/∂T)_P = (1/ε²)(∂ε/∂T)_P,   X = (∂Y/∂T)_P
 * with ε = ε(T, ρ(T, P)). The derivatives are taken numerically (central differences, step 0.05 K)
 * of the same permittivity used everywhere else, so Z, Y and X are mutually consistent — no
 * constants of another dielectric model are mixed in.
 * Units: Z dimensionless, Y in K⁻¹, X in K⁻². P in MPa. Valid where waterState is (0–350 °C,
 * liquid, up to 100 MPa).
 * Reference: Born (1920) for the solvation energy −ω(1/ε − 1); the functions Z, Y, X as defined by
 * Helgeson & Kirkham, Am. J. Sci. 274 (1974) 1089 and used by Tanger & Helgeson, Am. J. Sci. 288
 * (1988) 19.
 * Worked example: 25 °C, 1 bar → ε = 78.45, Z = −0.012747, Y = −5.80e-5 K⁻¹ (see the test).
 */
import { T_REF } from './constants.js';
import { liquidDensity, relativePermittivity } from './water.js';

/** Reference pressure of tabulated standard data, MPa (1 bar). */
export const P_REF_MPA = 0.1;

/** Permittivity of liquid water at T (K) and P (MPa). */
export function permittivityAt(kelvin: number, pressureMPa: number): number {
  return relativePermittivity(kelvin, liquidDensity(kelvin, pressureMPa));
}

export interface BornFunctions {
  epsilon: number;
  Z: number;
  Y: number;
  X: number;
}

const H = 0.05;

/** Z, Y, X at T (K), P (MPa); see the module comment. */
export function bornFunctions(kelvin: number, pressureMPa: number): BornFunctions {
  const zAt = (t: number): number => -1 / permittivityAt(t, pressureMPa);
  const epsilon = permittivityAt(kelvin, pressureMPa);
  const z0 = -1 / epsilon;
  // Keep the stencil inside IF97 region 1 at its lower end (0 °C).
  const t = Math.max(kelvin, 273.15 + H);
  const zm = zAt(t - H);
  const zp = zAt(t + H);
  const zc = t === kelvin ? z0 : zAt(t);
  return { epsilon, Z: z0, Y: (zp - zm) / (2 * H), X: (zp - 2 * zc + zm) / (H * H) };
}

let refCache: BornFunctions | undefined;

/** Born functions at the reference state 25 °C, 1 bar (Z_r, Y_r, X_r). */
export function bornReference(): BornFunctions {
  refCache ??= bornFunctions(T_REF, P_REF_MPA);
  return refCache;
}
