/**
 * The two baths of issue 13, through the library's species, and the solver's failure report.
 * Outside checks: hand Nernst for Ag(CN)₃²⁻ + e⁻ = Ag + 3 CN⁻ with the free cyanide from the mass
 * balance (bisection, tests/helpers/stability.ts; common practice; ΔfG° from the library's own files, so that the check is of the solver);
 * mass balance bound: 1 mol/kg NH₃ can hold at most 0.25 mol/kg as Cu(NH₃)₄²⁺ (stoichiometry).
 */
import { describe, expect, test } from 'vitest';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { describePoint, pointSolver, predominantIndex, speciationProblem } from '../../src/solve/speciation/index.js';
import { readSpec } from '../../src/system/spec.js';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { F, LN10, R } from '../../src/thermo/constants.js';
import { bisectionSpeciation, type Row, stabilityRows } from '../helpers/stability.js';

const setup = (o: Record<string, unknown>) => compositionSetup(readSpec(o, 'bath.yaml'));
const share = (r: ReturnType<typeof describePoint>, sp: string, c?: string) => (r.shares[c ?? Object.keys(r.shares)[0]].find((x) => x.species === sp)?.share ?? 0);

describe('silver cyanide bath: 0.2 mol/kg Ag, 0.6 mol/kg CN', () => {
  const S = setup({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } });
  const P = S.solver.problem;
  const lib = loadLibrary();
  const G = (f: string) => findSpecies(lib, f)!.dfG * 1000;
  const T = 298.15;
  const RTln10 = R * T * LN10;
  // Constants from the library's own ΔfG° (so that the check is of the solver); the Ag(CN)3-2 step
  // is checked against Martell & Smith's log K3 (tests/fixtures/stability-constants.csv) below.
  const rows: Row[] = [
    { system: 'Ag-CN', complex: 'HCN', metal: 'H^+', ligand: 'CN^-', n: 1, j: 0, logbeta: (G('CN^-') - G('HCN')) / RTln10 },
    { system: 'Ag-CN', complex: 'Ag(CN)2^-', metal: 'Ag^+', ligand: 'CN^-', n: 2, j: 0, logbeta: (G('Ag^+') + 2 * G('CN^-') - G('Ag(CN)2^-')) / RTln10 },
    { system: 'Ag-CN', complex: 'Ag(CN)3^2-', metal: 'Ag^+', ligand: 'CN^-', n: 3, j: 0, logbeta: (G('Ag^+') + 3 * G('CN^-') - G('Ag(CN)3^2-')) / RTln10 },
  ];
  test('the library\'s Ag(CN)3-2 step is Martell & Smith\'s log K3 (fixture, recalled)', () => {
    const ms = stabilityRows('Ag-CN');
    const b = (rs: Row[], c: string) => rs.find((r) => r.complex === c)!.logbeta;
    expect(b(rows, 'Ag(CN)3^2-') - b(rows, 'Ag(CN)2^-')).toBeCloseTo(b(ms, 'Ag(CN)3^2-') - b(ms, 'Ag(CN)2^-'), 1);
  });
  test('Ag/Ag(CN)3-2 line at pH 12 matches hand Nernst with free CN- from the mass balance', () => {
    // At 0.6 mol/kg cyanide the tricyano complex borders the metal (free CN- > 1/K3 ≈ 0.12).
    // Boundary: equal shares of metal and Ag(CN)3-2. Independent: find the dissolved silver D with
    // D·(1 + s3(D)) = 0.2 (metal amount = D·s3), s3 from bisection on the free-cyanide balance.
    const diff = (E: number) => {
      const r = describePoint(P, S.solver.solve(12, E));
      return share(r, 'Ag(s)') - share(r, 'Ag(CN)3^2-');
    };
    let lo = -1.2;
    let hi = 0;
    expect(diff(lo)).toBeGreaterThan(0);
    expect(diff(hi)).toBeLessThan(0);
    for (let k = 0; k < 60; k++) {
      const mid = 0.5 * (lo + hi);
      if (diff(mid) > 0) lo = mid;
      else hi = mid;
    }
    let dlo = 0.1;
    let dhi = 0.2;
    for (let k = 0; k < 100; k++) {
      const D = 0.5 * (dlo + dhi);
      const s3 = bisectionSpeciation(rows, D, 0.6, 12).shares['Ag(CN)3^2-'];
      if (D * (1 + s3) > 0.2) dhi = D;
      else dlo = D;
    }
    const D = 0.5 * (dlo + dhi);
    const ref = bisectionSpeciation(rows, D, 0.6, 12);
    const c3 = D * ref.shares['Ag(CN)3^2-'];
    const s = RTln10 / F;
    const E0 = -(3 * G('CN^-') - G('Ag(CN)3^2-')) / F;
    const hand = E0 + s * Math.log10(c3 / ref.L ** 3);
    expect(Math.abs(0.5 * (lo + hi) - hand)).toBeLessThan(1e-5);
  });
  test('Ag(CN)2- holds the silver at pH 12, E = 0; free cyanide as the bisection solver finds; no AgCN(s) with cyanide in excess', () => {
    const r = describePoint(P, S.solver.solve(12, 0));
    const ref = bisectionSpeciation(rows, 0.2, 0.6, 12);
    expect(r.predominant).toBe('Ag(CN)2^-');
    expect(Math.abs(r.freeLigand.CN.molality / ref.freeTotal - 1)).toBeLessThan(1e-6);
    expect(Math.abs(share(r, 'Ag(CN)3^2-') / ref.shares['Ag(CN)3^2-'] - 1)).toBeLessThan(1e-6);
    expect(r.solids).toEqual([]);
  });
});

describe('silver with as much cyanide as silver: 0.2 mol/kg each', () => {
  test('AgCN(s) appears (it never does when the total is taken as free cyanide)', () => {
    const S = setup({ element: 'Ag', composition: { Ag: 0.2, CN: 0.2 } });
    const r = describePoint(S.solver.problem, S.solver.solve(8, 0.4));
    expect(r.predominant).toBe('AgCN(s)');
    expect(r.solids.map((x) => x.species)).toContain('AgCN(s)');
    // Mass balance of silver: solids (AgCN, and here a little Ag metal) + dissolved = total.
    const solid = r.solids.reduce((a, x) => a + x.amount, 0);
    expect(solid + r.dissolved).toBeCloseTo(0.2, 12);
  });
});

describe('copper ammonia bath: 0.5 mol/kg Cu, 1 mol/kg NH3', () => {
  const S = setup({ element: 'Cu', composition: { Cu: 0.5, N: 1 } });
  const P = S.solver.problem;
  test('Cu(NH3)4+2 never predominates: at most 0.25 mol/kg of it, half the copper', () => {
    const work = new Float64Array(P.species.length);
    const k4 = P.species.findIndex((s) => s.formula === 'Cu(NH3)4^2+');
    for (let i = 0; i <= 28; i++) {
      for (let j = 0; j <= 20; j++) {
        const sol = S.solver.solve(i * 0.5, -1 + j * 0.1);
        expect(sol.status).toBe('ok');
        expect(predominantIndex(P, sol, work)).not.toBe(k4);
        expect(sol.m[k4]).toBeLessThanOrEqual(0.25 * (1 + 1e-9));
      }
    }
  });
  test('CuO precipitates in the ammoniacal range where the fixed-activity diagram shows the complex', () => {
    const r = describePoint(P, S.solver.solve(10, 0.3));
    expect(r.predominant).toBe('CuO(s)');
    expect(r.freeLigand.N.molality).toBeGreaterThan(0);
    expect(r.saturation.every((s) => s.logSI <= 1e-9)).toBe(true);
  });
});

describe('failure is reported, never answered', () => {
  test('cyanide with nowhere to go (only Ag(CN)2- holds it) has no equilibrium: status failed with the reason', () => {
    // 0.6 mol/kg CN would need 0.3 mol/kg Ag(CN)2-, more than the 0.2 mol/kg of silver.
    const full = setup({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }).solver.problem;
    const keep = full.species.filter((s) => s.formula === 'Ag^+' || s.formula === 'Ag(CN)2^-');
    const P = speciationProblem(['Ag', 'CN'], [0.2, 0.6], keep, { kelvin: 298.15, G_H2O: -237140, G_H2: 0, logWaterActivity: 0 }, -14);
    const solver = pointSolver(P, { model: 'ideal', A: 0.5, B: 0.33, ionSize: 4, ionicStrength: 0 });
    const sol = solver.solve(10, 0.2);
    expect(sol.status).toBe('failed');
    expect(sol.reason).toMatch(/diverge|line search|convergence|singular/);
    const r = describePoint(P, sol);
    expect(r.predominant).toBeUndefined();
    expect(r.speciation).toEqual([]);
  });
  test('a Newton budget too small without the fallback reports the iteration limit', () => {
    const S = compositionSetup(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'b.yaml'), { newton: { maxIterations: 1, tol: 1e-11, maxStep: 2 }, noFallback: true });
    const sol = S.solver.solve(12, 0);
    expect(sol.status).toBe('failed');
    expect(sol.reason).toMatch(/no convergence in 1 Newton/);
  });
  test('the fallback rescues the same budget-starved start', () => {
    const S = compositionSetup(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'b.yaml'), { newton: { maxIterations: 1, tol: 1e-11, maxStep: 2 } });
    expect(S.solver.solve(12, 0).status).toBe('ok');
  });
});

describe('ionic strength from the composition (ionicStrength: auto)', () => {
  test('I is consistent with the speciation it produces (Davies)', () => {
    const S = setup({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, ionicStrength: 'auto' });
    const sol = S.solver.solve(12, 0);
    expect(sol.status).toBe('ok');
    // Bounds by stoichiometry: all silver as Ag(CN)2- (0.2 + 0.2 free CN- + 0.4 K+): I ≈ 0.41;
    // all as Ag(CN)3-2 (0.2 at z = −2, no free CN-, 0.4 K+): I = 0.6.
    expect(sol.ionicStrength).toBeGreaterThan(0.40);
    expect(sol.ionicStrength).toBeLessThan(0.61);
    // I recomputed from the speciation it produced: ½ Σ m z², H+ and OH- from pH, and singly
    // charged spectators balancing the net charge (the documented rule).
    const Q = S.solver.problem;
    let sum = 0;
    let q = 0;
    for (let i = 0; i < Q.nAq; i++) {
      sum += sol.m[i] * Q.charge[i] ** 2;
      q += sol.m[i] * Q.charge[i];
    }
    const k = Q.species.findIndex((s) => s.formula === 'CN^-');
    const mH = 10 ** (-12 - sol.logGamma[k]);
    const mOH = 10 ** (Q.logKw + 12 - sol.logGamma[k]);
    const I = 0.5 * (sum + mH + mOH) + 0.5 * Math.abs(q + mH - mOH);
    expect(Math.abs(sol.ionicStrength / I - 1)).toBeLessThan(1e-6);
    // Davies (common practice), A ≈ 0.51 at 25 °C: log γ(z = −1) = −A(√I/(1 + √I) − 0.3 I).
    const davies = -0.5100 * (Math.sqrt(I) / (1 + Math.sqrt(I)) - 0.3 * I);
    expect(Math.abs(sol.logGamma[k] - davies)).toBeLessThan(0.002);
  });
});
