import { describe, expect, it } from 'vitest';
import { LibraryError, validateSpeciesFile } from '../../src/data/library.js';

const H = { a1: 4.032, a2: 4.801, a3: 5.563, a4: -2.847, c1: -4.4, c2: -5.714, omega: 1.456, source: 'X', recalled: true };
const file = (sp: Record<string, unknown>) => ({ element: 'Cl', sources: { X: 'a citation' }, species: [{ formula: 'Cl-', phase: 'aq', name: 'chloride', dfG: -131.2, S: 56.5, source: 'X', ...sp }] });

describe('hkf and cpPolynomial blocks in species files', () => {
  it('accepts a complete hkf block on an aqueous species and keeps it', () => {
    expect(validateSpeciesFile('Cl.json', file({ hkf: H }))[0]!.hkf).toMatchObject({ omega: 1.456 });
  });
  it('refuses a missing parameter, an unknown key, an unknown source, naming the field', () => {
    const { omega: _o, ...noOmega } = H;
    expect(() => validateSpeciesFile('Cl.json', file({ hkf: noOmega }))).toThrow(/species\[0\] \(Cl-\)\.hkf\.omega: required/);
    expect(() => validateSpeciesFile('Cl.json', file({ hkf: { ...H, w: 1 } }))).toThrow(/hkf\.w: unknown field/);
    expect(() => validateSpeciesFile('Cl.json', file({ hkf: { ...H, source: 'Y' } }))).toThrow(LibraryError);
  });
  it('refuses hkf on a solid and cpPolynomial on an aqueous species', () => {
    const solid = { element: 'Zn', sources: { X: 'c' }, species: [{ formula: 'ZnO', phase: 's', name: 'zincite', dfG: -320.5, source: 'X', hkf: H }] };
    expect(() => validateSpeciesFile('Zn.json', solid)).toThrow(/only aqueous species take HKF/);
    expect(() => validateSpeciesFile('Cl.json', file({ cpPolynomial: { a: 1, b: 0, c: 0, source: 'X' } }))).toThrow(/cpPolynomial/);
  });
});
