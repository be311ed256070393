/**
 * Reaction text in the notation of formula.ts: the electron, and the writers of an equilibrium
 * `Fe²⁺ + 2e⁻ ⇌ Fe(s)` (Unicode, for people) and `Fe^2+ + 2e^- <=> Fe(s)` (its ASCII twin, for JSON
 * and plain-text files). ⇌ (U+21CC RIGHTWARDS HARPOON OVER LEFTWARDS HARPOON) is the one
 * equilibrium sign; "<=>" stands for it in ASCII.
 *
 * Writing a reaction, step by step:
 *   1. every term with a negative coefficient goes left, positive right, zero nowhere; the order of
 *      the terms is kept (reactionUnicode/reactionAscii: species, then H⁺, then e⁻, then H₂O, as the
 *      balanced-reaction text has always been ordered);
 *   2. the coefficient is written before the formula without a space, 1 omitted ("2e⁻", "H₂O(l)");
 *      a number is written plainly (integers as integers, decimals without exponent), a string
 *      coefficient such as "1/2" as given;
 *   3. the formula is re-spelled (formulaUnicode / formulaAscii) and tagged with its phase: "(s)",
 *      "(l)", "(g)" always, "(aq)" only on a neutral dissolved species (an ion is dissolved anyway);
 *   4. sides are joined with " + ", and the two sides with " ⇌ " / " <=> ".
 */
import { parseFormula } from './parse.js';
import { formatNumber, formulaAscii, formulaUnicode } from './write.js';

/** The electron as written in Unicode text and in ASCII text. */
export const ELECTRON_UNICODE = 'e\u207b';
export const ELECTRON_ASCII = 'e^-';
/** The equilibrium sign ⇌ (U+21CC) and its ASCII twin. */
export const EQUILIBRIUM_UNICODE = '\u21cc';
export const EQUILIBRIUM_ASCII = '<=>';

/**
 * Whether a reaction term is the electron: `e^-`, `e⁻`, the older `e-`, and the same with U+2212
 * minus (`e−`, `e^−`). Example: isElectron("e⁻") → true; isElectron("e") → false.
 */
export function isElectron(text: string): boolean {
  return /^e(?:\^?[-\u2212]|\u207b)$/.test(text);
}

export type Notation = 'unicode' | 'ascii';

/** One term of an equilibrium: the electron when `formula` is an electron spelling (isElectron). */
export interface EquationTerm {
  /** Signed coefficient: negative on the left, positive on the right, zero for no term. */
  nu: number;
  formula: string;
  /** 's', 'l', 'g' or 'aq'; omitted for no tag. */
  phase?: string;
  /** Coefficient text to print instead of |nu| (e.g. "1/2"); "1" is omitted like the number 1. */
  coefficientText?: string;
}

/** A formula's charge, remembered per text (reactions repeat the same few formulas; emptied at 4096). */
const CHARGES = new Map<string, number>();
function chargeOf(formula: string): number {
  let z = CHARGES.get(formula);
  if (z === undefined) {
    z = parseFormula(formula).charge;
    if (CHARGES.size >= 4096) CHARGES.clear();
    CHARGES.set(formula, z);
  }
  return z;
}

function termText(t: EquationTerm, notation: Notation): string {
  const mag = t.coefficientText ?? formatNumber(Math.abs(t.nu));
  const c = mag === '1' ? '' : mag;
  if (isElectron(t.formula)) return c + (notation === 'unicode' ? ELECTRON_UNICODE : ELECTRON_ASCII);
  const spelled = notation === 'unicode' ? formulaUnicode(t.formula) : formulaAscii(t.formula);
  const p = t.phase;
  const tag = p === 's' || p === 'l' || p === 'g' || (p === 'aq' && chargeOf(t.formula) === 0) ? `(${p})` : '';
  return c + spelled + tag;
}

/**
 * An equilibrium as text (steps in the module comment). Throws FormulaError when a formula does not
 * parse. Example: [{nu: −1, formula: "Fe+2", phase: "aq"}, {nu: −2, formula: "e-"}, {nu: 1,
 * formula: "Fe", phase: "s"}] → "Fe²⁺ + 2e⁻ ⇌ Fe(s)" (unicode), "Fe^2+ + 2e^- <=> Fe(s)" (ascii).
 */
export function equilibriumText(terms: readonly EquationTerm[], notation: Notation): string {
  const side = (s: -1 | 1): string =>
    terms
      .filter((t) => Math.sign(t.nu) === s)
      .map((t) => termText(t, notation))
      .join(' + ');
  const sign = notation === 'unicode' ? EQUILIBRIUM_UNICODE : EQUILIBRIUM_ASCII;
  return `${side(-1)} ${sign} ${side(1)}`;
}

/** Species terms of a balanced boundary reaction (the shape solve/reaction.ts produces). */
export interface SpeciesTerm {
  formula: string;
  phase: string;
  nu: number;
}

function balancedTerms(terms: readonly SpeciesTerm[], water: number, protons: number, electrons: number): EquationTerm[] {
  return [
    ...terms.map((t) => ({ nu: t.nu, formula: t.formula, phase: t.phase })),
    { nu: protons, formula: 'H+', phase: 'aq' },
    { nu: electrons, formula: ELECTRON_ASCII },
    { nu: water, formula: 'H2O', phase: 'l' },
  ];
}

/**
 * A balanced reaction (species, H⁺, e⁻ and H₂O coefficients, reduction direction as given) in
 * Unicode: reactionUnicode([{formula: "Fe+2", phase: "aq", nu: −1}, {formula: "Fe", phase: "s",
 * nu: 1}], 0, 0, −2) → "Fe²⁺ + 2e⁻ ⇌ Fe(s)". Same arguments and term order as the reaction text
 * of solve/reaction.ts, which it is meant to replace.
 */
export function reactionUnicode(terms: readonly SpeciesTerm[], water: number, protons: number, electrons: number): string {
  return equilibriumText(balancedTerms(terms, water, protons, electrons), 'unicode');
}

/** The ASCII twin of reactionUnicode: "Fe^2+ + 2e^- <=> Fe(s)". */
export function reactionAscii(terms: readonly SpeciesTerm[], water: number, protons: number, electrons: number): string {
  return equilibriumText(balancedTerms(terms, water, protons, electrons), 'ascii');
}
