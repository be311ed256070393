/**
 * Fe–Cr at 25 °C (issue 18): the LP's assemblage equals an independent brute-force minimisation at
 * 200 pseudo-random points — every set of #elements species whose columns hold the bulk composition
 * with non-negative amounts is solved directly (Cramer's rule, written here), and the lowest grand
 * potential wins. Ties (two supports within 1e-9 kJ) must be reported by the LP, not hidden.
 * Data: the built-in library (NBS 1982 for Fe and Cr species; chromite from Robie & Hemingway 1995),
 * all recalled values; the check is of the minimisation, not of the data.
 */
import { describe, expect, it } from 'vitest';
import { assemblageAt } from '../../../src/solve/alloy/assemblage.js';
import { speciesPotentialsAt } from '../../../src/solve/alloy/psi.js';
import type { AlloyInput } from '../../../src/solve/alloy/types.js';
import { buildAlloySystem } from '../../../src/system/alloy-build.js';
import { readAlloySpec } from '../../../src/system/alloy-spec.js';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32);
}

/** Amounts of a 2-species support holding b (Cramer's rule), or null if singular/negative. */
function hold2(a: number[], c: number[], b: number[]): [number, number] | null {
  const det = a[0] * c[1] - a[1] * c[0];
  if (Math.abs(det) < 1e-12) return null;
  const x = (b[0] * c[1] - b[1] * c[0]) / det;
  const y = (a[0] * b[1] - a[1] * b[0]) / det;
  return x >= -1e-12 && y >= -1e-12 ? [Math.max(0, x), Math.max(0, y)] : null;
}

/** The minimum over all feasible two-species supports: value and every support reaching it. */
function bruteForce(input: AlloyInput, pH: number, E: number): { min: number; winners: string[][] } {
  const els = Object.keys(input.composition);
  const b = els.map((e) => input.composition[e]);
  const col = input.species.map((s) => els.map((e) => s.elements[e] ?? 0));
  const { psi } = speciesPotentialsAt(input, pH, E);
  const found: { v: number; support: string[] }[] = [];
  for (let i = 0; i < col.length; i++) {
    for (let j = i + 1; j < col.length; j++) {
      const n = hold2(col[i], col[j], b);
      if (!n) continue;
      const support = [i, j].filter((_, k) => n[k] > 1e-12).map((k) => input.species[k].formula).sort();
      found.push({ v: n[0] * psi[i] + n[1] * psi[j], support });
    }
  }
  const min = Math.min(...found.map((f) => f.v));
  const winners = found.filter((f) => f.v <= min + 1e-9).map((f) => f.support);
  return { min, winners };
}

describe('Fe–Cr (Fe 0.75, Cr 0.25), 25 °C, threshold activity 1e-6: LP = brute force', () => {
  const built = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.75, Cr: 0.25 }, activity: 1e-6, pH: [0, 14], E: [-1.6, 1.6] }, 'fe-cr.yaml'));
  const input = built.input;

  it('the system holds chromite and the species of both elements', () => {
    const f = input.species.map((s) => s.formula);
    expect(f).toEqual(expect.arrayContaining(['Fe', 'Fe^2+', 'Fe3O4', 'Cr', 'Cr2O3', 'FeCr2O4']));
  });

  it('chromite appears in the assemblage somewhere in the window', () => {
    let seen = 0;
    for (let pH = 0; pH <= 14; pH += 0.5) for (let E = -1.6; E <= 1.6; E += 0.05) if (assemblageAt(input, pH, E).label.includes('FeCr2O4')) seen++;
    expect(seen).toBeGreaterThan(10);
  });

  it('200 random points: same minimum and same support (ties reported)', () => {
    const r = rng(2131);
    let ties = 0;
    for (let k = 0; k < 200; k++) {
      const pH = r() * 14;
      const E = -1.6 + r() * 3.2;
      const lp = assemblageAt(input, pH, E);
      const bf = bruteForce(input, pH, E);
      expect(lp.grandPotential).toBeCloseTo(bf.min, 9);
      const supports = new Set(bf.winners.map((w) => w.join(' + ')));
      const mine = lp.phases.map((p) => p.formula).sort().join(' + ');
      expect(supports.has(mine)).toBe(true);
      if (supports.size > 1) {
        ties++;
        expect(lp.ties.length).toBeGreaterThan(0);
      } else {
        expect(lp.ties).toEqual([]);
      }
    }
    expect(ties).toBe(0); // random points fall inside regions; boundaries are tested below
  });

  it('on boundaries (bisected in E to 1e-13 V at 8 pH values) both find several optimal supports: the LP reports the tie', () => {
    let boundaries = 0;
    for (const pH of [1, 3, 5, 7, 9, 11, 12, 13]) {
      let prev = assemblageAt(input, pH, -1.6).label;
      for (let E = -1.6; E <= 1.6; E += 0.01) {
        const here = assemblageAt(input, pH, E).label;
        if (here === prev) continue;
        let lo = E - 0.01;
        let hi = E;
        while (hi - lo > 1e-13) {
          const mid = (lo + hi) / 2;
          if (assemblageAt(input, pH, mid).label === prev) lo = mid;
          else hi = mid;
        }
        const bf = bruteForce(input, pH, lo);
        const lp = assemblageAt(input, pH, lo);
        expect(new Set(bf.winners.map((w) => w.join(' + '))).size).toBeGreaterThan(1);
        expect(lp.ties.length).toBeGreaterThan(0);
        expect(lp.grandPotential).toBeCloseTo(bf.min, 9);
        boundaries++;
        prev = here;
      }
    }
    expect(boundaries).toBeGreaterThan(20);
  });

  it('points with a bulk ratio on chromite itself (Fe:Cr = 1:2) are degenerate, not ties', () => {
    const sp = readAlloySpec({ elements: { Fe: 1, Cr: 2 }, activity: 1e-6 }, 'fe-cr2.yaml');
    expect(sp.warnings.join()).toMatch(/normalised/);
    const alloy = buildAlloySystem(sp).input;
    const a = assemblageAt(alloy, 9, -0.5);
    const bf = bruteForce(alloy, 9, -0.5);
    expect(a.grandPotential).toBeCloseTo(bf.min, 9);
    expect(bf.winners.some((w) => w.join(' + ') === a.phases.map((p) => p.formula).sort().join(' + '))).toBe(true);
  });
});
