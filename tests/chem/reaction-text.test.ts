/**
 * Reaction text in the new notation: ⇌ (U+21CC) as the one equilibrium sign, "<=>" its ASCII twin;
 * the electron e⁻ / e^- (older e- still recognised). Balanced examples are textbook half-reactions
 * (common practice); solve/reaction.ts writes its boundary reactions with reactionAscii.
 */
import { describe, expect, it } from 'vitest';
import { equilibriumText, isElectron, reactionAscii, reactionUnicode } from '../../src/chem/index.js';
import { reactionText } from '../../src/solve/reaction.js';

type T = { formula: string; phase: string; nu: number };

const cases: { terms: T[]; water: number; protons: number; electrons: number; unicode: string; ascii: string }[] = [
  {
    terms: [{ formula: 'Fe+2', phase: 'aq', nu: -1 }, { formula: 'Fe', phase: 's', nu: 1 }],
    water: 0, protons: 0, electrons: -2,
    unicode: 'Fe²⁺ + 2e⁻ ⇌ Fe(s)',
    ascii: 'Fe^2+ + 2e^- <=> Fe(s)',
  },
  {
    terms: [{ formula: 'Fe2O3', phase: 's', nu: -1 }, { formula: 'Fe+2', phase: 'aq', nu: 2 }],
    water: 3, protons: -6, electrons: -2,
    unicode: 'Fe₂O₃(s) + 6H⁺ + 2e⁻ ⇌ 2Fe²⁺ + 3H₂O(l)',
    ascii: 'Fe2O3(s) + 6H^+ + 2e^- <=> 2Fe^2+ + 3H2O(l)',
  },
  {
    terms: [{ formula: 'Fe+3', phase: 'aq', nu: -1 }, { formula: 'Fe(OH)3', phase: 's', nu: 1 }],
    water: -3, protons: 3, electrons: 0,
    unicode: 'Fe³⁺ + 3H₂O(l) ⇌ Fe(OH)₃(s) + 3H⁺',
    ascii: 'Fe^3+ + 3H2O(l) <=> Fe(OH)3(s) + 3H^+',
  },
  {
    terms: [{ formula: 'HFeO2-', phase: 'aq', nu: -1 }, { formula: 'Fe', phase: 's', nu: 1 }],
    water: 2, protons: -3, electrons: -2,
    unicode: 'HFeO₂⁻ + 3H⁺ + 2e⁻ ⇌ Fe(s) + 2H₂O(l)',
    ascii: 'HFeO2^- + 3H^+ + 2e^- <=> Fe(s) + 2H2O(l)',
  },
  {
    terms: [{ formula: 'CO2', phase: 'aq', nu: -1 }, { formula: 'HCOOH', phase: 'aq', nu: 1 }],
    water: 0, protons: -2, electrons: -2,
    unicode: 'CO₂(aq) + 2H⁺ + 2e⁻ ⇌ HCOOH(aq)',
    ascii: 'CO2(aq) + 2H^+ + 2e^- <=> HCOOH(aq)',
  },
  {
    terms: [{ formula: 'Cu(NH3)4+2', phase: 'aq', nu: -1 }, { formula: 'Cu', phase: 's', nu: 1 }, { formula: 'NH4+', phase: 'aq', nu: 4 }],
    water: 0, protons: -4, electrons: -2,
    unicode: 'Cu(NH₃)₄²⁺ + 4H⁺ + 2e⁻ ⇌ Cu(s) + 4NH₄⁺',
    ascii: 'Cu(NH3)4^2+ + 4H^+ + 2e^- <=> Cu(s) + 4NH4^+',
  },
];

describe('reactionUnicode and reactionAscii', () => {
  it.each(cases)('$unicode', ({ terms, water, protons, electrons, unicode, ascii }) => {
    expect(reactionUnicode(terms, water, protons, electrons)).toBe(unicode);
    expect(reactionAscii(terms, water, protons, electrons)).toBe(ascii);
    // The boundary reactions of solve/reaction.ts are written by the same ASCII writer (JSON's form).
    expect(reactionText(terms, water, protons, electrons)).toBe(ascii);
  });

  it('writes the two water lines in the order solve.ts writes them today', () => {
    expect(reactionUnicode([{ formula: 'H2', phase: 'g', nu: 1 }], 0, -2, -2)).toBe('2H⁺ + 2e⁻ ⇌ H₂(g)');
    expect(reactionUnicode([{ formula: 'O2', phase: 'g', nu: -1 }], 2, -4, -4)).toBe('O₂(g) + 4H⁺ + 4e⁻ ⇌ 2H₂O(l)');
    expect(reactionAscii([{ formula: 'O2', phase: 'g', nu: -1 }], 2, -4, -4)).toBe('O2(g) + 4H^+ + 4e^- <=> 2H2O(l)');
  });

  it('uses ⇌ (U+21CC) and pure ASCII for the twin', () => {
    const [c] = cases;
    expect(reactionUnicode(c!.terms, 0, 0, -2)).toContain('\u21cc');
    expect(reactionAscii(c!.terms, 0, 0, -2)).toMatch(/^[\x20-\x7e]+$/);
  });
});

describe('equilibriumText', () => {
  it('writes string and decimal coefficients, drops 1 and zero terms, reads any electron spelling', () => {
    const terms = [
      { nu: -1, formula: 'H2', phase: 'g', coefficientText: '1/2' },
      { nu: 0, formula: 'Cl-', phase: 'aq' },
      { nu: 1, formula: 'H^+', phase: 'aq' },
      { nu: 1, formula: 'e⁻' },
    ];
    expect(equilibriumText(terms, 'unicode')).toBe('1/2H₂(g) ⇌ H⁺ + e⁻');
    expect(equilibriumText(terms, 'ascii')).toBe('1/2H2(g) <=> H^+ + e^-');
    expect(equilibriumText([{ nu: -0.5, formula: 'O2', phase: 'g' }, { nu: 1, formula: 'O', phase: 'g' }], 'unicode')).toBe('0.5O₂(g) ⇌ O(g)');
    expect(equilibriumText([{ nu: -1, formula: 'Cu²⁺', phase: 'aq', coefficientText: '1' }, { nu: 1, formula: 'Cu', phase: 's' }], 'ascii')).toBe('Cu^2+ <=> Cu(s)');
  });
});

describe('isElectron', () => {
  it.each(['e-', 'e^-', 'e⁻', 'e\u2212', 'e^\u2212'])('%s is the electron', (t) => expect(isElectron(t)).toBe(true));
  it.each(['e', 'e+', 'e^+', 'Fe-', 'e--', 'E-', ' e-'])('%s is not', (t) => expect(isElectron(t)).toBe(false));
});
