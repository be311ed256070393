/**
 * Reading the formula notation: the caret form (Fe^2+), Unicode scripts (Fe²⁺, HFeO₂⁻) and the
 * older sign-then-number form (Fe+2) give the same Formula; errors name the position and what is
 * expected. Charge conventions: IUPAC Green Book (3rd ed. 2007, §2.10.1), recalled from memory.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FormulaError, formulaAscii, formulaUnicode, formulaWarnings, parseFormula, splitPhase, tokenizeFormula } from '../../src/chem/index.js';

const read = (t: string) => {
  const f = parseFormula(t);
  return { keys: Object.keys(f.elements), elements: f.elements, charge: f.charge };
};

function err(text: string): FormulaError {
  try {
    parseFormula(text);
  } catch (e) {
    expect(e).toBeInstanceOf(FormulaError);
    return e as FormulaError;
  }
  throw new Error(`"${text}" parsed but should not`);
}

describe('the three notations read alike', () => {
  it.each<[string, string, string, Record<string, number>, number]>([
    ['Fe^2+', 'Fe²⁺', 'Fe+2', { Fe: 1 }, 2],
    ['Fe^3+', 'Fe³⁺', 'Fe+3', { Fe: 1 }, 3],
    ['HFeO2^-', 'HFeO₂⁻', 'HFeO2-', { H: 1, Fe: 1, O: 2 }, -1],
    ['CuO2^2-', 'CuO₂²⁻', 'CuO2-2', { Cu: 1, O: 2 }, -2],
    ['Fe(OH)2^+', 'Fe(OH)₂⁺', 'Fe(OH)2+', { Fe: 1, O: 2, H: 2 }, 1],
    ['Fe(CN)6^4-', 'Fe(CN)₆⁴⁻', 'Fe(CN)6-4', { Fe: 1, C: 6, N: 6 }, -4],
    ['[Cu(NH3)4]^2+', '[Cu(NH₃)₄]²⁺', '[Cu(NH3)4]+2', { Cu: 1, N: 4, H: 12 }, 2],
    ['Fe3O4', 'Fe₃O₄', 'Fe3O4', { Fe: 3, O: 4 }, 0],
    ['Hg2^2+', 'Hg₂²⁺', 'Hg2+2', { Hg: 2 }, 2],
    ['SnO3^2-', 'SnO₃²⁻', 'SnO3-2', { Sn: 1, O: 3 }, -2],
  ])('%s = %s = %s', (caret, unicode, old, elements, charge) => {
    const want = { keys: Object.keys(elements), elements, charge };
    expect(read(caret)).toEqual(want);
    expect(read(unicode)).toEqual(want);
    expect(read(old)).toEqual(want);
    expect(parseFormula(unicode).text).toBe(unicode); // text is kept as given
  });

  it('reads U+2212 minus as a minus sign in the caret and older forms', () => {
    expect(parseFormula('HFeO2^\u2212').charge).toBe(-1);
    expect(parseFormula('CuO2^2\u2212').charge).toBe(-2);
    expect(parseFormula('CuO2\u22122').charge).toBe(-2);
    expect(parseFormula('OH\u2212').charge).toBe(-1);
  });

  it('reads an explicit charge number 1 and a lone sign alike', () => {
    expect(parseFormula('Ag^1+').charge).toBe(1);
    expect(parseFormula('Ag¹⁺').charge).toBe(1);
    expect(parseFormula('Ag^+').charge).toBe(1);
    expect(parseFormula('Ag⁺').charge).toBe(1);
  });

  it('reads counts in plain or subscript digits, mixed between units, and subscript decimals', () => {
    expect(read('Fe₃O4').elements).toEqual({ Fe: 3, O: 4 });
    expect(read('Fe0.95O').elements).toEqual(read('Fe₀.₉₅O').elements);
    expect(read('Ni₁.₅Fe').elements).toEqual({ Ni: 1.5, Fe: 1 }); // no bracket needed in subscripts
    expect(read('UO₂.₁₂²⁺')).toEqual({ keys: ['U', 'O'], elements: { U: 1, O: 2.12 }, charge: 2 });
    expect(read('UO2.12^2+')).toEqual({ keys: ['U', 'O'], elements: { U: 1, O: 2.12 }, charge: 2 });
    expect(read('CuSO₄·5H₂O').elements).toEqual({ Cu: 1, S: 1, O: 9, H: 10 });
    expect(read('Fe₁₂').elements).toEqual({ Fe: 12 });
  });

  it('a caret charge cannot run into a count: Fe2^+ is Fe₂ with charge 1+', () => {
    expect(read('Fe2^+')).toEqual({ keys: ['Fe'], elements: { Fe: 2 }, charge: 1 });
    expect(read('Fe₂⁺')).toEqual({ keys: ['Fe'], elements: { Fe: 2 }, charge: 1 });
  });

  it('keeps phase tags as today', () => {
    expect(splitPhase('Fe^2+(aq)')).toEqual({ formula: 'Fe^2+', phase: 'aq' });
    expect(splitPhase('Fe²⁺(aq)')).toEqual({ formula: 'Fe²⁺', phase: 'aq' });
    expect(splitPhase('Fe₃O₄(s)')).toEqual({ formula: 'Fe₃O₄', phase: 's' });
    expect(splitPhase('H₂O(l)')).toEqual({ formula: 'H₂O', phase: 'l' });
    expect(splitPhase('O₂(g)')).toEqual({ formula: 'O₂', phase: 'g' });
  });
});

describe('tokens of the new notations', () => {
  it('spell the text and carry the values for typesetting', () => {
    const t = tokenizeFormula('Fe(OH)₂⁺');
    expect(t.map((x) => x.text).join('')).toBe('Fe(OH)₂⁺');
    expect(t.at(-2)).toEqual({ kind: 'count', text: '₂', value: 2 });
    expect(t.at(-1)).toEqual({ kind: 'charge', text: '⁺', value: 1 });
    expect(tokenizeFormula('Fe(CN)6^4-').at(-1)).toEqual({ kind: 'charge', text: '^4-', value: -4 });
    expect(tokenizeFormula('Fe₀.₉₅O')[1]).toEqual({ kind: 'count', text: '₀.₉₅', value: 0.95 });
  });
});

describe('errors in the new notations', () => {
  it('refuses sign-before-number after a caret, with the fix', () => {
    const e = err('Fe^+2');
    expect([e.position, e.expected]).toEqual([4, 'charge number or sign']);
    expect(e.message).toContain('"^2+"');
  });

  it('refuses a caret without a sign, and a caret alone', () => {
    expect([err('Fe^2').position, err('Fe^2').expected]).toEqual([5, 'charge sign "+" or "-" after the number']);
    expect(err('Fe^').position).toBe(4);
    expect(err('Fe^x').position).toBe(4);
  });

  it('refuses leading zeros, charge 0 and oversized charges in every form', () => {
    expect(err('Fe^0+').position).toBe(4);
    expect(err('Fe^02+').message).toContain('no leading zero');
    expect(err('Fe⁰⁺').position).toBe(3);
    expect(err('Fe^101+').message).toContain('at most 100');
    expect(err('Fe¹⁰¹⁺').message).toContain('at most 100');
  });

  it('refuses a superscript number without a superscript sign, naming the fix', () => {
    const e = err('Fe²+');
    expect(e.position).toBe(4);
    expect(e.message).toContain('write the sign as a superscript too');
    expect(err('Fe²').position).toBe(4);
  });

  it('refuses two charges', () => {
    expect([err('Fe^2+^+').position, err('Fe^2+^+').expected]).toEqual([6, 'end of formula']);
    expect(err('Fe²⁺+').message).toContain('write one charge');
    expect(err('Fe⁺²').message).toContain('e.g. "²⁺"');
    expect(err('Fe++').message).toContain('e.g. "^2+"');
    expect(err('Fe+2²⁺').position).toBe(5);
  });

  it('refuses subscript signs, stray superscripts and whitespace', () => {
    expect(err('Fe₊').position).toBe(3);
    expect(err('F²e').position).toBe(3); // F with charge 2?, then "e": the sign is missing
    expect(err('Fe ^2+').message).toContain('whitespace');
    expect(err('₂Fe').position).toBe(1);
  });

  it('names the electron in every spelling', () => {
    for (const e of ['e-', 'e^-', 'e⁻', 'e\u2212']) expect(err(e).message, e).toContain('the electron is not a formula');
  });
});

describe('any text over the notation alphabet (property)', () => {
  // Either a Formula whose tokens spell the text, or a FormulaError with a position in or just after
  // the text; warnings and writers never throw anything else.
  const alphabet = 'FeOHCuNSn()[]^+-−⁺⁻²³⁴¹⁰₂₃₄₁₀.·*0123 e'.split('');
  it('returns or throws FormulaError, nothing else', () => {
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom(...alphabet), maxLength: 16 }), (text) => {
        let ok = false;
        try {
          parseFormula(text);
          ok = true;
        } catch (e) {
          expect(e).toBeInstanceOf(FormulaError);
          const p = (e as FormulaError).position;
          expect(p >= 1 && p <= text.length + 1).toBe(true);
        }
        expect(Array.isArray(formulaWarnings(text))).toBe(true);
        if (ok) {
          expect(tokenizeFormula(text).map((t) => t.text).join('')).toBe(text);
          const f = parseFormula(text);
          for (const w of [formulaAscii(text), formulaUnicode(text)]) {
            const g = parseFormula(w);
            expect(g.charge).toBe(f.charge);
            expect(Object.keys(g.elements)).toEqual(Object.keys(f.elements));
            for (const [el, n] of Object.entries(f.elements)) expect(g.elements[el]).toBeCloseTo(n, 9);
          }
        }
      }),
      { numRuns: 3000, seed: 17 },
    );
  });
});
