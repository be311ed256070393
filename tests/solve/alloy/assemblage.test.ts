/**
 * Assemblage details: ψ' worked example, shares and amounts, verdicts, ties on multi-element
 * boundaries (issue 18). Data: the built-in library (NBS 1982, Robie & Hemingway 1995; recalled).
 */
import { describe, expect, it } from 'vitest';
import { assemblageAt } from '../../../src/solve/alloy/assemblage.js';
import { speciesPotentialsAt } from '../../../src/solve/alloy/psi.js';
import type { AlloyInput } from '../../../src/solve/alloy/types.js';
import { assemblageVerdict, isMetal } from '../../../src/solve/alloy/verdict.js';
import { buildAlloySystem } from '../../../src/system/alloy-build.js';
import { readAlloySpec } from '../../../src/system/alloy-spec.js';

const R = 8.314462618; // J/(mol·K), CODATA 2018
const alloy = (data: Record<string, unknown>): AlloyInput => buildAlloySystem(readAlloySpec(data, 'a.yaml')).input;
const feCr = alloy({ elements: { Fe: 0.75, Cr: 0.25 }, activity: 1e-6 });

describe('ψ\' of a species (worked example of psi.ts)', () => {
  it('Fe+2 at a = 1e-6, 25 °C, pH 7, E = 0: ΔfG° + RT ln 1e-6 = −113.148 kJ/mol (NBS 1982 ΔfG° −78.90)', () => {
    const { psi } = speciesPotentialsAt(feCr, 7, 0);
    const k = feCr.species.findIndex((s) => s.formula === 'Fe^2+');
    expect(psi[k]).toBeCloseTo(-78.9 + (R * 298.15 * Math.log(1e-6)) / 1000, 9);
    expect(psi[k]).toBeCloseTo(-113.148, 3);
  });
});

describe('assemblage of Fe 0.75 Cr 0.25 at 25 °C', () => {
  it('amounts and shares balance every element', () => {
    for (const [pH, E] of [[2, -0.5], [8, -0.5], [11, -0.8], [13, 0.8], [5, -1.2]]) {
      const a = assemblageAt(feCr, pH, E);
      for (const el of ['Fe', 'Cr']) {
        expect(a.phases.reduce((s, p) => s + p.share[el], 0)).toBeCloseTo(1, 12);
        const atoms = a.phases.reduce((s, p) => s + p.amount * (feCr.species[p.index].elements[el] ?? 0), 0);
        expect(atoms).toBeCloseTo(feCr.composition[el], 12);
      }
    }
  });

  it('chromite with magnetite at pH 11, E = −0.5: Cr all in FeCr2O4, Fe shared (0.125 mol chromite per mol alloy)', () => {
    const a = assemblageAt(feCr, 11, -0.5);
    expect(a.label).toBe('Fe3O4 + FeCr2O4');
    const chromite = a.phases.find((p) => p.formula === 'FeCr2O4')!;
    expect(chromite.amount).toBeCloseTo(0.125, 12); // 0.25 Cr / 2
    expect(chromite.share.Cr).toBeCloseTo(1, 12);
    expect(chromite.share.Fe).toBeCloseTo(0.125 / 0.75, 12);
    expect(a.verdict).toBe('passive');
  });

  it('verdicts: immune, passive, corroding, partly corroding naming the dissolving element', () => {
    expect(assemblageAt(feCr, 7, -1.5)).toMatchObject({ verdict: 'immune', dissolving: [] });
    expect(assemblageAt(feCr, 2, -0.3)).toMatchObject({ verdict: 'corroding', dissolving: ['Fe', 'Cr'] });
    expect(assemblageAt(feCr, 5, -0.3)).toMatchObject({ verdict: 'partly-corroding', dissolving: ['Fe'] });
    expect(assemblageAt(feCr, 13, 0.8)).toMatchObject({ verdict: 'partly-corroding', dissolving: ['Cr'] });
  });

  it('on a boundary between two assemblages the LP reports the tie', () => {
    // Bisect in E at pH 11 between Fe + FeCr2O4 (below) and Fe3O4 + FeCr2O4 (above).
    let lo = -0.9;
    let hi = -0.5;
    const below = assemblageAt(feCr, 11, lo).label;
    expect(below).not.toBe(assemblageAt(feCr, 11, hi).label);
    while (hi - lo > 1e-13) {
      const mid = (lo + hi) / 2;
      if (assemblageAt(feCr, 11, mid).label === below) lo = mid;
      else hi = mid;
    }
    const a = assemblageAt(feCr, 11, lo);
    expect(a.ties.length).toBeGreaterThan(0);
    expect(assemblageAt(feCr, 11, lo - 1e-6).ties).toEqual([]);
  });
});

describe('verdict rules', () => {
  const ph = (formula: string, phase: 's' | 'aq', elements: Record<string, number>, charge: number, share: Record<string, number>) => ({ formula, phase, elements, charge, share });
  it('a metal is one element, uncharged, solid or liquid', () => {
    expect(isMetal({ phase: 's', elements: { Fe: 1 }, charge: 0 })).toBe(true);
    expect(isMetal({ phase: 's', elements: { Fe: 1, S: 1 }, charge: 0 })).toBe(false);
    expect(isMetal({ phase: 'aq', elements: { Fe: 1 }, charge: 2 })).toBe(false);
  });
  it('metal + dissolved: partly corroding (Ni immune, Fe dissolves)', () => {
    const v = assemblageVerdict([ph('Ni', 's', { Ni: 1 }, 0, { Ni: 1, Fe: 0 }), ph('Fe^2+', 'aq', { Fe: 1 }, 2, { Fe: 1, Ni: 0 })], ['Fe', 'Ni']);
    expect(v).toEqual({ verdict: 'partly-corroding', dissolving: ['Fe'] });
  });
  it('metal + oxide, nothing dissolved: passive', () => {
    const v = assemblageVerdict([ph('Fe', 's', { Fe: 1 }, 0, { Fe: 1, Cr: 0 }), ph('Cr2O3', 's', { Cr: 2, O: 3 }, 0, { Cr: 1, Fe: 0 })], ['Fe', 'Cr']);
    expect(v).toEqual({ verdict: 'passive', dissolving: [] });
  });
});
