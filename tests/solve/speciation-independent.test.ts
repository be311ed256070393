/**
 * Composition-mode speciation against an independent solver written here (plain bisection on the
 * free-ligand balance, tests/helpers/stability.ts) with overall stability constants from Martell &
 * Smith, Critical Stability Constants (tests/fixtures/stability-constants.csv, recalled): free
 * ligand and shares of the element within 1e-6 relative.
 */
import { describe, expect, test } from 'vitest';
import { pointSolver } from '../../src/solve/speciation/point.js';
import { speciationProblem } from '../../src/solve/speciation/problem.js';
import { describePoint } from '../../src/solve/speciation/describe.js';
import { AMMONIA, bisectionSpeciation, CYANIDE, G_H2O, type LigandDef, PKW, speciesFromConstants, stabilityRows } from '../helpers/stability.js';

const water = { kelvin: 298.15, G_H2O: G_H2O * 1000, G_H2: 0, logWaterActivity: 0 };

function check(system: string, metal: string, zM: number, L: LigandDef, MT: number, LT: number, pHs: number[]) {
  const rows = stabilityRows(system);
  const species = speciesFromConstants(rows, metal, zM, L, 50, 120);
  const P = speciationProblem([metal, L.comp], [MT, LT], species, water, -PKW);
  const solver = pointSolver(P, { model: 'ideal', A: 0.5, B: 0.33, ionSize: 4, ionicStrength: 0 });
  for (const pH of pHs) {
    const r = describePoint(P, solver.solve(pH, 0.1));
    expect(r.status).toBe('ok');
    const ref = bisectionSpeciation(rows, MT, LT, pH);
    const free = r.speciation.find((s) => s.species === L.free)!.molality;
    expect(Math.abs(free / ref.L - 1), `free ${L.free} at pH ${pH}`).toBeLessThan(1e-6);
    expect(Math.abs(r.freeLigand[L.comp].molality / ref.freeTotal - 1)).toBeLessThan(1e-6);
    const shares = Object.fromEntries(r.shares[metal].map((s) => [s.species, s.share]));
    for (const [k, v] of Object.entries(ref.shares)) {
      const name = k === 'free' ? species[0].formula : k;
      if (v < 1e-12) continue;
      expect(Math.abs((shares[name] ?? 0) / v - 1), `${name} at pH ${pH}`).toBeLessThan(1e-6);
    }
  }
}

describe('speciation vs bisection on the free-ligand balance (Martell & Smith constants, recalled)', () => {
  test('Ag–CN: 0.2 mol/kg Ag, 0.6 mol/kg CN (the silver bath)', () => check('Ag-CN', 'Ag', 1, CYANIDE, 0.2, 0.6, [4, 8, 9.21, 10.5, 12, 13.5]));
  test('Ag–CN: cyanide short of the metal (0.2 Ag, 0.25 CN)', () => check('Ag-CN', 'Ag', 1, CYANIDE, 0.2, 0.25, [7, 11]));
  test('Cu–NH3: 0.5 mol/kg Cu, 1 mol/kg NH3 (solids left out here)', () => check('Cu-NH3', 'Cu', 2, AMMONIA, 0.5, 1, [3, 7, 9.24, 11]));
  test('Zn–OH/CN: 0.01 mol/kg Zn, 0.05 mol/kg CN', () => check('Zn-CN', 'Zn', 2, CYANIDE, 0.01, 0.05, [6, 9, 11, 12.5, 13.5]));
  test('Ni–NH3: 0.1 mol/kg Ni, 1 mol/kg NH3', () => check('Ni-NH3', 'Ni', 2, AMMONIA, 0.1, 1, [5, 8, 9.5, 11]));
});
