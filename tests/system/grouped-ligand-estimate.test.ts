/**
 * Regression: a library species that holds a group ligand (CN counted as one unit by the build
 * step) and has ΔfG° only must get an estimated S° away from 25 °C like any other library species —
 * not fall to "undetermined" because the estimator was handed the grouped composition {Ag: 1, CN: 3}.
 * (Found in a user trial: Ag(CN)3^2- was undetermined at 60 °C in a silver cyanide bath.)
 */
import { describe, expect, it } from 'vitest';
import { buildSystem } from '../../src/system/build.js';
import { readSpec } from '../../src/system/spec.js';

describe('group ligands and the S° estimate', () => {
  it('Ag(CN)3^2- in Ag–CN at 60 °C is carried with estimated data, not undetermined', () => {
    const b = buildSystem(readSpec({ element: 'Ag', temperature: 60, ligands: { CN: 1e-2 } }, 'agcn.yaml'));
    const sp = b.input.species.find((s) => s.formula === 'Ag(CN)3^2-');
    expect(sp).toBeDefined();
    expect(sp!.temperatureModel).not.toBe('undetermined');
    expect(sp!.estimated).toBe(true);
    expect(Number.isFinite(sp!.G)).toBe(true);
    expect(b.warnings.join('\n')).not.toMatch(/undetermined/);
  });
});
