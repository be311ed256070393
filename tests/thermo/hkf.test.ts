import { describe, expect, it } from 'vitest';
import { bornFunctions, bornReference } from '../../src/thermo/born.js';
import { gFunction } from '../../src/thermo/g-function.js';
import { hkfCpRef, hkfG, type HkfParameters } from '../../src/thermo/hkf.js';
import { waterApparentG } from '../../src/thermo/water-gibbs.js';
import { if97Region1SpecificEntropy } from '../../src/thermo/water-if97.js';
import { waterState } from '../../src/thermo/water.js';

// Cl- of Shock & Helgeson (1988), GCA 52, 2009, Table (recalled): S° 13.56 cal/(mol K).
const CL: HkfParameters = { a1: 4.032, a2: 4.801, a3: 5.563, a4: -2.847, c1: -4.4, c2: -5.714, omega: 1.456 };

describe('IF97 region 1 entropy', () => {
  it('matches the IF97 check value s(300 K, 3 MPa) = 0.392294792 kJ/(kg K) (IAPWS R7-97 Table 5)', () => {
    expect(if97Region1SpecificEntropy(300, 3)).toBeCloseTo(0.392294792, 7);
  });
});

describe('Born functions', () => {
  it('worked example at 25 °C, 1 bar: Z = −1/ε, Y near the usual −5.8e-5 K⁻¹', () => {
    const b = bornReference();
    expect(b.Z).toBeCloseTo(-1 / b.epsilon, 12);
    expect(b.epsilon).toBeCloseTo(78.41, 1);
    // Y_r = −5.81e-5 K⁻¹ (Helgeson & Kirkham 1974 / Tanger & Helgeson 1988, another dielectric
    // model); the R8-97 derivative should agree within 2 %.
    expect(Math.abs(b.Y / -5.81e-5 - 1)).toBeLessThan(0.02);
    // X_r = −3.09e-7 K⁻² (same sources); within 15 %.
    expect(Math.abs(b.X / -3.09e-7 - 1)).toBeLessThan(0.15);
  });
  it('Y is the temperature derivative of Z (finite difference over 1 K)', () => {
    const lo = bornFunctions(372.65, 0.5).Z;
    const hi = bornFunctions(373.65, 0.5).Z;
    expect(bornFunctions(373.15, 0.5).Y).toBeCloseTo(hi - lo, 8);
  });
});

describe('g-function (Shock et al. 1992)', () => {
  it('worked example at 300 °C, saturation: hand arithmetic of eqs. 25, 32, 33', () => {
    const T = 300, P = 85.8771, rho = 0.712138;
    const ag = -2.037662 + 5.747e-3 * 300 - 6.557892e-6 * 90000; // −0.903976
    const bg = 6.107361 - 1.074377e-2 * 300 + 1.268348e-5 * 90000; // 4.025744
    const u = 145 / 300;
    const f = (Math.pow(u, 4.8) + 36.66666 * Math.pow(u, 16)) * (-1.504956e-10 * Math.pow(914.1229, 3) + 5.01799e-14 * Math.pow(914.1229, 4));
    const expected = ag * Math.pow(0.287862, bg) - f;
    expect(gFunction(T, P, rho * 1000)).toBeCloseTo(expected, 10);
    expect(expected).toBeCloseTo(-0.00352, 4);
  });
  it('is zero at and above 1 g/cm³ and small below 100 °C', () => {
    expect(Math.abs(gFunction(25, 1, 997))).toBeLessThan(1e-6);
    expect(gFunction(4, 1, 1000)).toBe(0);
  });
});

describe('HKF apparent G', () => {
  const ref = { kelvin: 298.15, pressureMPa: 0.1, density: 997.05 };
  it('gives ΔfG° at T_r, P_r and −∂G/∂T = S° there', () => {
    const dfG = -131.2, S = 56.6;
    expect(hkfG(dfG, S, CL, -1, ref)).toBeCloseTo(dfG, 9);
    const h = 0.01;
    const d = (hkfG(dfG, S, CL, -1, { ...ref, kelvin: 298.15 + h }) - hkfG(dfG, S, CL, -1, { ...ref, kelvin: 298.15 - h })) / (2 * h);
    expect(-d * 1000).toBeCloseTo(S, 2);
  });
  it('Cl⁻ at 200 °C, saturation, against the formula coded independently here (Tanger & Helgeson 1988)', () => {
    const w = waterState(200);
    const T = w.kelvin, P = w.pressureMPa * 10, Tr = 298.15, th = 228, psi = 2600;
    const b = bornFunctions(T, w.pressureMPa), r = bornReference();
    const a1 = 0.4032, a2 = 480.1, a3 = 5.563, a4 = -28470, c1 = -4.4, c2 = -57140, wr = 145600;
    // ω(T, P) of a −1 ion: r_e,ref = 1/(ω_r/η − 1/3.082), r_e = r_e,ref + g.
    const g = gFunction(200, P, w.density);
    const reRef = 1 / (wr / 1.66027e5 - 1 / 3.082);
    const wT = 1.66027e5 * (1 / (reRef + g) + 1 / (3.082 + g));
    const Scal = 56.6 / 4.184;
    const lnp = Math.log((psi + P) / (psi + 1));
    const cal =
      (-131.2 * 1000) / 4.184 - Scal * (T - Tr) - c1 * (T * Math.log(T / Tr) - T + Tr) + a1 * (P - 1) + a2 * lnp -
      c2 * ((1 / (T - th) - 1 / (Tr - th)) * ((th - T) / th) - (T / th ** 2) * Math.log((Tr * (T - th)) / (T * (Tr - th)))) +
      (a3 * (P - 1) + a4 * lnp) / (T - th) - wT * (b.Z + 1) + wr * (r.Z + 1) + wr * r.Y * (T - Tr);
    expect(hkfG(-131.2, 56.6, CL, -1, { kelvin: T, pressureMPa: w.pressureMPa, density: w.density })).toBeCloseTo((cal * 4.184) / 1000, 6);
  });
  it('Cp° at T_r of Cl⁻ from its parameters is near the tabulated −29.4 cal/(mol K) (Shock & Helgeson 1988)', () => {
    expect(hkfCpRef(CL)).toBeGreaterThan(-33);
    expect(hkfCpRef(CL)).toBeLessThan(-26);
  });
});

describe('H2O(l) from the IAPWS Gibbs function', () => {
  it('is the library ΔfG° at 25 °C, 1 bar and has S° = 69.91 there', () => {
    expect(waterApparentG(-237.129, 69.91, 298.15, 0.1)).toBeCloseTo(-237.129, 9);
    const d = (waterApparentG(-237.129, 69.91, 298.16, 0.1) - waterApparentG(-237.129, 69.91, 298.14, 0.1)) / 0.02;
    expect(-d * 1000).toBeCloseTo(69.91, 2);
  });
  it('Cp from the curvature is IAPWS liquid water Cp, 75.3 J/(mol K) at 25 °C (IAPWS-95 / IF97: 4.1813 kJ/(kg K))', () => {
    const h = 0.5, T = 298.15;
    const g = (t: number) => waterApparentG(-237.129, 69.91, t, 0.1);
    const cp = (-T * (g(T + h) - 2 * g(T) + g(T - h)) / (h * h)) * 1000;
    expect(cp).toBeCloseTo(4.1813 * 18.015268, 0);
  });
});
