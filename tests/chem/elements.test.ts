import { describe, it, expect } from 'vitest';
import { ELEMENTS, isElement } from '../../src/chem/elements.js';

describe('ELEMENTS', () => {
  it('holds 118 elements with Z = 1..118 in order and unique symbols', () => {
    const list = [...ELEMENTS.values()];
    expect(list).toHaveLength(118);
    list.forEach((e, i) => expect(e.Z).toBe(i + 1));
    expect(new Set(list.map((e) => e.symbol)).size).toBe(118);
    for (const [k, e] of ELEMENTS) expect(k).toBe(e.symbol);
  });

  it('places landmark elements at their atomic numbers', () => {
    // Periodic table, IUPAC (common knowledge, recalled from memory).
    const landmarks: Array<[string, number, string]> = [
      ['H', 1, 'hydrogen'], ['O', 8, 'oxygen'], ['S', 16, 'sulfur'], ['Fe', 26, 'iron'], ['Cu', 29, 'copper'],
      ['Zn', 30, 'zinc'], ['Ag', 47, 'silver'], ['Cs', 55, 'caesium'], ['W', 74, 'tungsten'], ['Au', 79, 'gold'],
      ['Pb', 82, 'lead'], ['U', 92, 'uranium'], ['Og', 118, 'oganesson'], ['Lv', 116, 'livermorium'], ['Nh', 113, 'nihonium'],
    ];
    for (const [sym, Z, name] of landmarks) {
      expect(ELEMENTS.get(sym)?.Z, sym).toBe(Z);
      expect(ELEMENTS.get(sym)?.name, sym).toBe(name);
    }
  });

  it('gives IUPAC 2021 abridged/conventional standard atomic weights', () => {
    // IUPAC CIAAW, Standard atomic weights 2021, abridged/conventional values (recalled from memory).
    const w: Array<[string, number]> = [
      ['H', 1.008], ['C', 12.011], ['N', 14.007], ['O', 15.999], ['Na', 22.99], ['S', 32.06], ['Cl', 35.45],
      ['Cr', 51.996], ['Fe', 55.845], ['Ni', 58.693], ['Cu', 63.546], ['Zn', 65.38], ['Zr', 91.222],
      ['Ag', 107.87], ['Sn', 118.71], ['Pt', 195.08], ['Au', 196.97], ['Pb', 207.2], ['U', 238.03],
    ];
    for (const [sym, v] of w) expect(ELEMENTS.get(sym)?.weight, sym).toBe(v);
  });

  it('gives no standard atomic weight for elements without one (IUPAC 2021)', () => {
    // IUPAC CIAAW 2021: no standard atomic weight for Tc, Pm, Po–Ac and Z ≥ 93 (recalled from memory).
    for (const sym of ['Tc', 'Pm', 'Po', 'Rn', 'Ra', 'Ac', 'Np', 'Pu', 'Am', 'Og']) expect(ELEMENTS.get(sym)?.weight, sym).toBeNull();
    // Th, Pa, U do have one.
    for (const sym of ['Th', 'Pa', 'U']) expect(ELEMENTS.get(sym)?.weight, sym).not.toBeNull();
    const withWeight = [...ELEMENTS.values()].filter((e) => e.weight !== null).length;
    expect(withWeight).toBe(84); // 92 − (Tc, Pm, Po, At, Rn, Fr, Ra, Ac)
  });

  it('isElement is case-sensitive', () => {
    expect(isElement('Fe')).toBe(true);
    expect(isElement('fe')).toBe(false);
    expect(isElement('FE')).toBe(false);
    expect(isElement('Xx')).toBe(false);
    expect(isElement('e')).toBe(false);
  });
});
