/** The "mixed" species file: compounds of several main elements enter only alloy systems (issue 18). */
import { describe, expect, it } from 'vitest';
import { speciesForElements } from '../../src/data/alloy-species.js';
import { LibraryError, loadLibrary, speciesFor, validateSpeciesFile } from '../../src/data/library.js';

const lib = loadLibrary();
const formulas = (l: { formula: string }[]) => l.map((s) => s.formula);

describe('species/mixed.json', () => {
  it('holds the cited spinels, delafossite and molybdate, each with a source and recalled: true', () => {
    const mixed = lib.filter((s) => s.mixed);
    expect(formulas(mixed)).toEqual(expect.arrayContaining(['FeCr2O4', 'NiFe2O4', 'ZnFe2O4', 'CuFeO2', 'NiCr2O4', 'CoFe2O4', 'CuFe2O4', 'FeMoO4']));
    for (const s of mixed) {
      expect(s.file).toBe('mixed.json');
      expect(s.sourceText).toMatch(/Robie.*Hemingway.*1995|Wagman.*1982|Barin.*1995/);
      expect(s.recalled).toBe(true);
    }
  });

  it('never enters a one-element system, not even with the other metal named as a ligand', () => {
    for (const [el, lig] of [['Fe', ['Cr']], ['Cr', ['Fe']], ['Fe', ['Ni']], ['Cu', ['Fe']], ['Zn', []]] as const) {
      expect(speciesFor(lib, el, [...lig]).some((s) => s.mixed)).toBe(false);
    }
  });

  it('enters the alloy set only when all its metals are main elements', () => {
    const feCr = formulas(speciesForElements(lib, ['Fe', 'Cr']));
    expect(feCr).toContain('FeCr2O4');
    expect(feCr).not.toContain('NiFe2O4');
    expect(feCr).toEqual(expect.arrayContaining(['Fe', 'Fe^2+', 'Fe3O4', 'Cr', 'Cr2O3']));
    expect(new Set(feCr).size).toBe(feCr.length);
    expect(formulas(speciesForElements(lib, ['Fe', 'Cr', 'Ni']))).toEqual(expect.arrayContaining(['FeCr2O4', 'NiFe2O4']));
    // A metal named as a ligand is not a main element: chromite stays out.
    expect(formulas(speciesForElements(lib, ['Fe'], ['Cr']))).not.toContain('FeCr2O4');
  });

  it('a "mixed" file refuses a compound of one element other than H and O', () => {
    const file = (formula: string) => ({ element: 'mixed', sources: { X: 'x' }, species: [{ formula, phase: 's', name: 'n', dfG: -1, source: 'X' }] });
    expect(() => validateSpeciesFile('mixed.json', file('Fe3O4'))).toThrow(LibraryError);
    expect(() => validateSpeciesFile('mixed.json', file('Fe3O4'))).toThrow(/two or more elements/);
    expect(validateSpeciesFile('mixed.json', file('FeCr2O4'))[0].mixed).toBe(true);
    expect(validateSpeciesFile('Fe.json', { ...file('Fe3O4'), element: 'Fe' })[0].mixed).toBeUndefined();
  });
});
