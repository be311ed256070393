/**
 * Activity families solve once on the built system with only the element's dissolved activities
 * changed; the lines must be exactly those of the whole pipeline re-run at that activity.
 */
import { describe, expect, it } from 'vitest';
import { atActivity } from '../../src/figure/compose.js';
import { compute, familyBoundaries } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const cases: [string, Record<string, unknown>][] = [
  ['iron at 25 °C', { element: 'Fe' }],
  ['iron at 150 °C', { element: 'Fe', temperature: 150 }],
  ['copper with sulfur', { element: 'Cu', ligands: { S: 1e-3 } }],
  ['iron in brine (molality, γ corrected)', { element: 'Fe', temperature: 200, concentration: 1e-6, background: { NaCl: 0.5 }, ligands: { Cl: '0.5 mol/kg' } }],
  ['zinc with ionic strength, default amount', { element: 'Zn', ionicStrength: 0.3 }],
];

describe('familyBoundaries', () => {
  for (const [name, data] of cases) {
    it(`equals a full recomputation: ${name}`, () => {
      const spec = readSpec(data, `${name}.yaml`);
      const c = compute(spec);
      for (const a of [1e-8, 1e-4, 1e-2]) {
        expect(familyBoundaries(c, a)).toEqual(compute(atActivity(spec, a)).model.boundaries);
      }
    });
  }

  it('changes the lines it should: Fe²⁺/Fe moves by s/2 per decade (Nernst)', () => {
    const c = compute(readSpec({ element: 'Fe' }, 'fe.yaml'));
    const at = (a: number) => familyBoundaries(c, a).find((b) => b.between.includes('Fe') && b.between.includes('Fe^2+'))!.points[0][1];
    // 0.05916/2 V per decade of a(Fe²⁺) at 25 °C (Nernst slope ln10·RT/F, CODATA 2018 constants).
    expect(at(1e-4) - at(1e-6)).toBeCloseTo(2 * 0.0591593 / 2, 4);
  });
});
