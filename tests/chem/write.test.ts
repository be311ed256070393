/**
 * Writing formulas: formulaUnicode (for people) and formulaAscii (the canonical form for JSON), with
 * round trips over every formula of the species library and over random formulas (fast-check).
 * Expected spellings follow the IUPAC Green Book (3rd ed. 2007, §2.10.1: "Fe³⁺", "SO₄²⁻"),
 * recalled from memory.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ELEMENTS, type Formula, formulaAscii, formulaUnicode, parseFormula, splitPhase, tokenizeFormula } from '../../src/chem/index.js';

/** Same counts with the same key order, same charge. */
function expectSame(got: Formula, want: Formula, label: string): void {
  expect(Object.keys(got.elements), label).toEqual(Object.keys(want.elements));
  for (const [el, n] of Object.entries(want.elements)) expect(got.elements[el], `${label} ${el}`).toBeCloseTo(n, 9);
  expect(got.charge, label).toBe(want.charge);
}

describe('formulaUnicode and formulaAscii: worked examples', () => {
  it.each<[string, string, string]>([
    ['Fe+2', 'Fe²⁺', 'Fe^2+'],
    ['Fe+3', 'Fe³⁺', 'Fe^3+'],
    ['Fe3O4', 'Fe₃O₄', 'Fe3O4'],
    ['HFeO2-', 'HFeO₂⁻', 'HFeO2^-'],
    ['CuO2-2', 'CuO₂²⁻', 'CuO2^2-'],
    ['Fe(CN)6-4', 'Fe(CN)₆⁴⁻', 'Fe(CN)6^4-'],
    ['Fe(OH)2+', 'Fe(OH)₂⁺', 'Fe(OH)2^+'],
    ['[Cu(NH3)4]+2', '[Cu(NH₃)₄]²⁺', '[Cu(NH3)4]^2+'],
    ['Ag+1', 'Ag⁺', 'Ag^+'], // charge number 1 omitted
    ['H1O1', 'HO', 'HO'], // count 1 omitted
    ['CuSO4*5H2O', 'CuSO₄·5H₂O', 'CuSO4.5H2O'],
    ['Cr2O7-2', 'Cr₂O₇²⁻', 'Cr2O7^2-'],
    ['Fe(CN)6^10-', 'Fe(CN)₆¹⁰⁻', 'Fe(CN)6^10-'],
  ])('%s → %s and %s', (text, unicode, ascii) => {
    expect(formulaUnicode(text)).toBe(unicode);
    expect(formulaAscii(text)).toBe(ascii);
    expect(formulaUnicode(parseFormula(text))).toBe(unicode); // a parsed Formula works too
    expect(formulaAscii(unicode)).toBe(ascii);
    expect(formulaUnicode(ascii)).toBe(unicode);
  });

  it('brackets a decimal count ≥ 1 in ASCII where the "." would read as a hydrate dot', () => {
    expect(formulaAscii('Ni₁.₅Fe')).toBe('(Ni1.5)Fe');
    expect(formulaAscii('Fe₂.₅·H₂O')).toBe('(Fe2.5).H2O');
    expect(formulaAscii('(OH)₁.₅Fe')).toBe('((OH)1.5)Fe');
    expect(formulaAscii('UO₂.₁₂²⁺')).toBe('UO2.12^2+'); // ends the group: no bracket
    expect(formulaAscii('Fe₀.₉₅O')).toBe('Fe0.95O'); // integer part 0: always decimal
    expect(parseFormula('(Ni1.5)Fe').elements).toEqual({ Ni: 1.5, Fe: 1 });
    expect(parseFormula('(Fe2.5).H2O').elements).toEqual({ Fe: 2.5, H: 2, O: 1 });
  });

  it('throws FormulaError on text that is no formula', () => {
    expect(() => formulaUnicode('Fe(OH')).toThrow(/expected/);
    expect(() => formulaAscii('e-')).toThrow(/electron/);
  });
});

/** The canonical caret form (as the species files are written) in the older sign-then-number form, by hand-rule. */
function oldByHand(caret: string): string {
  return caret.replace(/\^(\d*)([+-])$/, (_m, d: string, s: string) => `${s}${d}`);
}

// Every formula in the species library, and every alias that is a formula (in the older form).
const root = fileURLToPath(new URL('../../', import.meta.url));
const libraryFormulas: string[] = [];
for (const file of readdirSync(join(root, 'species')).filter((f) => f.endsWith('.json')).sort()) {
  const data = JSON.parse(readFileSync(join(root, 'species', file), 'utf8')) as { species: { formula: string; aliases?: string[] }[] };
  for (const s of data.species) {
    libraryFormulas.push(oldByHand(s.formula));
    for (const a of s.aliases ?? []) {
      try {
        parseFormula(splitPhase(a).formula);
        libraryFormulas.push(oldByHand(splitPhase(a).formula));
      } catch {
        // a name, not a formula
      }
    }
  }
}

/** The older sign-then-number form rewritten by hand-rule (independent of the writers under test). */
function caretByHand(old: string): string {
  return old.replace(/·/g, '.').replace(/([+-])(\d*)$/, (_m, s: string, d: string) => `^${d}${s}`);
}
const SUB = '₀₁₂₃₄₅₆₇₈₉';
const SUP = '⁰¹²³⁴⁵⁶⁷⁸⁹';
function unicodeByHand(old: string): string {
  const m = /^(.*?)(?:([+-])(\d*))?$/.exec(old)!;
  const body = m[1]!.replace(/\d/g, (d) => SUB[Number(d)]!);
  const charge = m[2] ? [...(m[3] ?? '')].map((d) => SUP[Number(d)]).join('') + (m[2] === '+' ? '⁺' : '⁻') : '';
  return body + charge;
}

describe('round trips over the species library', () => {
  it('holds formulas to check', () => {
    expect(libraryFormulas.length).toBeGreaterThan(200);
    expect(libraryFormulas).toContain('HFeO2-');
  });

  it('the species files write every formula in the canonical ASCII form (formulaAscii gives it back unchanged)', () => {
    for (const file of readdirSync(join(root, 'species')).filter((f) => f.endsWith('.json'))) {
      const data = JSON.parse(readFileSync(join(root, 'species', file), 'utf8')) as { species: { formula: string }[] };
      for (const s of data.species) expect(formulaAscii(s.formula), `${file}: ${s.formula}`).toBe(s.formula);
    }
  });

  it.each(libraryFormulas)('%s: old = caret = unicode, and both writers give it back', (old) => {
    const f = parseFormula(old);
    expectSame(parseFormula(caretByHand(old)), f, 'caret by hand');
    expectSame(parseFormula(unicodeByHand(old)), f, 'unicode by hand');
    expectSame(parseFormula(formulaAscii(f)), f, 'formulaAscii');
    expectSame(parseFormula(formulaUnicode(f)), f, 'formulaUnicode');
    expect(formulaAscii(f)).toBe(caretByHand(old));
    expect(formulaUnicode(f)).toBe(unicodeByHand(old));
    expect(formulaAscii(f)).toMatch(/^[\x21-\x7e]+$/); // pure printable ASCII
  });
});

// Random formulas from the grammar, written in a random mix of notations.
const SYMBOLS = [...ELEMENTS.keys()];
const RUNS = { numRuns: 500, seed: 20261202 } as const;
const countArb = fc.oneof(fc.constant(1), fc.integer({ min: 2, max: 40 }), fc.integer({ min: 1, max: 999 }).map((k) => k / 100));

interface Node {
  unicode: string;
  ascii: string;
}
/** A count written two ways: subscript digits (decimals need no bracket) and ASCII digits (bracketed unit). */
function withCount(unit: Node, n: number, explicit: boolean): Node {
  if (n === 1) return explicit ? { unicode: unit.unicode + '₁', ascii: unit.ascii + '1' } : unit;
  const d = String(n);
  const sub = [...d].map((c) => (c === '.' ? '.' : SUB[Number(c)])).join('');
  const ascii = Number.isInteger(n) ? unit.ascii + d : `(${unit.ascii}${d})`;
  return { unicode: unit.unicode + sub, ascii };
}
const { group } = fc.letrec<{ group: Node; unit: Node }>((tie) => ({
  unit: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.record({ el: fc.constantFrom(...SYMBOLS), n: countArb, explicit: fc.boolean() }).map(({ el, n, explicit }) =>
      withCount({ unicode: el, ascii: el }, n, explicit),
    ),
    fc.record({ inner: tie('group'), square: fc.boolean(), n: countArb }).map(({ inner, square, n }) => {
      const [o, c] = square ? ['[', ']'] : ['(', ')'];
      return withCount({ unicode: o + inner.unicode + c, ascii: o + inner.ascii + c }, n, false);
    }),
  ),
  group: fc.array(tie('unit'), { minLength: 1, maxLength: 4 }).map((units) => ({
    unicode: units.map((u) => u.unicode).join(''),
    ascii: units.map((u) => u.ascii).join(''),
  })),
}));
const formulaArb = fc
  .record({ head: group, hydrate: fc.option(fc.record({ k: fc.integer({ min: 1, max: 12 }), g: group }), { nil: undefined }), z: fc.integer({ min: -8, max: 8 }) })
  .map(({ head, hydrate, z }) => {
    const mag = Math.abs(z);
    const supMag = mag === 1 ? '' : [...String(mag)].map((c) => SUP[Number(c)]).join('');
    const zU = z === 0 ? '' : supMag + (z > 0 ? '⁺' : '⁻');
    const zA = z === 0 ? '' : `^${mag === 1 ? '' : mag}${z > 0 ? '+' : '-'}`;
    const zOld = z === 0 ? '' : `${z > 0 ? '+' : '-'}${mag === 1 ? '' : mag}`;
    // A hydrate part needs its preceding decimal bracketed in ASCII too: bracket the whole head.
    const hU = hydrate ? `·${hydrate.k}${hydrate.g.unicode}` : '';
    const hA = hydrate ? `.${hydrate.k}${hydrate.g.ascii}` : '';
    const headA = hydrate ? `(${head.ascii})` : head.ascii;
    return { unicode: head.unicode + hU + zU, caret: headA + hA + zA, old: headA + hA + zOld };
  });

describe('random formulas (property)', () => {
  it('read alike in Unicode, caret and older notation; the writers give the same formula back', () => {
    fc.assert(
      fc.property(formulaArb, ({ unicode, caret, old }) => {
        const f = parseFormula(unicode);
        expectSame(parseFormula(caret), f, caret);
        expectSame(parseFormula(old), f, old);
        expectSame(parseFormula(formulaAscii(f)), f, formulaAscii(f));
        expectSame(parseFormula(formulaUnicode(f)), f, formulaUnicode(f));
        expect(tokenizeFormula(unicode).map((t) => t.text).join('')).toBe(unicode);
      }),
      RUNS,
    );
  });

  it('the writers are idempotent, and ASCII → Unicode → ASCII is the identity', () => {
    fc.assert(
      fc.property(formulaArb, ({ unicode, caret }) => {
        const a = formulaAscii(unicode);
        const u = formulaUnicode(caret);
        expect(formulaAscii(a)).toBe(a);
        expect(formulaUnicode(u)).toBe(u);
        expect(formulaAscii(formulaUnicode(a))).toBe(a);
        // Unicode input comes back unchanged, but for an explicit count or coefficient 1, dropped.
        expect(formulaUnicode(unicode)).toBe(unicode.replace(/(?<![₀-₉.])₁(?![.₀-₉])/g, '').replace(/·1(?!\d)/, '·'));
        expect(a).toMatch(/^[\x21-\x7e]+$/);
      }),
      RUNS,
    );
  });
});

describe('remembered spellings (write.ts memo)', () => {
  it('keeps the two styles apart and gives the same text once the memo has been emptied', () => {
    // Worked examples as above, asked in turns so that a memo shared by the styles would show.
    for (let k = 0; k < 3; k++) {
      expect(formulaUnicode('Fe+2')).toBe('Fe²⁺');
      expect(formulaAscii('Fe+2')).toBe('Fe^2+');
      expect(formulaAscii('Fe²⁺')).toBe('Fe^2+');
      expect(formulaUnicode('HFeO2-')).toBe('HFeO₂⁻');
    }
    // More distinct formulas than the memo holds (4096): it is emptied and filled again.
    for (let n = 2; n <= 5001; n++) expect(formulaAscii(`C${n}H${n + 1}+`)).toBe(`C${n}H${n + 1}^+`);
    expect(formulaUnicode('Fe(CN)6-4')).toBe('Fe(CN)₆⁴⁻');
    expect(formulaAscii('Fe(CN)₆⁴⁻')).toBe('Fe(CN)6^4-');
  });

  it('an invalid formula throws every time (never remembered)', () => {
    expect(() => formulaAscii('Fe+2+')).toThrow();
    expect(() => formulaAscii('Fe+2+')).toThrow();
  });
});
