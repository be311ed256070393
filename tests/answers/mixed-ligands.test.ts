/**
 * Issue 15, defect 1: carbonate (ligand C) plus ammonia (ligand N) must not build cyanide. A species
 * holding two separately declared ligands is only in the system when that group is itself declared
 * (`CN`) or every ligand it holds has `ligandSpecies: all` (src/system/build.ts, keepMixedLigand).
 * The scenario is cathodically protected steel (and zinc, copper) in an ordinary cooling water at
 * pH 8, −1.3 V vs Cu/CuSO4 (common practice: protection criterion region; CSE ≈ +0.316 V vs SHE).
 */
import { describe, expect, it } from 'vitest';
import { probe } from '../../src/analysis/probe.js';
import { toShe } from '../../src/analysis/points.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const hasCN = (formula: string) => /C/.test(formula.replace(/Cl|Cu|Cr|Ca|Co|Cd/g, '')) && /N(?!a|i)/.test(formula);

function at(element: string, extra: Record<string, unknown> = {}) {
  const c = compute(readSpec({ element, ligands: { C: 2.0e-3, N: 1.0e-4 }, reference: 'cse', ...extra }, `${element}.yaml`));
  const s = toShe(c.spec.operating.reference, -1.3, 25, 8, 'test', '--ref');
  return { c, r: probe(c, 8, s.E) };
}

describe('carbonate plus ammonia is not cyanide', () => {
  for (const el of ['Fe', 'Zn', 'Cu']) {
    it(`${el} at pH 8, −1.3 V vs CSE is immune, and no field or species holds C and N together`, () => {
      const { c, r } = at(el);
      expect(r.predominant).toBe(el);
      expect(r.verdict).toBe('immunity');
      expect(c.built.input.species.filter((s) => hasCN(s.formula))).toEqual([]);
      expect(c.model.regions.filter((g) => hasCN(g.species))).toEqual([]);
    });
  }

  it('keeps the cyanide complexes when the file declares the CN group', () => {
    const c = compute(readSpec({ element: 'Fe', ligands: { CN: 1.0e-4 } }, 'fe.yaml'));
    expect(c.built.input.species.some((s) => s.formula === 'Fe(CN)6^4-')).toBe(true);
  });

  it('keeps them when every ligand they hold has ligandSpecies: all', () => {
    const { c } = at('Fe', { ligandSpecies: { C: 'all', N: 'all' } });
    expect(c.built.input.species.some((s) => s.formula === 'Fe(CN)6^4-')).toBe(true);
    const half = at('Fe', { ligandSpecies: { C: 'all' } });
    expect(half.c.built.input.species.some((s) => s.formula === 'Fe(CN)6^4-')).toBe(false);
  });
});
