/**
 * Chemical formula text in ephmap notation — the design note, and the one import point for
 * reading, writing, warnings and molar mass (the code lives in parse.ts, write.ts, warnings.ts,
 * mass.ts; reactions in reaction-text.ts; IUPAC hydroxo names in hydroxo-names.ts).
 *
 * Notation (what is read):
 *   - Formulas are written in IUPAC order as the author gives it (central atom first for complexes:
 *     `Fe(OH)2^+`, `Fe(CN)6^4-`); the reader keeps that order and never reorders.
 *   - The charge follows a caret, number before the sign, 1 omitted: `Fe^2+`, `HFeO2^-`, `CuO2^2-`,
 *     `Fe(CN)6^4-` — the IUPAC way of writing a charge (Green Book, 3rd ed. 2007, §2.10.1: "Fe³⁺"),
 *     spelled in ASCII. The caret makes the charge unambiguous: `Fe2^+` is Fe₂⁺, `Fe^2+` is Fe²⁺.
 *   - The same with Unicode scripts: `Fe²⁺`, `HFeO₂⁻`, `CuO₂²⁻` (superscript digits and ⁺ ⁻ for the
 *     charge; subscript digits ₀…₉ for counts; plain digits for counts are fine too).
 *   - The older form, sign then number (`Fe+2`, `HFeO2-`, `CuO2-2`), is still read so that files
 *     written before keep working; it is no longer written. U+2212 "−" is read as a minus sign in
 *     the caret and older forms.
 *   - All three give the same parsed Formula (counts in the same key order, same charge).
 *   - Phase tags stay a suffix: `Fe(s)`, `H2O(l)`, `O2(g)`, `CO2(aq)` (see splitPhase).
 *   - The electron is `e^-`, `e⁻` or (older) `e-` — not a formula; see isElectron.
 *
 * Notation (what is written):
 *   - For people (tables, line lists, probe text, reports, captions, HTML): formulaUnicode —
 *     `Fe²⁺`, `Fe₃O₄`, `HFeO₂⁻`, `Fe(CN)₆⁴⁻`, `CuSO₄·5H₂O`; reactions with ⇌ (U+21CC) as the one
 *     equilibrium sign: `Fe²⁺ + 2e⁻ ⇌ Fe(s)`.
 *   - For JSON and other plain-text files: formulaAscii, the one canonical ASCII form —
 *     `Fe^2+`, `Fe3O4`, `HFeO2^-`, `Fe(CN)6^4-`, `CuSO4.5H2O`; reactions `Fe^2+ + 2e^- <=> Fe(s)`.
 *     Why this form: it is pure ASCII (safe in any file, shell and grep), it spells the printed form
 *     character for character (caret = "raise"), it reads back with no ambiguity (a count and a
 *     charge can never run together as in `Fe2+`), and it keeps the author's order and brackets.
 *     "." is its hydrate dot (ASCII); a decimal count ≥ 1 followed by more atoms is bracketed,
 *     `(Ni1.5)Fe`, so that the dot is never mistaken (grammar in parse.ts). Count 1 and charge
 *     number 1 are omitted.
 *   - formatFormula (Hill order, from an element map) still writes the older charge form until its
 *     callers move over.
 */
export { FormulaError, MAX_CHARGE, MAX_COUNT, parseFormula, sameFormula, splitPhase, tokenizeFormula } from './parse.js';
export type { Formula, FormulaToken, FormulaTokenKind, Phase } from './parse.js';
export { chargeLabel, formatFormula, formatNumber, formulaAscii, formulaUnicode } from './write.js';
export { formulaWarnings } from './warnings.js';
export { molarMass } from './mass.js';
