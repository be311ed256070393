/**
 * A one-element "alloy" must give exactly the single-element answer (issue 18): the LP's assemblage is
 * the predominant species of the single-element point solver (src/solve/probe.ts) at every point, and
 * on the exact boundaries of the single-element solver (src/solve/solve.ts) the LP reports the tie, so
 * its boundaries lie within 1e-9 V of them. Data: the built-in library (its sources are in species/).
 */
import { describe, expect, it } from 'vitest';
import { assemblageAt } from '../../../src/solve/alloy/assemblage.js';
import type { AlloyInput } from '../../../src/solve/alloy/types.js';
import { psiAt } from '../../../src/solve/point.js';
import { solve } from '../../../src/solve/solve.js';
import type { SolverInput } from '../../../src/solve/types.js';
import { buildSystem } from '../../../src/system/build.js';
import { readSpec } from '../../../src/system/spec.js';

function single(data: Record<string, unknown>): SolverInput {
  return buildSystem(readSpec(data, 'test.yaml')).input;
}
function asAlloy(input: SolverInput): AlloyInput {
  const { element, ...rest } = input;
  return { ...rest, composition: { [element]: 1 } };
}
/** Deterministic pseudo-random numbers (LCG, Numerical Recipes constants). */
function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32);
}

const cases: [string, Record<string, unknown>][] = [
  ['Fe, 25 °C, a = 1e-6', { element: 'Fe', activity: 1e-6 }],
  ['Cu–S, 25 °C', { element: 'Cu', activity: 1e-6, ligands: { S: 1e-3 } }],
  ['Zn, 25 °C, a = 1e-4', { element: 'Zn', activity: 1e-4 }],
  ['Ni, 80 °C', { element: 'Ni', temperature: 80, activity: 1e-6 }],
];

describe.each(cases)('one-element alloy equals the single-element solver: %s', (_name, data) => {
  const input = single(data);
  const alloy = asAlloy(input);
  const el = input.element;

  it('same species at 400 random points (margin > 1e-6 kJ/mol)', () => {
    const r = rng(18);
    let checked = 0;
    for (let k = 0; k < 400; k++) {
      const pH = input.pH[0] + r() * (input.pH[1] - input.pH[0]);
      const E = input.E[0] + r() * (input.E[1] - input.E[0]);
      const { psi } = psiAt(input, pH, E);
      const order = psi.map((v, i) => [v, i] as const).sort((a, b) => a[0] - b[0]);
      if (order[1][0] - order[0][0] < 1e-6) continue;
      const a = assemblageAt(alloy, pH, E);
      expect(a.phases.map((p) => p.formula)).toEqual([input.species[order[0][1]].formula]);
      expect(a.phases[0].share[el]).toBeCloseTo(1, 12);
      expect(a.phases[0].amount * (input.species[order[0][1]].elements[el] ?? 0)).toBeCloseTo(1, 12);
      expect(a.ties).toEqual([]);
      checked++;
    }
    expect(checked).toBeGreaterThan(390);
  });

  it('label changes found by bisection in E lie on the exact boundaries within 1e-9 V', () => {
    const sol = solve(input);
    const exactE = (pH: number, a: string, b: string): number[] =>
      sol.boundaries
        .filter((bd) => bd.between.includes(a) && bd.between.includes(b))
        .flatMap((bd) => bd.points.slice(1).map((p, k) => [bd.points[k], p] as const))
        .filter(([p, q]) => (p[0] - pH) * (q[0] - pH) <= 0 && p[0] !== q[0])
        .map(([p, q]) => p[1] + ((pH - p[0]) / (q[0] - p[0])) * (q[1] - p[1]));
    let checked = 0;
    for (const pH of [1.3, 4.7, 7.1, 9.9, 12.6]) {
      let prev = assemblageAt(alloy, pH, input.E[0]).label;
      for (let E = input.E[0]; E <= input.E[1]; E += 0.02) {
        const here = assemblageAt(alloy, pH, E).label;
        if (here === prev) continue;
        let lo = E - 0.02;
        let hi = E;
        while (hi - lo > 1e-13) {
          const mid = (lo + hi) / 2;
          if (assemblageAt(alloy, pH, mid).label === prev) lo = mid;
          else hi = mid;
        }
        const candidates = exactE(pH, prev, here);
        expect(candidates.length).toBeGreaterThan(0);
        expect(Math.min(...candidates.map((e) => Math.abs(e - lo)))).toBeLessThan(1e-9);
        checked++;
        prev = here;
      }
    }
    expect(checked).toBeGreaterThan(2);
  });

  it('on every exact single-element boundary the LP reports the two species as tied (boundary within 1e-9 V)', () => {
    const sol = solve(input);
    let checked = 0;
    for (const b of sol.boundaries) {
      for (let k = 0; k + 1 < b.points.length; k++) {
        const pH = (b.points[k][0] + b.points[k + 1][0]) / 2;
        const E = (b.points[k][1] + b.points[k + 1][1]) / 2;
        const a = assemblageAt(alloy, pH, E);
        const seen = new Set([...a.phases.map((p) => p.formula), ...a.ties]);
        // The LP's tie tolerance is 1e-9 kJ/mol, i.e. ≤ 1e-9 kJ / (n F) ≈ 1e-11 V off the line.
        expect(seen.has(b.between[0]) && seen.has(b.between[1])).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(3);
  });
});
