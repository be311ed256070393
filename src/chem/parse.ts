/**
 * The formula reader: text in any of the three accepted charge notations (see formula.ts for the
 * notation note) → element counts, charge and typesetting tokens.
 *
 * Grammar (whitespace is not allowed anywhere):
 *   formula   := group (dot coefficient? group)* charge?
 *   group     := unit+
 *   unit      := element count? | "(" group ")" count? | "[" group "]" count?
 *   element   := Uppercase lowercase?           (must be one of the 118 elements; case-sensitive)
 *   count     := digits ("." digits)?           (positive; integer or decimal)
 *              | subdigits ("." subdigits)?     (₀…₉; "." followed by a subscript digit is always a
 *                                                decimal point)
 *   dot       := "·" | "." | "*"                (hydrate / adduct separator)
 *   charge    := "^" digits? sign               (Fe^2+, HFeO2^-: number before sign, lone sign = 1)
 *              | supdigits? supsign             (Fe²⁺, HFeO₂⁻: ⁰…⁹ then ⁺ or ⁻)
 *              | sign digits?                   (older form, still read: Fe+2, HFeO2-, CuO2-2)
 *   sign      := "+" | "-" | "−" (U+2212)
 * A charge number has no leading zero and is at most MAX_CHARGE; "Fe++" and "Fe^+2" are refused
 * with a hint.
 *
 * Decimal point versus hydrate dot (ASCII digits): after a count, "." followed by digits is read as
 * a decimal point when the integer part is 0 (`Fe0.95O`) or when the fraction ends the group (end
 * of text, ")", "]", a charge, "·", "*"), e.g. `UO2.12`, `(Ni1.5)Fe`. Otherwise it is the hydrate
 * dot: `CuSO4.5H2O` = CuSO4·5H2O. Write a decimal count with integer part ≥ 1 followed by more
 * atoms inside brackets: `(Ni1.5)Fe`. `formulaAscii` and `formatFormula` do so automatically.
 */
import { EXIT, EphmapError, type ExitStatus } from '../errors.js';
import { isElement } from './elements.js';
import { MINUS_SIGN, SUP_PLUS, isSubDigit, isSupDigit, isSupSign, subDigit, supDigit } from './scripts.js';

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
 * `text` is the source characters (the tokens spell the text: "₂", "^2+", "²⁺" and "+2" as written);
 * `value` is set for count, coefficient and charge tokens — typeset from `value`, not `text`.
 */
export interface FormulaToken {
  kind: FormulaTokenKind;
  text: string;
  value?: number;
}

/** A formula text that does not follow the grammar. `position` is 1-based (length + 1 = end of text). */
export class FormulaError extends EphmapError {
  readonly code = 'formula';
  readonly exitStatus: ExitStatus = EXIT.input;
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
/** A charge sign in the caret and older forms: "+", "-" or U+2212. */
const isSign = (c: string | undefined): boolean => c === '+' || c === '-' || c === MINUS_SIGN;
/** Characters that may start a charge. */
const startsCharge = (c: string | undefined): boolean => isSign(c) || c === '^' || isSupDigit(c) || isSupSign(c);
/** Counts are kept to 12 significant figures so that decimal arithmetic round-trips. */
export const norm = (x: number): number => Number(x.toPrecision(12));

/** Largest atom count or coefficient a formula may state (keeps totals finite and exact). */
export const MAX_COUNT = 1e6;
/** Largest charge number. */
export const MAX_CHARGE = 100;

const START = 'element symbol, "(" or "["';
const AFTER_TOP = 'element symbol, "(", "[", hydrate dot, charge or end of formula';

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
    // Step 1: the main group, then hydrate parts with their coefficients.
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
    // Step 2: the charge, in whichever notation, then the end of the text.
    const c = this.s[this.i];
    let charge = 0;
    if (startsCharge(c)) {
      const start = this.i;
      charge = this.charge();
      this.tokens.push({ kind: 'charge', text: this.s.slice(start, this.i), value: charge });
      if (this.i < this.s.length) {
        const next = this.s[this.i];
        const example = isSupDigit(c) || isSupSign(c) ? '"²⁺"' : '"^2+"';
        const hint = startsCharge(next) ? `write one charge, the number before the sign, e.g. ${example}` : undefined;
        this.fail('end of formula', hint);
      }
    } else if (this.i < this.s.length) {
      const hint = c === ')' || c === ']' ? `unmatched "${c}"` : undefined;
      this.fail(AFTER_TOP, hint);
    }
    return { elements: total, charge };
  }

  /** The charge in any accepted notation (the cursor is on its first character). */
  private charge(): number {
    const c = this.s[this.i]!;
    if (c === '^') {
      this.i++;
      if (isSign(this.s[this.i]) && isDigit(this.s[this.i + 1])) {
        this.fail('charge number or sign', `write the number before the sign, e.g. "^${this.s[this.i + 1]}${this.s[this.i]}"`);
      }
      const mag = isDigit(this.s[this.i]) ? this.magnitude(isDigit, Number) : 1;
      const sign = this.s[this.i];
      if (!isSign(sign)) this.fail('charge sign "+" or "-" after the number', 'e.g. "Fe^2+", "HFeO2^-"');
      this.i++;
      return sign === '+' ? mag : -mag;
    }
    if (isSupDigit(c) || isSupSign(c)) {
      const mag = isSupDigit(c) ? this.magnitude(isSupDigit, (d) => Number([...d].map((x) => supDigit(x)).join(''))) : 1;
      const sign = this.s[this.i];
      if (!isSupSign(sign)) {
        this.fail('superscript sign "⁺" or "⁻" after the superscript number', isSign(sign) ? 'write the sign as a superscript too, e.g. "Fe²⁺"' : undefined);
      }
      this.i++;
      return sign === SUP_PLUS ? mag : -mag;
    }
    // Older form: sign then number.
    this.i++;
    const mag = isDigit(this.s[this.i]) ? this.magnitude(isDigit, Number) : 1;
    return c === '+' ? mag : -mag;
  }

  /** A charge number: a digit run (ASCII or superscript), no leading zero, at most MAX_CHARGE. */
  private magnitude(isD: (c: string | undefined) => boolean, value: (digits: string) => number): number {
    const start = this.i;
    while (isD(this.s[this.i])) this.i++;
    const digits = this.s.slice(start, this.i);
    if (digits[0] === '0' || digits[0] === '\u2070') {
      this.fail('charge number 1 or more (no leading zero)', undefined, start);
    }
    const mag = value(digits);
    if (!(mag <= MAX_CHARGE)) this.fail(`charge number of at most ${MAX_CHARGE}`, undefined, start);
    return mag;
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
    if (units === 0) this.fail(START, this.startHint(c));
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

  /** Hint where a group should start but does not: a lower-case symbol, or the electron. */
  private startHint(c: string | undefined): string | undefined {
    if (!isLower(c)) return undefined;
    const next = this.s[this.i + 1];
    const guess = c!.toUpperCase() + (isLower(next) ? next : '');
    if (isElement(guess)) return `element symbols are case-sensitive: "${guess}"`;
    if (c === 'e' && (next === undefined || isSign(next) || next === '^' || isSupSign(next))) return 'the electron is not a formula';
    return undefined;
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
    const start = this.i;
    let value: number;
    if (isDigit(this.s[this.i])) value = this.number(false);
    else if (isSubDigit(this.s[this.i])) value = this.subscriptNumber();
    else return 1;
    this.tokens.push({ kind: 'count', text: this.s.slice(start, this.i), value });
    return value;
  }

  /** A count in subscript digits, "." then subscript digits being a decimal fraction: ₀.₉₅. */
  private subscriptNumber(): number {
    const start = this.i;
    let text = '';
    while (isSubDigit(this.s[this.i])) text += String(subDigit(this.s[this.i++]));
    if (this.s[this.i] === '.' && isSubDigit(this.s[this.i + 1])) {
      text += '.';
      this.i++;
      while (isSubDigit(this.s[this.i])) text += String(subDigit(this.s[this.i++]));
    }
    return this.checkCount(Number(text), false, start);
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
      const endsGroup = after === undefined || after === ')' || after === ']' || after === '·' || after === '*' || startsCharge(after);
      if (alwaysDecimal || Number(intPart) === 0 || endsGroup) this.i = j;
    }
    return this.checkCount(Number(this.s.slice(start, this.i)), alwaysDecimal, start);
  }

  private checkCount(value: number, coefficient: boolean, start: number): number {
    if (!(value > 0)) this.fail(coefficient ? 'positive coefficient' : 'positive count', undefined, start);
    if (!(value <= MAX_COUNT)) this.fail(`${coefficient ? 'coefficient' : 'count'} of at most ${MAX_COUNT}`, undefined, start);
    return value;
  }
}

/**
 * Parses formula text (see grammar above). Throws FormulaError on any syntax error, unknown element
 * symbol or whitespace. Examples: `CuSO4·5H2O` → { Cu: 1, S: 1, O: 9, H: 10 }, charge 0;
 * `[Cu(NH3)4]^2+`, `[Cu(NH₃)₄]²⁺` and `[Cu(NH3)4]+2` → { Cu: 1, N: 4, H: 12 }, charge +2.
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

/** Same element counts (order ignored, to 1e-9) and same charge. */
export function sameFormula(a: Formula, b: Formula): boolean {
  if (a.charge !== b.charge) return false;
  const ka = Object.keys(a.elements);
  const kb = Object.keys(b.elements);
  if (ka.length !== kb.length) return false;
  return ka.every((el) => el in b.elements && Math.abs(a.elements[el]! - b.elements[el]!) <= 1e-9);
}
