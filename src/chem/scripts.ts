/**
 * Unicode super- and subscript characters used by the formula notation (Unicode blocks "Latin-1
 * Supplement" ¹²³ and "Superscripts and Subscripts" U+2070–U+209F): subscript digits for atom
 * counts, superscript digits and signs for charges, and U+2212 MINUS SIGN as a sign.
 */

/** Superscript digit characters, index = digit value: ⁰¹²³⁴⁵⁶⁷⁸⁹. */
export const SUP_DIGITS = ['\u2070', '\u00b9', '\u00b2', '\u00b3', '\u2074', '\u2075', '\u2076', '\u2077', '\u2078', '\u2079'] as const;
/** Subscript digit characters, index = digit value: ₀₁₂₃₄₅₆₇₈₉. */
export const SUB_DIGITS = ['\u2080', '\u2081', '\u2082', '\u2083', '\u2084', '\u2085', '\u2086', '\u2087', '\u2088', '\u2089'] as const;
/** SUPERSCRIPT PLUS SIGN ⁺. */
export const SUP_PLUS = '\u207a';
/** SUPERSCRIPT MINUS ⁻. */
export const SUP_MINUS = '\u207b';
/** MINUS SIGN − (accepted wherever an ASCII hyphen-minus writes a negative charge). */
export const MINUS_SIGN = '\u2212';

const SUP_VALUE = new Map<string, number>(SUP_DIGITS.map((c, i) => [c, i]));
const SUB_VALUE = new Map<string, number>(SUB_DIGITS.map((c, i) => [c, i]));

/** Value 0–9 of a superscript digit character, or undefined. */
export const supDigit = (c: string | undefined): number | undefined => (c === undefined ? undefined : SUP_VALUE.get(c));
/** Value 0–9 of a subscript digit character, or undefined. */
export const subDigit = (c: string | undefined): number | undefined => (c === undefined ? undefined : SUB_VALUE.get(c));
export const isSupDigit = (c: string | undefined): boolean => supDigit(c) !== undefined;
export const isSubDigit = (c: string | undefined): boolean => subDigit(c) !== undefined;
export const isSupSign = (c: string | undefined): boolean => c === SUP_PLUS || c === SUP_MINUS;

/** ASCII digits (and ".") written as subscripts: "0.95" → "₀.₉₅" (the point stays on the line). */
export function toSubscript(digits: string): string {
  return [...digits].map((c) => (c >= '0' && c <= '9' ? SUB_DIGITS[Number(c)] : c)).join('');
}

/** ASCII digits written as superscripts: "2" → "²". */
export function toSuperscript(digits: string): string {
  return [...digits].map((c) => (c >= '0' && c <= '9' ? SUP_DIGITS[Number(c)] : c)).join('');
}
