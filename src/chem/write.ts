/**
 * Formula writers: the Unicode form people read (`Fe²⁺`, `Fe₃O₄`, `HFeO₂⁻`, `Fe(CN)₆⁴⁻`), the one
 * canonical ASCII form kept in JSON (`Fe^2+`, `Fe3O4`, `HFeO2^-`, `Fe(CN)6^4-`), the superscript
 * charge label used by the typesetter, and the Hill-order formatter of an element map.
 * The notation and the reasons for each choice are in the note at the top of formula.ts.
 */
import { isElement } from './elements.js';
import { type Formula, type FormulaToken, norm, tokenizeFormula } from './parse.js';
import { SUP_MINUS, SUP_PLUS, toSubscript, toSuperscript } from './scripts.js';

/**
 * A positive number as formula text: integers plainly, decimals to 12 significant figures, never in
 * exponent notation (which the grammar does not accept): 2 → "2", 0.95 → "0.95", 1e-7 → "0.0000001".
 */
export function formatNumber(n: number): string {
  const x = norm(n);
  if (Number.isInteger(x)) return String(x);
  const plain = String(x);
  if (!plain.includes('e')) return plain;
  const decimals = Math.min(100, Math.max(0, 11 - Math.floor(Math.log10(x))));
  return x.toFixed(decimals).replace(/0+$/, '').replace(/\.$/, '');
}

type Style = 'unicode' | 'ascii';

/** The charge in the given style, number before sign, 1 omitted: 2 → "²⁺" / "^2+", −1 → "⁻" / "^-". */
function chargeText(z: number, style: Style): string {
  const mag = Math.abs(z);
  const digits = mag === 1 ? '' : String(mag);
  if (style === 'unicode') return toSuperscript(digits) + (z > 0 ? SUP_PLUS : SUP_MINUS);
  return `^${digits}${z > 0 ? '+' : '-'}`;
}

/**
 * Re-spells the tokens of a parsed formula, keeping its structure (order, brackets, hydrate parts).
 * Counts of 1 are dropped. In ASCII, a decimal count ≥ 1 that does not end its group is bracketed
 * with its unit (`Ni₁.₅Fe` → `(Ni1.5)Fe`), because "1.5" followed by more atoms would read as a
 * hydrate dot (see the grammar in parse.ts); subscript decimals need no bracket.
 */
function spell(tokens: readonly FormulaToken[], style: Style): string {
  const out: string[] = [];
  const opens: number[] = [];
  let unitStart = 0;
  tokens.forEach((t, k) => {
    switch (t.kind) {
      case 'element':
        unitStart = out.length;
        out.push(t.text);
        break;
      case 'open':
        opens.push(out.length);
        out.push(t.text);
        break;
      case 'close':
        unitStart = opens.pop() ?? 0;
        out.push(t.text);
        break;
      case 'count': {
        const n = norm(t.value!);
        if (n === 1) break;
        const digits = formatNumber(n);
        if (style === 'unicode') {
          out.push(toSubscript(digits));
          break;
        }
        const next = tokens[k + 1]?.kind;
        const endsGroup = next === undefined || next === 'close' || next === 'charge';
        out.push(digits);
        if (!Number.isInteger(n) && n >= 1 && !endsGroup) {
          out.splice(unitStart, 0, '(');
          out.push(')');
        }
        break;
      }
      case 'dot':
        out.push(style === 'unicode' ? '\u00b7' : '.');
        break;
      case 'coefficient':
        if (norm(t.value!) !== 1) out.push(formatNumber(t.value!));
        break;
      case 'charge':
        out.push(chargeText(t.value!, style));
        break;
    }
  });
  return out.join('');
}

const textOf = (f: Formula | string): string => (typeof f === 'string' ? f : f.text);

/**
 * Spellings already worked out, per style (text → text). A system is rebuilt at every distinct
 * temperature of a logged series, re-spelling the same few dozen formulas each time; the memo is
 * emptied when it reaches MEMO_MAX entries so that it stays small whatever the input. Only valid
 * formulas are kept (an invalid one throws before it is stored).
 */
const MEMO_MAX = 4096;
const ASCII_MEMO = new Map<string, string>();
const UNICODE_MEMO = new Map<string, string>();

function spelled(memo: Map<string, string>, text: string, style: Style): string {
  const hit = memo.get(text);
  if (hit !== undefined) return hit;
  const s = spell(tokenizeFormula(text), style);
  if (memo.size >= MEMO_MAX) memo.clear();
  memo.set(text, s);
  return s;
}

/**
 * The formula as people read it: counts as Unicode subscripts, the charge as Unicode superscripts
 * with the number before the sign and 1 omitted (IUPAC Green Book, 3rd ed. 2007, §2.10.1: "Fe³⁺",
 * "SO₄²⁻"). Brackets, order and hydrate parts are kept as written; the hydrate dot is "·".
 * Examples: Fe+2 → Fe²⁺, Fe3O4 → Fe₃O₄, HFeO2^- → HFeO₂⁻, Fe(CN)6-4 → Fe(CN)₆⁴⁻, CuSO4.5H2O → CuSO₄·5H₂O.
 * Accepts a parsed Formula or formula text (throws FormulaError on invalid text).
 */
export function formulaUnicode(f: Formula | string): string {
  return spelled(UNICODE_MEMO, textOf(f), 'unicode');
}

/**
 * The canonical ASCII form, for JSON and other plain-text files: counts as digits, the charge after
 * a caret with the number before the sign and 1 omitted, "." as the hydrate dot.
 * Examples: Fe+2 → Fe^2+, Fe²⁺ → Fe^2+, HFeO2- → HFeO2^-, Fe(CN)₆⁴⁻ → Fe(CN)6^4-, CuSO₄·5H₂O → CuSO4.5H2O.
 * parseFormula(formulaAscii(f)) has f's counts (same key order) and charge.
 */
export function formulaAscii(f: Formula | string): string {
  return spelled(ASCII_MEMO, textOf(f), 'ascii');
}

/**
 * Charge as a superscript label: 2 → "2+", 1 → "+", -1 → "−", -2 → "2−" (U+2212 minus), 0 → "".
 */
export function chargeLabel(charge: number): string {
  if (charge === 0) return '';
  const mag = Math.abs(charge);
  return `${mag === 1 ? '' : mag}${charge > 0 ? '+' : '\u2212'}`;
}

/**
 * Canonical formula text in Hill order (C, then H, then the rest alphabetically; without C all
 * alphabetically) with a trailing charge `+2`, `+`, `-`, `-2` (the older notation: unchanged until
 * its callers move to the new one). Count 1 is omitted. A decimal count ≥ 1 that is followed by
 * another element is bracketed, e.g. `(C1.5)H2`, so that parseFormula(formatFormula(e, z)) gives
 * the same counts (to 12 significant figures) and charge.
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
