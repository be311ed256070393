import { describe, it, expect } from 'vitest';
import { writeFileSync, rmSync } from 'node:fs';
import { cleanTmpDir } from '../helpers/tmp.js';
import { join } from 'node:path';
import {
  loadLibrary, clearLibraryCache, findSpecies, findAllSpecies, speciesFor, pickAlternative, speciesCitations, LibraryError,
} from '../../src/data/library.js';

const lib = loadLibrary();
const find = (k: string) => findSpecies(lib, k);

describe('loadLibrary', () => {
  it('pools every file, with provenance and composition', () => {
    const files = new Set(lib.map((s) => s.file));
    for (const f of ['water.json', 'Fe.json', 'Cu.json', 'Zn.json', 'Ni.json', 'S.json', 'C.json', 'Cl.json', 'N.json']) {
      expect(files, f).toContain(f);
    }
    const fe2 = find('Fe^2+')!;
    expect(fe2.file).toBe('Fe.json');
    expect(fe2.elements).toEqual({ Fe: 1 });
    expect(fe2.charge).toBe(2);
    expect(fe2.sourceText).toMatch(/Wagman.*1982.*NBS tables/);
    expect(find('Fe(OH)2^+')!.elements).toEqual({ Fe: 1, O: 2, H: 2 });
  });

  it('part A holds at least 90 species', () => {
    const partA = lib.filter((s) => ['water.json', 'Fe.json', 'Cu.json', 'Zn.json', 'Ni.json', 'S.json', 'C.json', 'Cl.json', 'N.json'].includes(s.file));
    expect(partA.length).toBeGreaterThanOrEqual(90);
  });

  it('is cached and frozen', () => {
    const again = loadLibrary();
    expect(again[0]).toBe(lib[0]);
    expect(Object.isFrozen(lib[0])).toBe(true);
  });

  it('gives every species a unique formula + phase', () => {
    const keys = lib.map((s) => `${s.formula}(${s.phase})`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('rejects a duplicate formula + phase across files, naming both files', () => {
    const dir = cleanTmpDir('ephmap-lib-');
    try {
      const file = (el: string) => ({
        element: el,
        sources: { K: 'citation' },
        species: [{ formula: 'Fe^2+', phase: 'aq', name: 'x', dfG: -1, source: 'K' }],
      });
      writeFileSync(join(dir, 'A.json'), JSON.stringify(file('Fe')));
      writeFileSync(join(dir, 'B.json'), JSON.stringify(file('Fe')));
      clearLibraryCache();
      expect(() => loadLibrary(dir)).toThrow(LibraryError);
      expect(() => loadLibrary(dir)).toThrow(/B\.json.*Fe\^2\+\(aq\).*A\.json/);
      writeFileSync(join(dir, 'B.json'), '{ not json');
      expect(() => loadLibrary(dir)).toThrow(/B\.json.*not valid JSON/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
      clearLibraryCache();
    }
  });
});

describe('findSpecies', () => {
  it('matches formulas with or without phase tag', () => {
    expect(find('Fe2O3')!.name).toBe('hematite');
    expect(find('Fe2O3(s)')!.formula).toBe('Fe2O3');
    expect(find('Fe^2+(aq)')!.formula).toBe('Fe^2+');
    expect(find('Fe2O3(aq)')).toBeUndefined();
  });

  it('prefers solid, liquid, aqueous, gas when the phase is not given', () => {
    expect(find('H2O')!.phase).toBe('l');
    expect(find('H2S')!.phase).toBe('aq');
    expect(find('H2S(g)')!.phase).toBe('g');
    expect(findAllSpecies(lib, 'CO2').map((s) => s.phase)).toEqual(['aq', 'g']);
  });

  it('matches names and aliases, case-insensitively', () => {
    expect(find('magnetite')!.formula).toBe('Fe3O4');
    expect(find('Magnetite')!.formula).toBe('Fe3O4');
    expect(find('  PYRITE ')!.formula).toBe('FeS2');
    expect(find('iron(II) ion')!.formula).toBe('Fe^2+');
    expect(find('ferrocyanide')!.formula).toBe('Fe(CN)6^4-');
  });

  it('finds a species written in the canonical, Unicode or older notation, and old names kept as aliases', () => {
    for (const key of ['Fe^2+', 'Fe²⁺', 'Fe+2', 'Fe^2+(aq)', 'Fe²⁺(aq)', 'Fe+2(aq)']) expect(find(key)!.formula, key).toBe('Fe^2+');
    for (const key of ['HFeO2^-', 'HFeO₂⁻', 'HFeO2-']) expect(find(key)!.name, key).toBe('trihydroxidoferrate(II)');
    // The old names, and the hydrated formula, still find it.
    for (const key of ['dihypoferrite ion', 'Fe(OH)3-', 'Fe(OH)₃⁻', 'Fe(OH)3^-']) expect(find(key)!.formula, key).toBe('HFeO2^-');
    expect(find('cuprite ion')!.formula).toBe('CuO2^2-');
    expect(find('cuprite')!.formula).toBe('Cu2O'); // the mineral, no longer shadowed by an ion's name
    expect(find('zincate')!.formula).toBe('ZnO2^2-');
  });

  it('matches an equivalent way of writing the formula', () => {
    expect(find('FeO(OH)')!.formula).toBe('FeOOH');
    expect(find('no such thing')).toBeUndefined();
  });
});

describe('speciesFor', () => {
  it('returns the main element with H and O, no water species, no metastable ones', () => {
    const fe = speciesFor(lib, 'Fe', []);
    const f = fe.map((s) => s.formula);
    expect(f).toEqual(expect.arrayContaining(['Fe', 'Fe^2+', 'Fe^3+', 'Fe3O4', 'Fe2O3', 'FeOH^2+', 'HFeO2^-']));
    expect(f).not.toContain('H2O');
    expect(f).not.toContain('Fe(OH)3');
    expect(f).not.toContain('FeS2');
    expect(f).not.toContain('Cu');
  });

  it('adds metastable species on request', () => {
    const f = speciesFor(lib, 'Fe', [], { metastable: true }).map((s) => s.formula);
    expect(f).toEqual(expect.arrayContaining(['Fe(OH)3', 'Fe(OH)2']));
  });

  it('adds ligand species and mixed species', () => {
    const f = speciesFor(lib, 'Cu', ['S']).map((s) => s.formula);
    expect(f).toEqual(expect.arrayContaining(['Cu', 'CuO', 'Cu2S', 'CuS', 'S', 'H2S', 'HS^-', 'SO4^2-']));
    expect(f).not.toContain('CuCl');
    expect(f).not.toContain('FeS');
  });
});

describe('pickAlternative', () => {
  it('returns a copy with the alternative values and source, without mixing in default values', () => {
    const fe2 = find('Fe^2+')!;
    const alt = pickAlternative(fe2, 'BR89');
    expect(alt.dfG).toBe(-86.26);
    expect(alt.dfH).toBeUndefined();
    expect(alt.S).toBeUndefined();
    expect(alt.source).toBe('BR89');
    expect(alt.sourceText).toMatch(/Bratsch/);
    expect(alt.alternative).toBe('BR89');
    expect(alt.elements).toEqual({ Fe: 1 });
    expect(fe2.dfG).toBe(-78.9); // the library entry is untouched
    expect(speciesCitations(alt)).toEqual([alt.sourceText]);
  });

  it('throws naming the species and the available ids', () => {
    expect(() => pickAlternative(find('Fe^2+')!, 'XX')).toThrow(/Fe\^2\+\(aq\).*Fe\.json.*BR89, PB66/);
    expect(() => pickAlternative(find('Fe')!, 'XX')).toThrow(/no alternatives/);
  });
});
