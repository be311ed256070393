/**
 * Speciation profile of the silver cyanide bath along pH at −0.3 V: shares sum to one; the HCN
 * acid–base step moves Ag(CN)2- to metal where cyanide is protonated (pKa 9.2, Martell & Smith,
 * recalled); the profile agrees with the point solver at each point.
 */
import { describe, expect, test } from 'vitest';
import { compositionSetup, speciationAt } from '../../src/diagram/composition-setup.js';
import { speciationProfile } from '../../src/diagram/composition-profile.js';
import { readSpec } from '../../src/system/spec.js';
import { bisectionSpeciation, stabilityRows } from '../helpers/stability.js';

describe('speciation profile', () => {
  const S = compositionSetup(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'bath.yaml'));
  const prof = speciationProfile(S, 'pH', -0.3, [2, 14], 61);
  test('shares of the element sum to 1 at every point; no failures', () => {
    expect(prof.failed).toEqual([]);
    for (let k = 0; k < prof.x.length; k++) {
      const sum = prof.forms.reduce((a, f) => a + f.share[k], 0);
      expect(sum).toBeGreaterThan(1 - 1e-3);
      expect(sum).toBeLessThanOrEqual(1 + 1e-9);
    }
  });
  test('metal where cyanide is protonated, the complex well above its pKa', () => {
    const at = (pH: number, sp: string) => prof.forms.find((f) => f.species === sp)!.share[prof.x.findIndex((x) => Math.abs(x - pH) < 1e-9)];
    expect(at(4, 'Ag')).toBeGreaterThan(0.99);
    // Well above the pKa the cyanide complexes hold the silver, split between Ag(CN)2- and
    // Ag(CN)3-2 as the independent bisection solver finds with Martell & Smith's constants
    // (tests/fixtures/stability-constants.csv, recalled; log K3 = 0.92).
    expect(at(14, 'Ag(CN)2^-') + at(14, 'Ag(CN)3^2-')).toBeGreaterThan(0.99);
    const ref = bisectionSpeciation(stabilityRows('Ag-CN'), 0.2, 0.6, 14).shares;
    expect(at(14, 'Ag(CN)3^2-')).toBeCloseTo(ref['Ag(CN)3^2-'], 2);
    expect(at(14, 'Ag(CN)2^-')).toBeCloseTo(ref['Ag(CN)2^-'], 2);
  });
  test('each profile point is the point solver’s answer', () => {
    for (const k of [0, 17, 40, 60]) {
      const r = speciationAt(S, prof.x[k], -0.3);
      for (const f of prof.forms) {
        const name = f.phase === 'aq' ? f.species : `${f.species}(${f.phase})`;
        const s = r.shares.Ag.find((q) => q.species === name)?.share ?? 0;
        expect(Math.abs(s - f.share[k])).toBeLessThan(1e-9);
      }
    }
  });
});
