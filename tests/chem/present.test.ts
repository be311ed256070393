/**
 * The presentation helpers (src/chem/present.ts) and formula matching (src/chem/match.ts). Expected
 * spellings follow the IUPAC Green Book (3rd ed. 2007, §2.10.1: "Fe³⁺", "SO₄²⁻"), recalled from memory.
 */
import { describe, expect, it } from 'vitest';
import {
  chargesForPeople, formulaForJson, textForPeople, formulaForPeople, formulaMatches, reactionForJson, reactionForPeople,
} from '../../src/chem/index.js';

describe('formulaForPeople / formulaForJson', () => {
  it('re-spells every accepted notation, keeping the phase tag', () => {
    for (const t of ['Fe+2', 'Fe^2+', 'Fe²⁺']) {
      expect(formulaForPeople(t)).toBe('Fe²⁺');
      expect(formulaForJson(t)).toBe('Fe^2+');
    }
    expect(formulaForPeople('Fe3O4(s)')).toBe('Fe₃O₄(s)');
    expect(formulaForPeople('HFeO2-')).toBe('HFeO₂⁻');
    expect(formulaForJson('HFeO₂⁻(aq)')).toBe('HFeO2^-(aq)');
    expect(formulaForJson('Fe(CN)6-4')).toBe('Fe(CN)6^4-');
    expect(formulaForPeople('e-')).toBe('e⁻');
    expect(formulaForJson('e⁻')).toBe('e^-');
  });
  it('leaves text that is not a formula as it is', () => {
    expect(formulaForPeople('mixed')).toBe('mixed');
    expect(formulaForJson('undetermined')).toBe('undetermined');
  });
});

describe('reactionForPeople / reactionForJson', () => {
  it('writes ⇌ for people and <=> in JSON, with coefficients kept', () => {
    expect(reactionForPeople('Fe+2 + 2e- = Fe(s)')).toBe('Fe²⁺ + 2e⁻ ⇌ Fe(s)');
    expect(reactionForJson('2Fe+3 + 3H2O(l) = Fe2O3(s) + 6H+')).toBe('2Fe^3+ + 3H2O(l) <=> Fe2O3(s) + 6H^+');
    expect(reactionForJson('Fe²⁺ + 2e⁻ ⇌ Fe(s)')).toBe('Fe^2+ + 2e^- <=> Fe(s)');
    expect(reactionForPeople('1/2O2(g) + 2H+ + 2e- = H2O(l)')).toBe('1/2O₂(g) + 2H⁺ + 2e⁻ ⇌ H₂O(l)');
  });
  it('leaves one-sided text unchanged', () => {
    expect(reactionForPeople('no reaction')).toBe('no reaction');
  });
});

describe('chargesForPeople', () => {
  it('re-spells charged formulas inside free text and nothing else', () => {
    expect(chargesForPeople('E°(Fe+2/Fe) = −0.409 V')).toBe('E°(Fe²⁺/Fe) = −0.409 V');
    expect(chargesForPeople('log*β1 = −9.5 (Fe+2 + H2O = FeOH+ + H+); NBS82')).toBe('log*β1 = −9.5 (Fe²⁺ + H2O = FeOH⁺ + H⁺); NBS82');
    expect(chargesForPeople('E-pH diagram of Fe-Cr at 25 °C')).toBe('E-pH diagram of Fe-Cr at 25 °C');
    expect(chargesForPeople('HFeO2^- and ZnO2-2')).toBe('HFeO₂⁻ and ZnO₂²⁻');
    expect(chargesForPeople('E0(Co+3/Co+2) for 2 AgO + 2 e- = Ag2O')).toBe('E0(Co³⁺/Co²⁺) for 2 AgO + 2 e⁻ = Ag2O');
    expect(chargesForPeople('(Fe+3 + 2H2O = Fe(OH)2+ + 2H+)')).toBe('(Fe³⁺ + 2H2O = Fe(OH)₂⁺ + 2H⁺)');
  });
});

describe('formulaMatches', () => {
  it('matches a species written in any notation, and only the same species', () => {
    for (const t of ['Fe+2', 'Fe^2+', 'Fe²⁺']) expect(formulaMatches(t, 'Fe^2+')).toBe(true);
    expect(formulaMatches('Fe+3', 'Fe^2+')).toBe(false);
    expect(formulaMatches('HFeO2-', 'HFeO2^-')).toBe(true);
    expect(formulaMatches('not a formula', 'Fe^2+')).toBe(false);
    expect(formulaMatches('iron', 'iron')).toBe(true);
  });
});

describe('textForPeople', () => {
  it('re-spells reactions, phase-tagged and charged formulas inside free text', () => {
    expect(textForPeople('Fe^2+ + 2e^- <=> Fe(s) is slow')).toBe('Fe²⁺ + 2e⁻ ⇌ Fe(s) is slow');
    expect(textForPeople('no Fe3O4(s) field; H2O(l) and CO2(aq) kept, SH88 cited')).toBe('no Fe₃O₄(s) field; H₂O(l) and CO₂(aq) kept, SH88 cited');
    expect(textForPeople('exclude: HFeO2^- is not in this system')).toBe('exclude: HFeO₂⁻ is not in this system');
    expect(textForPeople('formula "Fe2+" reads as Fe₂⁺; write "Fe^2+" for Fe^2+')).toBe('formula "Fe2+" reads as Fe₂⁺; write "Fe^2+" for Fe²⁺');
  });
});
