/**
 * Warnings for formula text that reads like a mistyped charge (text that parses, but probably not
 * as meant). The heuristic, step by step:
 *   1. strip a trailing phase tag and parse; text that does not parse gives no warning (parseFormula
 *      reports it);
 *   2. the text must end with a run of digits then a lone sign: "+", "-", "−" (older-form charge) or
 *      a superscript "⁺", "⁻" (Fe2⁺: a digit on the line, only the sign raised);
 *   3. the alternative reading moves the last digit into the charge: Fe2+ → Fe with charge 2+. It
 *      must parse, and its charge must differ from the one read (a last digit 1 gives the same
 *      charge, e.g. Fe8O19H21-: that is no mistyped charge, so no warning);
 *   4. warn only when the digit run has two or more digits (SO42- would mean O₄₂) or the formula
 *      holds a single element (Fe2+ would mean Fe₂ with charge 1+). HFeO2-, Fe(OH)2+, MnO4-, NH4+
 *      give no warning. Text with a caret or superscript-digit charge is never ambiguous.
 * The advice names the reading, then the notation to write (`Fe^2+`); the older form (`Fe+2`), still
 * read, is no longer suggested.
 */
import { type Formula, parseFormula, splitPhase } from './parse.js';
import { formulaUnicode } from './write.js';

/** "+2" → "2+", "-1" → "1−"… as a charge is spoken: number then sign. */
const spoken = (z: number): string => `${Math.abs(z)}${z > 0 ? '+' : '−'}`;

function tryParse(text: string): Formula | undefined {
  try {
    return parseFormula(text);
  } catch {
    return undefined;
  }
}

/** Warnings for `text` (see the module comment); empty when it reads unambiguously. */
export function formulaWarnings(text: string): string[] {
  // Step 1.
  const { formula } = splitPhase(text);
  const f = tryParse(formula);
  if (!f) return [];
  // Step 2.
  const m = /^(.*?)(\d+)([+\-\u2212\u207a\u207b])$/.exec(formula);
  if (!m) return [];
  const [, head, digits, signChar] = m as unknown as [string, string, string, string];
  // Step 3.
  const sign = signChar === '+' || signChar === '\u207a' ? '+' : '-';
  const last = digits.slice(-1);
  const rest = digits.slice(0, -1) === '1' ? '' : digits.slice(0, -1);
  const newForm = `${head}${rest}^${last}${sign}`;
  const oldForm = `${head}${rest}${sign}${last}`;
  const alt = tryParse(newForm);
  if (!alt || alt.charge === f.charge || !tryParse(oldForm)) return [];
  // Step 4.
  const singleElement = Object.keys(f.elements).length === 1;
  if (digits.length < 2 && !singleElement) return [];
  return [
    `formula "${formula}" reads as ${formulaUnicode(f)} (${head}${digits} with charge ${spoken(f.charge)}); ` +
      `if ${formulaUnicode(alt)} with charge ${spoken(alt.charge)} is meant, write "${newForm}" ` +
      '(the charge after a caret, number before the sign)',
  ];
}
