/**
 * Property-based checks of the formula parser (src/chem/formula.ts):
 *   - formatFormula → parseFormula gives back the element counts and charge;
 *   - formula text generated from a random syntax tree (groups, brackets, hydrate dots, charges)
 *     parses to the counts computed independently from the tree;
 *   - on arbitrary text, parseFormula, tokenizeFormula and formulaWarnings either return or throw
 *     FormulaError (parseFormula/tokenizeFormula only) — never anything else.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ELEMENTS } from '../../src/chem/elements.js';
import { FormulaError, formatFormula, formulaWarnings, parseFormula, tokenizeFormula } from '../../src/chem/formula.js';

const SYMBOLS = [...ELEMENTS.keys()];
const RUNS = { numRuns: 400, seed: 20240909 } as const;

/** Element counts compare to 12 significant figures (the parser's stated precision). */
function expectCounts(got: Record<string, number>, want: Record<string, number>): void {
  expect(Object.keys(got).sort()).toEqual(Object.keys(want).sort());
  for (const [el, n] of Object.entries(want)) expect(got[el]).toBeCloseTo(n, 9);
}

describe('formatFormula → parseFormula round trip', () => {
  it('gives back counts and charge for random element maps, integer and decimal counts', () => {
    const count = fc.oneof(
      fc.integer({ min: 1, max: 60 }),
      fc.integer({ min: 1, max: 9999 }).map((k) => k / 100),
      fc.integer({ min: 1, max: 999 }).map((k) => k / 1000),
    );
    const map = fc.dictionary(fc.constantFrom(...SYMBOLS), count, { minKeys: 1, maxKeys: 7 });
    fc.assert(
      fc.property(map, fc.integer({ min: -6, max: 6 }), (elements, charge) => {
        const text = formatFormula(elements, charge);
        const f = parseFormula(text);
        expectCounts(f.elements, elements);
        expect(f.charge).toBe(charge);
        // Canonical text is a fixed point.
        expect(formatFormula(f.elements, f.charge)).toBe(text);
      }),
      RUNS,
    );
  });

  it('a worked example: CuSO4·5H2O has Cu 1, S 1, O 9, H 10 (common practice: blue vitriol)', () => {
    expectCounts(parseFormula('CuSO4·5H2O').elements, { Cu: 1, S: 1, O: 9, H: 10 });
    expect(formatFormula({ Cu: 1, S: 1, O: 9, H: 10 }, 0)).toBe('CuH10O9S');
  });
});

/** A random formula syntax tree rendered to text, with its element counts computed from the tree. */
interface Gen {
  text: string;
  counts: Record<string, number>;
}

function addInto(into: Record<string, number>, from: Record<string, number>, k: number): void {
  for (const [el, n] of Object.entries(from)) into[el] = (into[el] ?? 0) + n * k;
}

const countArb = fc.oneof(fc.constant(1), fc.integer({ min: 1, max: 12 }));
const renderCount = (n: number, explicit: boolean): string => (n === 1 && !explicit ? '' : String(n));

const { group } = fc.letrec<{ group: Gen; unit: Gen }>((tie) => ({
  unit: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.record({ el: fc.constantFrom(...SYMBOLS), n: countArb, explicit: fc.boolean() }).map(({ el, n, explicit }) => ({
      text: el + renderCount(n, explicit),
      counts: { [el]: n },
    })),
    fc.record({ inner: tie('group'), square: fc.boolean(), n: countArb }).map(({ inner, square, n }) => {
      const counts: Record<string, number> = {};
      addInto(counts, inner.counts, n);
      const [o, c] = square ? ['[', ']'] : ['(', ')'];
      return { text: `${o}${inner.text}${c}${renderCount(n, false)}`, counts };
    }),
  ),
  group: fc.array(tie('unit'), { minLength: 1, maxLength: 4 }).map((units) => {
    const counts: Record<string, number> = {};
    for (const u of units) addInto(counts, u.counts, 1);
    return { text: units.map((u) => u.text).join(''), counts };
  }),
}));

const formulaArb = fc
  .record({
    head: group,
    hydrates: fc.array(fc.record({ dot: fc.constantFrom('·', '.', '*'), k: fc.option(fc.integer({ min: 1, max: 12 }), { nil: undefined }), g: group }), {
      maxLength: 2,
    }),
    charge: fc.integer({ min: -5, max: 5 }),
    lone: fc.boolean(),
  })
  .map(({ head, hydrates, charge, lone }) => {
    const counts: Record<string, number> = {};
    addInto(counts, head.counts, 1);
    let text = head.text;
    for (const h of hydrates) {
      text += h.dot + (h.k === undefined ? '' : String(h.k)) + h.g.text;
      addInto(counts, h.g.counts, h.k ?? 1);
    }
    if (charge !== 0) {
      const mag = Math.abs(charge);
      text += (charge > 0 ? '+' : '-') + (mag === 1 && lone ? '' : String(mag));
    }
    return { text, counts, charge };
  });

describe('parseFormula on formulas generated from the grammar', () => {
  it('gives the counts and charge of the syntax tree, and tokens that spell the text', () => {
    fc.assert(
      fc.property(formulaArb, ({ text, counts, charge }) => {
        const f = parseFormula(text);
        expect(f.text).toBe(text);
        expectCounts(f.elements, counts);
        expect(f.charge).toBe(charge);
        expect(tokenizeFormula(text).map((t) => t.text).join('')).toBe(text);
      }),
      RUNS,
    );
  });
});

/** Either a well-formed Formula or a FormulaError with a position inside (or just after) the text. */
function checkTotal(text: string): void {
  let f: ReturnType<typeof parseFormula> | undefined;
  try {
    f = parseFormula(text);
  } catch (e) {
    expect(e).toBeInstanceOf(FormulaError);
    const fe = e as FormulaError;
    expect(fe.position).toBeGreaterThanOrEqual(1);
    expect(fe.position).toBeLessThanOrEqual(text.length + 1);
    expect(fe.message).toContain('expected');
  }
  if (f) {
    expect(Number.isInteger(f.charge)).toBe(true);
    expect(Object.keys(f.elements).length).toBeGreaterThan(0);
    for (const [el, n] of Object.entries(f.elements)) {
      expect(ELEMENTS.has(el)).toBe(true);
      expect(Number.isFinite(n) && n > 0).toBe(true);
    }
    expect(tokenizeFormula(text).map((t) => t.text).join('')).toBe(text);
  }
  // Warnings never throw, whatever the text.
  expect(Array.isArray(formulaWarnings(text))).toBe(true);
}

describe('parseFormula on arbitrary text: returns or throws FormulaError, nothing else', () => {
  it('any unicode text', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 40 }), checkTotal), RUNS);
  });

  it('text over the formula alphabet (near misses of real formulas)', () => {
    const ch = fc.constantFrom(...'FeOHCuSNaClKZnxo()[]+-+-0123456789.·*  \t(s)(aq)'.split(''));
    fc.assert(fc.property(fc.string({ unit: ch, maxLength: 24 }), checkTotal), RUNS);
  });

  it('valid formulas with one character deleted, inserted or replaced', () => {
    const edit = fc.record({
      at: fc.nat(),
      op: fc.constantFrom('delete', 'insert', 'replace'),
      c: fc.constantFrom(...'()[]+-0.·*eO1 '.split('')),
    });
    fc.assert(
      fc.property(formulaArb, edit, ({ text }, { at, op, c }) => {
        const k = at % (text.length + 1);
        const mutated =
          op === 'delete' ? text.slice(0, k) + text.slice(k + 1) : op === 'insert' ? text.slice(0, k) + c + text.slice(k) : text.slice(0, k) + c + text.slice(k + 1);
        checkTotal(mutated);
      }),
      RUNS,
    );
  });

  it('huge counts and charges stay finite or are refused; deep brackets do not overflow', () => {
    for (const t of ['Fe99999999999999999999', 'Fe+99999999999999999999', `${'('.repeat(2000)}Fe${')'.repeat(2000)}`]) {
      checkTotal(t);
    }
  });

  // BUG: src/chem/formula.ts Parser.number accepts a digit run that overflows to Infinity:
  // parseFormula('Fe' + '9'.repeat(400)).elements.Fe === Infinity (no FormulaError). The same for a
  // charge: parseFormula('Fe+' + '9'.repeat(400)).charge === Infinity. The loader's 100-character
  // formula limit keeps this out of system files, but the library API accepts it.
  it('a count of 400 digits (Infinity) is refused with FormulaError', () => {
    checkTotal('Fe' + '9'.repeat(400));
    checkTotal('Fe+' + '9'.repeat(400));
  });
});
