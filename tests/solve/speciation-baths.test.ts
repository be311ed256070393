/**
 * The two baths of issue 13, through the library's species, and the solver's failure report.
 * Outside checks: hand Nernst for Ag(CN)₂⁻ + e⁻ = Ag + 2 CN⁻ with the free cyanide from the mass
 * balance (common practice; ΔfG° from the library's own files, so that the check is of the solver);
 * mass balance bound: 1 mol/kg NH₃ can hold at most 0.25 mol/kg as Cu(NH₃)₄²⁺ (stoichiometry).
 */
import { describe, expect, test } from 'vitest';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { describePoint, pointSolver, predominantIndex, speciationProblem } from '../../src/solve/speciation/index.js';
import { readSpec } from '../../src/system/spec.js';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { F, LN10, R } from '../../src/thermo/constants.js';

const setup = (o: Record<string, unknown>) => compositionSetup(readSpec(o, 'bath.yaml'));
const share = (r: ReturnType<typeof describePoint>, sp: string, c?: string) => (r.shares[c ?? Object.keys(r.shares)[0]].find((x) => x.species === sp)?.share ?? 0);

describe('silver cyanide bath: 0.2 mol/kg Ag, 0.6 mol/kg CN', () => {
  const S = setup({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } });
  const P = S.solver.problem;
  test('Ag/Ag(CN)2- line at pH 12 matches hand Nernst with free CN- from the mass balance', () => {
    // Boundary: equal shares, so half the silver is metal: [Ag(CN)2-] = 0.1, free cyanide 0.6 − 0.2 = 0.4.
    const diff = (E: number) => {
      const r = describePoint(P, S.solver.solve(12, E));
      return share(r, 'Ag(s)') - share(r, 'Ag(CN)2-');
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
    const lib = loadLibrary();
    const G = (f: string) => findSpecies(lib, f)!.dfG * 1000;
    const T = 298.15;
    const s = (LN10 * R * T) / F;
    const pKa = (G('CN-') - G('HCN')) / (R * T * LN10);
    const cn = 0.4 / (1 + 10 ** (pKa - 12));
    const E0 = -(2 * G('CN-') - G('Ag(CN)2-')) / F;
    const hand = E0 + s * Math.log10(0.1 / cn ** 2);
    expect(Math.abs(0.5 * (lo + hi) - hand)).toBeLessThan(1e-5);
  });
  test('Ag(CN)2- holds the silver at pH 12, E = 0; no AgCN(s) with cyanide in excess', () => {
    const r = describePoint(P, S.solver.solve(12, 0));
    expect(r.predominant).toBe('Ag(CN)2-');
    expect(r.freeLigand.CN.molality).toBeCloseTo(0.2, 9);
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
    const k4 = P.species.findIndex((s) => s.formula === 'Cu(NH3)4+2');
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
    const keep = full.species.filter((s) => s.formula === 'Ag+' || s.formula === 'Ag(CN)2-');
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
    // 0.2 Ag(CN)2- + 0.2 CN- (+ OH- ≈ 0.01 mol/kg) with 0.4 mol/kg K+ balancing: I ≈ 0.41.
    expect(sol.ionicStrength).toBeGreaterThan(0.40);
    expect(sol.ionicStrength).toBeLessThan(0.43);
    const k = S.solver.problem.species.findIndex((s) => s.formula === 'CN-');
    expect(sol.logGamma[k]).toBeLessThan(-0.1);
  });
});
