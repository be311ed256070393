import { describe, it, expect } from 'vitest';
import { elementEntropy, elementsWithEntropy, ELEMENT_ENTROPY_SOURCE } from '../../src/data/element-entropies.js';
import { loadLibrary } from '../../src/data/library.js';

describe('elementEntropy (per mole of atoms, J/(mol·K), 298.15 K)', () => {
  it('halves the diatomic gases', () => {
    // NBS 1982 (Wagman et al.) S°(H2, g) = 130.684 — recalled from memory
    expect(elementEntropy('H')).toBeCloseTo(65.342, 3);
    // CODATA 1989 (Cox, Wagman, Medvedev) S°(O2, g) = 205.152, S°(N2) = 191.609, S°(Cl2) = 223.081 — recalled from memory
    expect(elementEntropy('O')).toBeCloseTo(102.576, 3);
    expect(elementEntropy('N')).toBeCloseTo(95.8045, 3);
    expect(elementEntropy('Cl')).toBeCloseTo(111.5405, 3);
  });

  it('gives the condensed reference states', () => {
    // CODATA 1989: C graphite 5.74, S rhombic 32.054, Cu 33.15, Zn 41.63 — recalled from memory
    expect(elementEntropy('C')).toBeCloseTo(5.74, 2);
    expect(elementEntropy('S')).toBeCloseTo(32.054, 3);
    expect(elementEntropy('Cu')).toBeCloseTo(33.15, 2);
    expect(elementEntropy('Zn')).toBeCloseTo(41.63, 2);
    // NBS 1982: Fe 27.28, Ni 29.87 — recalled from memory
    expect(elementEntropy('Fe')).toBeCloseTo(27.28, 2);
    expect(elementEntropy('Ni')).toBeCloseTo(29.87, 2);
  });

  it('is undefined for unknown symbols and does not leak object properties', () => {
    expect(elementEntropy('Xx')).toBeUndefined();
    expect(elementEntropy('constructor')).toBeUndefined();
    expect(elementEntropy('toString')).toBeUndefined();
  });

  it('covers every element of the species library', () => {
    const missing = new Set<string>();
    for (const sp of loadLibrary()) for (const el of Object.keys(sp.elements)) if (elementEntropy(el) === undefined) missing.add(el);
    expect([...missing]).toEqual([]);
  });

  it('agrees with the elemental entries of the library within 0.3 J/(mol·K)', () => {
    // element entries hold NBS 1982 or CODATA 1989 S°, which differ by at most 0.25 (S rhombic)
    const lib = loadLibrary();
    for (const el of elementsWithEntropy()) {
      const sp = lib.find((s) => Object.keys(s.elements).length === 1 && s.elements[el] !== undefined && s.charge === 0 && s.dfG === 0 && s.S !== undefined);
      if (!sp) continue;
      const perAtom = sp.S! / sp.elements[el]!;
      expect(Math.abs(perAtom - elementEntropy(el)!), `${el} vs ${sp.formula}(${sp.phase}) in ${sp.file}`).toBeLessThan(0.3);
    }
  });

  it('names its source', () => {
    expect(ELEMENT_ENTROPY_SOURCE).toMatch(/CODATA/);
    expect(ELEMENT_ENTROPY_SOURCE).toMatch(/NBS/);
  });
});
