/**
 * Iron with seven inline species at 25, 150 and 250 °C: the program's answer at points must equal an
 * independent hand calculation by the Nernst route (each species reduced to Fe(s), E° from ΔrG° at
 * T with the SHE at T), except within 0.5 mV of a boundary; and every JSON polygon vertex must lie on
 * an exact boundary (two species tied within 0.1 mV) or on the domain edge.
 * The hand formula is the constant-Cp one, so the system file asks for `extrapolation: cp` (the
 * default 'best' carries ions by the HKF equation of state; see tests/thermo/species-model.test.ts).
 * Data: Wagman et al. (1982) NBS tables, J. Phys. Chem. Ref. Data 11 Suppl. 2 — recalled from memory.
 */
import { describe, expect, it } from 'vitest';
import { computeFile } from '../../src/pipeline.js';
import { psiAt } from '../../src/solve/point.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const F = 96485.33212; // CODATA 2018
const R = 8.314462618; // CODATA 2018
const Tr = 298.15;

const SPECIES = [
  { formula: 'Fe', phase: 's', dfG: 0, dfH: 0, S: 27.28, Cp: 25.1, Fe: 1, O: 0, H: 0, z: 0 },
  { formula: 'Fe+2', phase: 'aq', dfG: -78.9, dfH: -89.1, S: -137.7, Fe: 1, O: 0, H: 0, z: 2 },
  { formula: 'Fe+3', phase: 'aq', dfG: -4.7, dfH: -48.5, S: -315.9, Fe: 1, O: 0, H: 0, z: 3 },
  { formula: 'FeOH+2', phase: 'aq', dfG: -229.41, dfH: -290.8, S: -142.0, Fe: 1, O: 1, H: 1, z: 2 },
  { formula: 'Fe3O4', phase: 's', dfG: -1015.4, dfH: -1118.4, S: 146.4, Cp: 143.43, Fe: 3, O: 4, H: 0, z: 0 },
  { formula: 'Fe2O3', phase: 's', dfG: -742.2, dfH: -824.2, S: 87.4, Cp: 103.85, Fe: 2, O: 3, H: 0, z: 0 },
  { formula: 'Fe(OH)2', phase: 's', dfG: -486.5, dfH: -569.0, S: 88.0, Fe: 1, O: 2, H: 2, z: 0 },
];
const H2O = { dfG: -237.129, S: 69.91, Cp: 75.291 }; // NBS 1982, recalled from memory
const H2 = { dfG: 0, S: 130.684, Cp: 28.824 }; // NBS 1982, recalled from memory

/** Hand formula: G(T) = ΔfG° − S°ΔT + Cp[ΔT − T ln(T/Tr)], kJ/mol. */
function G(d: { dfG: number; S: number; Cp?: number }, T: number): number {
  const dT = T - Tr;
  return d.dfG - (d.S * dT) / 1000 + ((d.Cp ?? 0) * (dT - T * Math.log(T / Tr))) / 1000;
}

/** Hand answer: argmin of n·F·(E_X(pH) − E)/x over species (Fe(s) scores 0). */
function handAnswer(T: number, a: number, pH: number, E: number): { best: string; gapMV: number } {
  const s = (Math.LN10 * R * T) / F;
  const scores = SPECIES.map((X) => {
    if (X.formula === 'Fe') return { f: X.formula, v: 0, n: 1, x: 1 };
    const m = 2 * X.O - X.H;
    const n = m + X.z;
    const dG = (X.Fe * G(SPECIES[0], T) + X.O * G(H2O, T) - G(X, T) - (n / 2) * G(H2, T)) * 1000;
    const E0 = -dG / (n * F);
    const la = X.phase === 'aq' ? Math.log10(a) : 0;
    const EX = E0 + (s / n) * la - (m / n) * s * pH;
    return { f: X.formula, v: (n * F * (EX - E)) / X.Fe, n, x: X.Fe };
  });
  scores.sort((p, q) => p.v - q.v);
  // Gap expressed as a potential: ψ difference over the larger n/x (J/mol per V·F).
  const gap = (scores[1].v - scores[0].v) / (F * Math.max(...scores.slice(0, 2).map((q) => q.n / q.x)));
  return { best: scores[0].f, gapMV: gap * 1000 };
}

function systemFile(t: number): string {
  const dir = tmpDir();
  const sp = SPECIES.map(({ formula, phase, dfG, dfH, S, Cp }) => ({ formula, phase, dfG, dfH, S, ...(Cp ? { Cp } : {}), source: 'NBS 1982 (recalled from memory)' }));
  return writeTmp(dir, `fe-${t}.json`, JSON.stringify({ element: 'Fe', temperature: t, extrapolation: 'cp', activity: 1e-6, pH: [0, 14], E: [-1.4, 1.6], species: sp }));
}

describe.each([25, 150, 250])('iron, seven inline species at %i °C', (t) => {
  const c = computeFile(systemFile(t));
  const T = t + 273.15;

  it('predominant species equals the hand calculation everywhere except within 0.5 mV of a boundary', () => {
    let compared = 0;
    for (let i = 0; i <= 56; i++) {
      for (let j = 0; j <= 60; j++) {
        const pH = 0.05 + (13.9 * i) / 56;
        const E = -1.39 + (2.98 * j) / 60;
        const hand = handAnswer(T, 1e-6, pH, E);
        if (hand.gapMV < 0.5) continue;
        const { psi } = psiAt(c.built.input, pH, E);
        const k = psi.indexOf(Math.min(...psi));
        expect(c.built.input.species[k].formula, `pH ${pH}, E ${E}`).toBe(hand.best);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(3000);
  });

  it('every polygon vertex lies on an exact boundary or the domain edge', () => {
    const [p0, p1] = c.model.domain.pH;
    const [e0, e1] = c.model.domain.E;
    for (const r of c.model.regions) {
      for (const poly of r.polygons) {
        for (const ring of poly) {
          for (const [pH, E] of ring) {
            const onEdge = Math.min(Math.abs(pH - p0), Math.abs(pH - p1)) < 1e-9 || Math.min(Math.abs(E - e0), Math.abs(E - e1)) < 1e-9;
            if (onEdge) continue;
            const { psi } = psiAt(c.built.input, pH, E);
            const sorted = [...psi].sort((a, b) => a - b);
            // Tie within 0.1 mV: ψ per Fe differs by at most n·F·1e-4 V, n ≤ 8/3 per Fe here.
            expect(sorted[1] - sorted[0]).toBeLessThan((3 * F * 1e-4) / 1000);
          }
        }
      }
    }
  });

  it('regions tile the domain', () => {
    const area = c.model.regions.reduce((s, r) => s + r.area, 0);
    expect(area).toBeCloseTo(14 * 3.0, 9);
  });
});

describe('temperature without entropy data', () => {
  it('a species with only ΔfG° is kept at 150 °C as undetermined, named in the warnings (tests/system/undetermined-species.test.ts)', async () => {
    const dir = tmpDir();
    const f = writeTmp(dir, 'x.json', JSON.stringify({ element: 'Fe', temperature: 150, species: [{ formula: 'Fe', phase: 's', dfG: 0, S: 27.28 }, { formula: 'HFeO2-', phase: 'aq', dfG: -377.7 }] }));
    const c = computeFile(f);
    expect(c.model.regions.find((r) => r.species === 'HFeO2-')?.undetermined).toBe(true);
    expect(c.model.warnings.join(' ')).toMatch(/undetermined.*HFeO2-/);
  });
});

describe('explicit override for species with ΔfG° only', () => {
  it('assumeConstantG keeps HFeO2- at 150 °C with its 25 °C ΔfG° and says so', () => {
    const dir = tmpDir();
    const f = writeTmp(dir, 'y.json', JSON.stringify({ element: 'Fe', temperature: 150, assumeConstantG: ['HFeO2-'], species: [{ formula: 'Fe', phase: 's', dfG: 0, S: 27.28 }, { formula: 'HFeO2-', phase: 'aq', dfG: -377.7 }] }));
    const c = computeFile(f);
    expect(c.built.input.species.find((s) => s.formula === 'HFeO2-')!.G).toBe(-377.7);
    expect(c.model.warnings.join(' ')).toMatch(/constant with temperature.*HFeO2-/);
  });
});
