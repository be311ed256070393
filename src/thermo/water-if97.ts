/**
 * IAPWS-IF97 region 1 (compressed and saturated liquid water).
 *
 * Reference: IAPWS, "Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam" (IAPWS R7-97, 2012 revision), section 5,
 * eq. 7 (dimensionless Gibbs free energy γ(π, τ)), Table 2 (the 34 coefficients I_i, J_i, n_i),
 * Table 3 (v = (R T / p)·π·γ_π). Validity: 273.15 K ≤ T ≤ 623.15 K, p_σ(T) ≤ p ≤ 100 MPa.
 */

/** Specific gas constant of water used by IF97, kJ kg⁻¹ K⁻¹ (IF97 eq. 1). */
export const IF97_R = 0.461526;
/** Reducing pressure p* of region 1, MPa. */
export const IF97_R1_PSTAR = 16.53;
/** Reducing temperature T* of region 1, K. */
export const IF97_R1_TSTAR = 1386;
/** Region 1 temperature limits, K. */
export const IF97_R1_TMIN = 273.15;
export const IF97_R1_TMAX = 623.15;
/** Region 1 upper pressure limit, MPa. */
export const IF97_R1_PMAX = 100;

/** [I_i, J_i, n_i] of IF97 Table 2, i = 1..34. */
const R1: ReadonlyArray<readonly [number, number, number]> = [
  [0, -2, 0.14632971213167],
  [0, -1, -0.84548187169114],
  [0, 0, -0.3756360367204e1],
  [0, 1, 0.33855169168385e1],
  [0, 2, -0.95791963387872],
  [0, 3, 0.15772038513228],
  [0, 4, -0.16616417199501e-1],
  [0, 5, 0.81214629983568e-3],
  [1, -9, 0.28319080123804e-3],
  [1, -7, -0.60706301565874e-3],
  [1, -1, -0.18990068218419e-1],
  [1, 0, -0.32529748770505e-1],
  [1, 1, -0.21841717175414e-1],
  [1, 3, -0.5283835796993e-4],
  [2, -3, -0.47184321073267e-3],
  [2, 0, -0.30001780793026e-3],
  [2, 1, 0.47661393906987e-4],
  [2, 3, -0.44141845330846e-5],
  [2, 17, -0.72694996297594e-15],
  [3, -4, -0.31679644845054e-4],
  [3, 0, -0.28270797985312e-5],
  [3, 6, -0.85205128120103e-9],
  [4, -5, -0.22425281908e-5],
  [4, -2, -0.65171222895601e-6],
  [4, 10, -0.14340607871443e-12],
  [5, -8, -0.40516996860117e-6],
  [8, -11, -0.12734301741641e-8],
  [8, -6, -0.17424871230634e-9],
  [21, -29, -0.68762131295531e-18],
  [23, -31, 0.14478307828521e-19],
  [29, -38, 0.26335781662795e-22],
  [30, -39, -0.11947622640071e-22],
  [31, -40, 0.18228094581404e-23],
  [32, -41, -0.93537087292458e-25],
];

/**
 * ∂γ/∂π of IF97 region 1: γ_π = Σ −n_i I_i (7.1 − π)^(I_i−1) (τ − 1.222)^J_i,
 * with π = p/16.53 MPa and τ = 1386 K/T (IF97 Table 4). Dimensionless.
 */
export function if97Region1GammaPi(kelvin: number, pressureMPa: number): number {
  const pi = pressureMPa / IF97_R1_PSTAR;
  const tau = IF97_R1_TSTAR / kelvin;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  let sum = 0;
  for (const [I, J, n] of R1) {
    if (I === 0) continue;
    sum -= n * I * a ** (I - 1) * b ** J;
  }
  return sum;
}

/**
 * Specific volume of liquid water, IF97 region 1: v = R·T·γ_π / p* (IF97 Table 3), m³/kg.
 * Worked example (IF97 Table 5 check values, recalled from memory): T = 300 K, p = 3 MPa →
 * v = 0.100215168e-2 m³/kg. No range checks here; callers check the region 1 limits.
 */
export function if97Region1SpecificVolume(kelvin: number, pressureMPa: number): number {
  // R in kJ/(kg K) → ×1e3 J/(kg K); p* in MPa → ×1e6 Pa.
  return (IF97_R * 1e3 * kelvin * if97Region1GammaPi(kelvin, pressureMPa)) / (IF97_R1_PSTAR * 1e6);
}

/**
 * Dimensionless Gibbs free energy of IF97 region 1 and its τ derivative (IF97 eq. 7, Table 4):
 *   γ = Σ n_i (7.1 − π)^I_i (τ − 1.222)^J_i,   γ_τ = Σ n_i (7.1 − π)^I_i J_i (τ − 1.222)^(J_i−1).
 * Specific Gibbs energy g = R·T·γ, specific entropy s = R(τγ_τ − γ) (IF97 Table 3), on IF97's
 * own zero (liquid at the triple point: u = s = 0).
 * Worked example (IF97 Table 5, recalled from memory): T = 300 K, p = 3 MPa → s = 0.392294792 kJ/(kg K).
 */
export function if97Region1Gamma(kelvin: number, pressureMPa: number): { gamma: number; gammaTau: number } {
  const a = 7.1 - pressureMPa / IF97_R1_PSTAR;
  const b = IF97_R1_TSTAR / kelvin - 1.222;
  let gamma = 0;
  let gammaTau = 0;
  for (const [I, J, n] of R1) {
    gamma += n * a ** I * b ** J;
    gammaTau += n * a ** I * J * b ** (J - 1);
  }
  return { gamma, gammaTau };
}

/** Specific Gibbs energy g = R T γ of IF97 region 1, kJ/kg (IF97's zero; see if97Region1Gamma). */
export function if97Region1SpecificGibbs(kelvin: number, pressureMPa: number): number {
  return IF97_R * kelvin * if97Region1Gamma(kelvin, pressureMPa).gamma;
}

/** Specific entropy s = R(τγ_τ − γ) of IF97 region 1, kJ/(kg K) (IF97's zero). */
export function if97Region1SpecificEntropy(kelvin: number, pressureMPa: number): number {
  const { gamma, gammaTau } = if97Region1Gamma(kelvin, pressureMPa);
  return IF97_R * ((IF97_R1_TSTAR / kelvin) * gammaTau - gamma);
}
