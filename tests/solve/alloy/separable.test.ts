/**
 * Without a mixed compound the elements do not interact: the minimum of Σ n_k ψ'_k splits into one
 * minimum per element, so the assemblage must be each element's own single-element predominant
 * species (src/solve/probe.ts), with n = X_e / x_e (issue 18: a boundary where no mixed compound
 * exists is the single-element boundary of the element that changes). Cu–Zn (brass; the library has
 * no Cu–Zn compound) and Fe–Ni without trevorite, with and without sulfur as a ligand.
 * Data: the built-in library (NBS 1982; recalled).
 */
import { describe, expect, it } from 'vitest';
import { assemblageAt } from '../../../src/solve/alloy/assemblage.js';
import { psiAt } from '../../../src/solve/point.js';
import { buildAlloySystem } from '../../../src/system/alloy-build.js';
import { readAlloySpec } from '../../../src/system/alloy-spec.js';
import { buildSystem } from '../../../src/system/build.js';
import { readSpec } from '../../../src/system/spec.js';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32);
}

const cases: [string, Record<string, number>, Record<string, unknown>][] = [
  ['Cu 0.7 Zn 0.3', { Cu: 0.7, Zn: 0.3 }, {}],
  ['Cu 0.7 Zn 0.3 with S 1e-3', { Cu: 0.7, Zn: 0.3 }, { ligands: { S: 1e-3 } }],
  ['Fe 0.6 Ni 0.4 without NiFe2O4', { Fe: 0.6, Ni: 0.4 }, { exclude: ['NiFe2O4'] }],
];

describe.each(cases)('%s: assemblage = each element\'s own predominant species', (_n, elements, extra) => {
  const alloy = buildAlloySystem(readAlloySpec({ elements, activity: 1e-6, ...extra }, 'a.yaml')).input;
  const { exclude: _x, ...oneExtra } = extra as { exclude?: string[] };
  const singles = Object.keys(elements).map((el) => buildSystem(readSpec({ element: el, activity: 1e-6, ...oneExtra }, 'b.yaml')).input);

  it('no mixed compound in the system', () => {
    expect(alloy.species.some((s) => Object.keys(elements).filter((e) => s.elements[e]).length > 1)).toBe(false);
  });

  it('200 points: same species and amounts X_e / x_e', () => {
    const r = rng(1995);
    let checked = 0;
    for (let k = 0; k < 200; k++) {
      const pH = r() * 14;
      const E = -2 + r() * 4;
      const expected: { formula: string; amount: number }[] = [];
      let clear = true;
      for (const one of singles) {
        const { psi } = psiAt(one, pH, E);
        const order = psi.map((v, i) => [v, i] as const).sort((a, b) => a[0] - b[0]);
        if (order[1][0] - order[0][0] < 1e-6) clear = false;
        const sp = one.species[order[0][1]];
        expected.push({ formula: sp.formula, amount: elements[one.element] / sp.elements[one.element] });
      }
      if (!clear) continue;
      const a = assemblageAt(alloy, pH, E);
      const got = a.phases.map((p) => ({ formula: p.formula, amount: p.amount }));
      expect(got.map((g) => g.formula).sort()).toEqual(expected.map((g) => g.formula).sort());
      for (const g of got) expect(g.amount).toBeCloseTo(expected.find((x) => x.formula === g.formula)!.amount, 12);
      expect(a.ties).toEqual([]);
      checked++;
    }
    expect(checked).toBeGreaterThan(190);
  });
});
