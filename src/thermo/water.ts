/**
 * Properties of liquid water at temperature: saturation pressure, density, ionization constant,
 * static relative permittivity — each from the IAPWS release cited at the function.
 *
 * Valid range of `waterState`: 0–350 °C (IAPWS-IF97 region 1 ends at 623.15 K); the test suite
 * checks against published values from 0.01 to 300 °C.
 */
import { KELVIN } from './constants.js';
import {
  IF97_R1_PMAX,
  IF97_R1_TMAX,
  IF97_R1_TMIN,
  if97Region1SpecificVolume,
} from './water-if97.js';

/** Critical temperature of water, K (IAPWS). */
export const T_CRIT = 647.096;
/** Critical pressure of water, MPa (IAPWS). */
export const P_CRIT = 22.064;
/** Critical density of water, kg/m³ (IAPWS). */
export const RHO_CRIT = 322;
/** Molar mass of water, kg/mol (IAPWS). */
export const M_WATER = 0.018015268;
/** Standard atmosphere, MPa. */
export const P_ATM = 0.101325;

/** Range of `waterState`, °C. */
export const WATER_MIN_CELSIUS = 0;
export const WATER_MAX_CELSIUS = IF97_R1_TMAX - KELVIN; // 350 °C

/**
 * Vapour pressure of water along the liquid–vapour saturation line, MPa.
 *
 * ln(p_σ/p_c) = (T_c/T)(a1 τ + a2 τ^1.5 + a3 τ^3 + a4 τ^3.5 + a5 τ^4 + a6 τ^7.5), τ = 1 − T/T_c.
 * Reference: IAPWS Revised Supplementary Release on Saturation Properties of Ordinary Water
 * Substance (1992), Wagner & Pruss auxiliary equation 1. Valid 273.16 K ≤ T ≤ 647.096 K.
 * Worked example: T = 473.15 K (200 °C) → 1.5549 MPa.
 */
export function saturationPressure(kelvin: number): number {
  checkFinite(kelvin, 'temperature');
  if (kelvin > T_CRIT) throw new RangeError(`saturationPressure: T = ${kelvin} K is above the critical point ${T_CRIT} K`);
  const tau = 1 - kelvin / T_CRIT;
  const s =
    -7.85951783 * tau +
    1.84408259 * tau ** 1.5 -
    11.7866497 * tau ** 3 +
    22.6807411 * tau ** 3.5 -
    15.9618719 * tau ** 4 +
    1.80122502 * tau ** 7.5;
  return P_CRIT * Math.exp((T_CRIT / kelvin) * s);
}

/**
 * Density of the saturated liquid ρ', kg/m³.
 *
 * ρ'/ρ_c = 1 + b1 τ^(1/3) + b2 τ^(2/3) + b3 τ^(5/3) + b4 τ^(16/3) + b5 τ^(43/3) + b6 τ^(110/3),
 * τ = 1 − T/T_c. Reference: IAPWS 1992 supplementary release (above), Wagner & Pruss auxiliary
 * equation 2. Valid 273.16 K ≤ T ≤ 647.096 K. Worked example: 473.15 K → about 864.7 kg/m³.
 */
export function saturatedLiquidDensity(kelvin: number): number {
  checkFinite(kelvin, 'temperature');
  if (kelvin > T_CRIT) throw new RangeError(`saturatedLiquidDensity: T = ${kelvin} K is above the critical point ${T_CRIT} K`);
  const tau = 1 - kelvin / T_CRIT;
  const r =
    1 +
    1.99274064 * tau ** (1 / 3) +
    1.09965342 * tau ** (2 / 3) -
    0.510839303 * tau ** (5 / 3) -
    1.75493479 * tau ** (16 / 3) -
    45.5170352 * tau ** (43 / 3) -
    6.7469445e5 * tau ** (110 / 3);
  return RHO_CRIT * r;
}

/**
 * Density of liquid water, kg/m³, from IAPWS-IF97 region 1: ρ = 1/v, v = R T γ_π / p*
 * (the 34-term Gibbs free energy equation; see water-if97.ts).
 * Reference: IAPWS R7-97 (2012), Industrial Formulation 1997, region 1.
 * Valid 273.15–623.15 K and p_σ(T) ≤ p ≤ 100 MPa (the caller is responsible for keeping the
 * state liquid; `waterState` does). Worked example: 298.15 K, 0.101325 MPa → 997.048 kg/m³.
 */
export function liquidDensity(kelvin: number, pressureMPa: number): number {
  checkFinite(kelvin, 'temperature');
  checkFinite(pressureMPa, 'pressure');
  if (kelvin < IF97_R1_TMIN - 1e-9 || kelvin > IF97_R1_TMAX + 1e-9) {
    throw new RangeError(`liquidDensity: T = ${kelvin} K is outside IAPWS-IF97 region 1 (${IF97_R1_TMIN}–${IF97_R1_TMAX} K)`);
  }
  if (!(pressureMPa > 0) || pressureMPa > IF97_R1_PMAX) {
    throw new RangeError(`liquidDensity: p = ${pressureMPa} MPa is outside IAPWS-IF97 region 1 (up to ${IF97_R1_PMAX} MPa)`);
  }
  return 1 / if97Region1SpecificVolume(kelvin, pressureMPa);
}

/**
 * Ionization constant of water as pKw = −log10(Kw), Kw in (mol/kg)².
 *
 * pKw = −2n[log10(1+Q) − Q/(Q+1)·ρ(β0 + β1/T + β2 ρ)] + pKw_G + 2 log10(M_w/1000 g),
 * Q = ρ exp(α0 + α1/T + α2 ρ^(2/3)/T²), pKw_G = γ0 + γ1/T + γ2/T² + γ3/T³, ρ in g/cm³, T in K.
 * Reference: IAPWS R11-07 (2007, revised 2019), Bandura & Lvov, Release on the Ionization
 * Constant of H2O. Valid 0–1000 °C, 0–1000 MPa. Check value of the release:
 * T = 300 K, ρ = 1.000 g/cm³ → pKw = 13.906565.
 */
export function ionizationConstant(kelvin: number, densityKgM3: number): number {
  checkFinite(kelvin, 'temperature');
  checkFinite(densityKgM3, 'density');
  if (!(kelvin > 0) || !(densityKgM3 > 0)) throw new RangeError('ionizationConstant: temperature and density must be positive');
  const rho = densityKgM3 / 1000; // g/cm³
  const T = kelvin;
  const n = 6;
  const [a0, a1, a2] = [-0.864671, 8659.19, -22786.2];
  const [b0, b1, b2] = [0.642044, -56.8534, -0.375754];
  const [g0, g1, g2, g3] = [0.61415, 48251.33, -67707.93, 10102100];
  const Q = rho * Math.exp(a0 + a1 / T + (a2 * rho ** (2 / 3)) / (T * T));
  const pKwG = g0 + g1 / T + g2 / (T * T) + g3 / (T * T * T);
  const Mw = M_WATER * 1000; // g/mol
  return (
    -2 * n * (Math.log10(1 + Q) - (Q / (Q + 1)) * rho * (b0 + b1 / T + b2 * rho)) +
    pKwG +
    2 * Math.log10(Mw / 1000)
  );
}

/** R8-97 Table 1: [n_k, i_k, j_k], k = 1..11. */
const R8_TERMS: ReadonlyArray<readonly [number, number, number]> = [
  [0.978224486826, 1, 0.25],
  [-0.957771379375, 1, 1],
  [0.237511794148, 1, 2.5],
  [0.714692244396, 2, 1.5],
  [-0.298217036956, 3, 1.5],
  [-0.108863472196, 3, 2.5],
  [0.949327488264e-1, 4, 2],
  [-0.980469816509e-2, 5, 2],
  [0.16516763497e-4, 6, 5],
  [0.937359795772e-4, 7, 0.5],
  [-0.12317921872e-9, 10, 10],
];
const R8_N12 = 0.196096504426e-2;
// Constants as used in R8-97.
const R8_K = 1.380658e-23; // J/K
const R8_NA = 6.0221367e23; // 1/mol
const R8_ALPHA = 1.636e-40; // C² m² / J
const R8_EPS0 = 8.854187817e-12; // C² / (J m)
const R8_MU = 6.138e-30; // C m

/**
 * Static relative permittivity (dielectric constant) of water, dimensionless.
 *
 * Harris–Alder g-factor g = 1 + n12 δ (T/228 K − 1)^(−1.2) + Σ n_k δ^(i_k) τ^(j_k), δ = ρ/ρ_c,
 * τ = T_c/T; A = N_A μ² ρ_m g/(ε0 k T), B = N_A α ρ_m/(3 ε0), ρ_m = ρ/M (mol/m³);
 * ε = [1 + A + 5B + √(9 + 2A + 18B + A² + 10AB + 9B²)] / [4(1 − B)].
 * Reference: IAPWS R8-97, Release on the Static Dielectric Constant of Ordinary Water Substance
 * (Fernández et al., J. Phys. Chem. Ref. Data 26, 1125, 1997). Valid 238–1273 K, up to 1200 MPa
 * (this code requires T > 228 K). Worked example: 298.15 K, 997.048 kg/m³ → 78.41.
 */
export function relativePermittivity(kelvin: number, densityKgM3: number): number {
  checkFinite(kelvin, 'temperature');
  checkFinite(densityKgM3, 'density');
  if (!(kelvin > 228)) throw new RangeError(`relativePermittivity: T = ${kelvin} K must be above 228 K`);
  if (!(densityKgM3 > 0)) throw new RangeError('relativePermittivity: density must be positive');
  const delta = densityKgM3 / RHO_CRIT;
  const tau = T_CRIT / kelvin;
  let g = 1 + R8_N12 * delta * (kelvin / 228 - 1) ** -1.2;
  for (const [n, i, j] of R8_TERMS) g += n * delta ** i * tau ** j;
  const rhoMol = densityKgM3 / M_WATER;
  const A = (R8_NA * R8_MU * R8_MU * rhoMol * g) / (R8_EPS0 * R8_K * kelvin);
  const B = (R8_NA * R8_ALPHA * rhoMol) / (3 * R8_EPS0);
  return (1 + A + 5 * B + Math.sqrt(9 + 2 * A + 18 * B + A * A + 10 * A * B + 9 * B * B)) / (4 * (1 - B));
}

/** How the pressure of a `WaterState` was chosen. */
export type WaterPressurePath = 'atmospheric' | 'saturation' | 'user';

export interface WaterState {
  celsius: number;
  kelvin: number;
  /** Pressure of the state, MPa. */
  pressureMPa: number;
  /** Vapour pressure of water at this temperature, MPa. */
  saturationPressureMPa: number;
  /** Liquid density, kg/m³ (IAPWS-IF97 region 1). */
  density: number;
  /** −log10 Kw, Kw in (mol/kg)² (IAPWS R11-07). */
  pKw: number;
  /** pH of neutral water, pKw/2. */
  neutralPH: number;
  /** Static relative permittivity (IAPWS R8-97). */
  permittivity: number;
  path: WaterPressurePath;
}

/**
 * Relative tolerance when comparing a user pressure with the saturation pressure: a pressure
 * copied from an IF97 steam table (region 4) differs from Wagner & Pruss eq. 1 by up to ~2e-4
 * (0.017 % at 175–200 °C). Within the tolerance the state is computed at p_σ.
 */
const SAT_TOLERANCE = 5e-4;

/**
 * State of liquid water at a temperature and (optionally) pressure.
 *
 * Default pressure: 0.101325 MPa below 100 °C ('atmospheric'), the saturation pressure at and
 * above 100 °C ('saturation'). A user pressure ('user') must be at least the saturation pressure
 * (otherwise the water would boil; 0.05 % slack for table round-off) and at most 100 MPa.
 * Valid 0–350 °C; outside → RangeError.
 * Density from IAPWS-IF97 region 1, pKw from IAPWS R11-07, permittivity from IAPWS R8-97.
 * Worked example: 200 °C → p = 1.5549 MPa, ρ = 864.67 kg/m³, pKw = 11.3096, neutral pH 5.655.
 */
export function waterState(celsius: number, pressureMPa?: number): WaterState {
  checkFinite(celsius, 'temperature');
  if (celsius < WATER_MIN_CELSIUS || celsius > WATER_MAX_CELSIUS) {
    throw new RangeError(
      `water temperature ${celsius} °C is outside the supported range ${WATER_MIN_CELSIUS}–${WATER_MAX_CELSIUS} °C (liquid water, IAPWS-IF97 region 1)`,
    );
  }
  const kelvin = celsius + KELVIN;
  const pSat = saturationPressure(kelvin);
  let p: number;
  let path: WaterPressurePath;
  if (pressureMPa === undefined) {
    if (celsius < 100) {
      p = P_ATM;
      path = 'atmospheric';
    } else {
      p = pSat;
      path = 'saturation';
    }
  } else {
    checkFinite(pressureMPa, 'pressure');
    if (pressureMPa < pSat * (1 - SAT_TOLERANCE)) {
      throw new RangeError(
        `pressure ${pressureMPa} MPa is below the saturation pressure ${pSat.toPrecision(6)} MPa at ${celsius} °C: the water would boil; give at least the saturation pressure`,
      );
    }
    if (pressureMPa > IF97_R1_PMAX) {
      throw new RangeError(`pressure ${pressureMPa} MPa is above the supported maximum ${IF97_R1_PMAX} MPa (IAPWS-IF97 region 1)`);
    }
    p = Math.max(pressureMPa, pSat);
    path = 'user';
  }
  const density = liquidDensity(kelvin, p);
  const pKw = ionizationConstant(kelvin, density);
  return {
    celsius,
    kelvin,
    pressureMPa: pressureMPa ?? p,
    saturationPressureMPa: pSat,
    density,
    pKw,
    neutralPH: pKw / 2,
    permittivity: relativePermittivity(kelvin, density),
    path,
  };
}

function checkFinite(x: number, what: string): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new RangeError(`${what} must be a finite number, got ${String(x)}`);
}
