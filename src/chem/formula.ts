/**
 * Chemical formula text in ephmap notation: parsing, canonical formatting, tokens for typesetting,
 * molar mass and warnings for charges that look mistyped.
 *
 * Grammar (whitespace is not allowed anywhere):
 *   formula   := group (dot coefficient? group)* charge?
 *   group     := unit+
 *   unit      := element count? | "(" group ")" count? | "[" group "]" count?
 *   element   := Uppercase lowercase?           (must be one of the 118 elements; case-sensitive)
 *   count     := digits ("." digits)?           (positive; integer or decimal)
 *   dot       := "·" | "." | "*"                (hydrate / adduct separator)
 *   charge    := ("+" | "-") digits?            (lone sign = ±1; "Fe++" is rejected)
 *
 * Decimal point versus hydrate dot: after a count, "." followed by digits is read as a decimal
 * point when the integer part is 0 (`Fe0.95O`) or when the fraction ends the group (end of text,
 * ")", "]", charge, "·", "*"), e.g. `UO2.12`, `(Ni1.5)Fe`. Otherwise it is the hydrate dot:
 * `CuSO4.5H2O` = CuSO4·5H2O. Write a decimal count with integer part ≥ 1 followed by more atoms
 * inside brackets: `(Ni1.5)Fe`. `formatFormula` does so automatically.
 */
import { ELEMENTS, isElement } from './elements.js';

export interface Formula {
  /** The formula text exactly as parsed. */
  text: string;
  /** Element → count (hydrate water included), keys in order of first appearance in the text. */
  elements: Record<string, number>;
  /** Charge number (integer; 0 for neutral species). */
  charge: number;
}

export type FormulaTokenKind = 'element' | 'count' | 'open' | 'close' | 'dot' | 'coefficient' | 'charge';

/**
 * A lexical piece of a formula, for typesetting. `count` (after an element or bracket) is a
 * subscript; `coefficient` (the multiplier right after a hydrate dot, the "5" of CuSO4·5H2O) is set
 * at normal size; `charge` is a superscript (render it with `chargeLabel(value)`).
 * `value` is set for count, coefficient and charge tokens.
 */
export interface FormulaToken {
  kind: FormulaTokenKind;
  text: string;
  value?: number;
}

/** A formula text that does not follow the grammar. `position` is 1-based (length + 1 = end of text). */
export class FormulaError extends Error {
  readonly text: string;
  readonly position: number;
  readonly expected: string;
  constructor(text: string, position: number, expected: string, hint?: string) {
    super(`formula "${text}": at character ${position}, expected ${expected}${hint ? ` (${hint})` : ''}`);
    this.name = 'FormulaError';
    this.text = text;
    this.position = position;
    this.expected = expected;
  }
}

const DOTS = new Set(['·', '.', '*']);
const CLOSER: Record<string, string> = { '(': ')', '[': ']' };
const isDigit = (c: string | undefined): boolean => c !== undefined && c >= '0' && c <= '9';
const isUpper = (c: string | undefined): boolean => c !== undefined && c >= 'A' && c <= 'Z';
const isLower = (c: string | undefined): boolean => c !== undefined && c >= 'a' && c <= 'z';
/** Counts are kept to 12 significant figures so that decimal arithmetic round-trips. */
const norm = (x: number): number => Number(x.toPrecision(12));

/** Largest atom count or coefficient a formula may state (keeps totals finite and exact). */
export const MAX_COUNT = 1e6;
/** Largest charge number. */
export const MAX_CHARGE = 100;

const START = 'element symbol, "(" or "["';
const AFTER_TOP = 'element symbol, "(", "[", hydrate dot, charge sign or end of formula';

type Counts = Map<string, number>;

function addInto(into: Counts, from: Counts, k: number): void {
  for (const [el, n] of from) into.set(el, norm((into.get(el) ?? 0) + n * k));
}

class Parser {
  private i = 0;
  readonly tokens: FormulaToken[] = [];
  constructor(private readonly s: string) {}

  private fail(expected: string, hint?: string, at = this.i): never {
    const c = this.s[at];
    if (!hint && c !== undefined && /\s/.test(c)) hint = 'whitespace is not allowed in a formula';
    throw new FormulaError(this.s, at + 1, expected, hint);
  }

  parse(): { elements: Counts; charge: number } {
    const total: Counts = new Map();
    addInto(total, this.group(null), 1);
    while (DOTS.has(this.s[this.i] ?? '')) {
      this.tokens.push({ kind: 'dot', text: this.s[this.i]! });
      this.i++;
      let k = 1;
      if (isDigit(this.s[this.i])) {
        const start = this.i;
        k = this.number(true);
        this.tokens.push({ kind: 'coefficient', text: this.s.slice(start, this.i), value: k });
      }
      addInto(total, this.group(null), k);
    }
    let charge = 0;
    const c = this.s[this.i];
    if (c === '+' || c === '-') {
      const start = this.i;
      this.i++;
      let mag = 1;
      if (isDigit(this.s[this.i])) {
        const dStart = this.i;
        while (isDigit(this.s[this.i])) this.i++;
        const digits = this.s.slice(dStart, this.i);
        if (digits.startsWith('0')) this.fail('charge number 1 or more (no leading zero)', undefined, dStart);
        mag = Number(digits);
        if (!(mag <= MAX_CHARGE)) this.fail(`charge number of at most ${MAX_CHARGE}`, undefined, dStart);
      }
      charge = c === '+' ? mag : -mag;
      this.tokens.push({ kind: 'charge', text: this.s.slice(start, this.i), value: charge });
      if (this.i < this.s.length) {
        const next = this.s[this.i];
        const hint =
          next === '+' || next === '-'
            ? `write the charge as one sign then a number, e.g. "${c}2"`
            : undefined;
        this.fail('end of formula', hint);
      }
    } else if (this.i < this.s.length) {
      const hint = c === ')' || c === ']' ? `unmatched "${c}"` : undefined;
      this.fail(AFTER_TOP, hint);
    }
    return { elements: total, charge };
  }

  /** One or more units, up to (and consuming) `closer` when given. */
  private group(closer: string | null): Counts {
    const counts: Counts = new Map();
    let units = 0;
    for (;;) {
      const c = this.s[this.i];
      if (isUpper(c)) {
        const el = this.element();
        this.tokens.push({ kind: 'element', text: el });
        addInto(counts, new Map([[el, 1]]), this.count());
      } else if (c === '(' || c === '[') {
        this.tokens.push({ kind: 'open', text: c });
        this.i++;
        const inner = this.group(CLOSER[c]!);
        addInto(counts, inner, this.count());
      } else {
        break;
      }
      units++;
    }
    const c = this.s[this.i];
    if (units === 0) {
      let hint: string | undefined;
      if (isLower(c)) {
        const guess = c!.toUpperCase() + (isLower(this.s[this.i + 1]) ? this.s[this.i + 1] : '');
        hint = isElement(guess)
          ? `element symbols are case-sensitive: "${guess}"`
          : c === 'e' && (this.s[this.i + 1] === '-' || this.s[this.i + 1] === undefined)
            ? 'the electron is not a formula'
            : undefined;
      }
      this.fail(START, hint);
    }
    if (closer !== null) {
      if (c === closer) {
        this.tokens.push({ kind: 'close', text: c });
        this.i++;
      } else if (c === undefined || c === ')' || c === ']') {
        this.fail(`"${closer}"`);
      } else {
        this.fail(`element symbol, "(", "[" or "${closer}"`);
      }
    }
    return counts;
  }

  private element(): string {
    const one = this.s[this.i]!;
    const two = isLower(this.s[this.i + 1]) ? one + this.s[this.i + 1] : null;
    if (two !== null && isElement(two)) {
      this.i += 2;
      return two;
    }
    if (isElement(one)) {
      this.i += 1;
      return one;
    }
    return this.fail('element symbol', `"${two ?? one}" is not an element`);
  }

  /** Optional count after an element or closing bracket; 1 when absent. */
  private count(): number {
    if (!isDigit(this.s[this.i])) return 1;
    const start = this.i;
    const value = this.number(false);
    this.tokens.push({ kind: 'count', text: this.s.slice(start, this.i), value });
    return value;
  }

  /**
   * Reads digits with an optional decimal fraction. With `alwaysDecimal` false (counts), "." is a
   * decimal point only under the rule in the module comment; otherwise it is left for the hydrate dot.
   */
  private number(alwaysDecimal: boolean): number {
    const start = this.i;
    while (isDigit(this.s[this.i])) this.i++;
    const intPart = this.s.slice(start, this.i);
    if (this.s[this.i] === '.' && isDigit(this.s[this.i + 1])) {
      let j = this.i + 1;
      while (isDigit(this.s[j])) j++;
      const after = this.s[j];
      const endsGroup =
        after === undefined || after === ')' || after === ']' || after === '+' || after === '-' || after === '·' || after === '*';
      if (alwaysDecimal || Number(intPart) === 0 || endsGroup) this.i = j;
    }
    const value = Number(this.s.slice(start, this.i));
    if (!(value > 0)) this.fail(alwaysDecimal ? 'positive coefficient' : 'positive count', undefined, start);
    if (!(value <= MAX_COUNT)) this.fail(`${alwaysDecimal ? 'coefficient' : 'count'} of at most ${MAX_COUNT}`, undefined, start);
    return value;
  }
}

/**
 * Parses formula text (see grammar above). Throws FormulaError on any syntax error, unknown element
 * symbol or whitespace. Example: `CuSO4·5H2O` → { Cu: 1, S: 1, O: 9, H: 10 }, charge 0;
 * `[Cu(NH3)4]+2` → { Cu: 1, N: 4, H: 12 }, charge +2.
 */
export function parseFormula(text: string): Formula {
  const { elements, charge } = new Parser(text).parse();
  return { text, elements: Object.fromEntries(elements), charge };
}

/** Tokens of a valid formula, for typesetting (throws FormulaError like parseFormula). */
export function tokenizeFormula(text: string): FormulaToken[] {
  const p = new Parser(text);
  p.parse();
  return p.tokens;
}

export type Phase = 's' | 'l' | 'g' | 'aq';

/**
 * Strips one trailing phase tag `(s)`, `(l)`, `(g)` or `(aq)` (lowercase only, so never confused with
 * an element group): `Fe(OH)3(s)` → { formula: "Fe(OH)3", phase: "s" }; `Fe(OH)3` → { formula: "Fe(OH)3" }.
 */
export function splitPhase(text: string): { formula: string; phase?: Phase } {
  const m = /^(.+)\((s|l|g|aq)\)$/.exec(text);
  return m ? { formula: m[1]!, phase: m[2] as Phase } : { formula: text };
}

/**
 * Warnings for formulas that read like a mistyped charge. Heuristic: the text ends with digit(s)
 * then a lone sign, moving the last digit behind the sign gives a valid formula, and either the
 * digit run has two or more digits (`SO42-` would mean O₄₂) or the formula holds a single element
 * (`Fe2+` would mean Fe₂ with charge +1). `HFeO2-`, `Fe(OH)2+`, `MnO4-`, `NH4+` give no warning.
 * A trailing phase tag is ignored. Text that does not parse gives no warning (parseFormula reports it).
 */
export function formulaWarnings(text: string): string[] {
  const { formula } = splitPhase(text);
  let f: Formula;
  try {
    f = parseFormula(formula);
  } catch {
    return [];
  }
  const m = /^(.*?)(\d+)([+-])$/.exec(formula);
  if (!m) return [];
  const [, head, digits, sign] = m as unknown as [string, string, string, string];
  const suggestion = `${head}${digits.slice(0, -1)}${sign}${digits.slice(-1)}`;
  try {
    parseFormula(suggestion);
  } catch {
    return [];
  }
  const singleElement = Object.keys(f.elements).length === 1;
  if (digits.length < 2 && !singleElement) return [];
  return [
    `formula "${formula}" reads as ${head}${digits} with charge ${f.charge > 0 ? '+' : ''}${f.charge}; ` +
      `if ${head}${digits.slice(0, -1)} with charge ${sign}${digits.slice(-1)} is meant, write "${suggestion}" (charge is a sign then a number)`,
  ];
}

/**
 * Molar mass M = Σ nᵢ·Aᵣ(i) in g/mol, from the IUPAC 2021 abridged/conventional standard atomic
 * weights (see elements.ts). The electron mass (5.49×10⁻⁴ g/mol per unit charge) is neglected.
 * Worked example: H2O → 2×1.008 + 15.999 = 18.015 g/mol.
 * Throws FormulaError if an element has no standard atomic weight (e.g. Tc, Pu).
 */
export function molarMass(f: Formula): number {
  let m = 0;
  for (const [el, n] of Object.entries(f.elements)) {
    const w = ELEMENTS.get(el)?.weight;
    if (w === null || w === undefined) {
      const at = f.text.indexOf(el);
      throw new FormulaError(
        f.text,
        at >= 0 ? at + 1 : 1,
        'element with a standard atomic weight',
        `${el} has none in IUPAC 2021; give the molar mass explicitly`,
      );
    }
    m += n * w;
  }
  return m;
}

function formatNumber(n: number): string {
  const x = norm(n);
  if (Number.isInteger(x)) return String(x);
  const plain = String(x);
  if (!plain.includes('e')) return plain;
  // Avoid exponent notation (1e-7), which the grammar does not accept: write 12 significant figures.
  const decimals = Math.min(100, Math.max(0, 11 - Math.floor(Math.log10(x))));
  return x.toFixed(decimals).replace(/0+$/, '').replace(/\.$/, '');
}

/**
 * Canonical formula text in Hill order (C, then H, then the rest alphabetically; without C all
 * alphabetically) with a trailing charge `+2`, `+`, `-`, `-2`. Count 1 is omitted. A decimal count
 * ≥ 1 that is followed by another element is bracketed, e.g. `(C1.5)H2`, so that
 * parseFormula(formatFormula(e, z)) gives the same counts (to 12 significant figures) and charge.
 * Throws RangeError for an unknown symbol, a count that is not a positive finite number, an empty
 * element map, or a non-integer charge.
 */
export function formatFormula(elements: Record<string, number>, charge: number): string {
  const symbols = Object.keys(elements);
  if (symbols.length === 0) throw new RangeError('formatFormula: no elements');
  if (!Number.isInteger(charge)) throw new RangeError(`formatFormula: charge ${charge} is not an integer`);
  for (const el of symbols) {
    if (!isElement(el)) throw new RangeError(`formatFormula: "${el}" is not an element`);
    const n = elements[el]!;
    if (!(Number.isFinite(n) && norm(n) > 0)) throw new RangeError(`formatFormula: count of ${el} must be positive, got ${n}`);
  }
  const byName = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);
  const order =
    'C' in elements
      ? ['C', ...('H' in elements ? ['H'] : []), ...symbols.filter((s) => s !== 'C' && s !== 'H').sort(byName)]
      : [...symbols].sort(byName);
  const parts = order.map((el, idx) => {
    const n = norm(elements[el]!);
    if (n === 1) return el;
    const text = el + formatNumber(n);
    const last = idx === order.length - 1;
    return !Number.isInteger(n) && n >= 1 && !last ? `(${text})` : text;
  });
  const z = charge === 0 ? '' : `${charge > 0 ? '+' : '-'}${Math.abs(charge) === 1 ? '' : Math.abs(charge)}`;
  return parts.join('') + z;
}

/**
 * Charge as a superscript label: 2 → "2+", 1 → "+", -1 → "−", -2 → "2−" (U+2212 minus), 0 → "".
 */
export function chargeLabel(charge: number): string {
  if (charge === 0) return '';
  const mag = Math.abs(charge);
  return `${mag === 1 ? '' : mag}${charge > 0 ? '+' : '\u2212'}`;
}

/** Same element counts (order ignored, to 1e-9) and same charge. */
export function sameFormula(a: Formula, b: Formula): boolean {
  if (a.charge !== b.charge) return false;
  const ka = Object.keys(a.elements);
  const kb = Object.keys(b.elements);
  if (ka.length !== kb.length) return false;
  return ka.every((el) => el in b.elements && Math.abs(a.elements[el]! - b.elements[el]!) <= 1e-9);
}
