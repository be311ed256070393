/**
 * The two presentation helpers every output goes through (the notation note is in formula.ts):
 *   - "for people" (text tables, line lists, probe/window/cell text, reports, captions, HTML,
 *     warnings): Unicode — `Fe²⁺`, `Fe₃O₄(s)`, `HFeO₂⁻`, `Fe²⁺ + 2e⁻ ⇌ Fe(s)`;
 *   - "for JSON" (and other machine-read files): the canonical ASCII form — `Fe^2+`, `Fe3O4(s)`,
 *     `HFeO2^-`, `Fe^2+ + 2e^- <=> Fe(s)`.
 * Each accepts text in any notation the reader takes (caret, Unicode, older `Fe+2`), with an
 * optional phase tag `(s)`, `(l)`, `(g)`, `(aq)` that is kept. They never throw: text that is not a
 * formula (a label such as "mixed", a name) is returned unchanged, so a presenter can be applied to
 * any species label without a guard.
 */
import { FormulaError, splitPhase } from './parse.js';
import { ELECTRON_ASCII, ELECTRON_UNICODE, EQUILIBRIUM_ASCII, EQUILIBRIUM_UNICODE, isElectron } from './reaction-text.js';
import { formulaAscii, formulaUnicode } from './write.js';

type Style = 'unicode' | 'ascii';

function respell(text: string, style: Style): string {
  if (isElectron(text)) return style === 'unicode' ? ELECTRON_UNICODE : ELECTRON_ASCII;
  const { formula, phase } = splitPhase(text);
  try {
    const body = style === 'unicode' ? formulaUnicode(formula) : formulaAscii(formula);
    return phase === undefined ? body : `${body}(${phase})`;
  } catch (e) {
    if (e instanceof FormulaError) return text;
    throw e;
  }
}

/** A formula (phase tag allowed) for people: "Fe+2" → "Fe²⁺", "Fe3O4(s)" → "Fe₃O₄(s)", "e-" → "e⁻". */
export function formulaForPeople(text: string): string {
  return respell(text, 'unicode');
}

/** A formula (phase tag allowed) for JSON: "Fe+2" → "Fe^2+", "HFeO₂⁻" → "HFeO2^-", "e-" → "e^-". */
export function formulaForJson(text: string): string {
  return respell(text, 'ascii');
}

/** The equilibrium signs a reaction text may use (as the reaction reader takes them). */
const ARROW = /\s+(?:<=>|<->|\u21cc|\u21c4|->|\u2192|=)\s+/;
/** A term: optional coefficient (2, 0.5, 1/2), then the formula. */
const TERM = /^(\d+(?:\.\d+)?(?:\/\d+(?:\.\d+)?)?)?(.+)$/;

function respellReaction(text: string, style: Style): string {
  const sides = text.split(ARROW);
  if (sides.length !== 2) return text;
  const side = (s: string): string =>
    s
      .trim()
      .split(/\s+\+\s+/)
      .map((term) => {
        const m = TERM.exec(term);
        if (!m) return term;
        // "2H2O(l)" → coefficient "2"; a formula never starts with a digit, so the split is unique.
        return (m[1] ?? '') + respell(m[2]!, style);
      })
      .join(' + ');
  const sign = style === 'unicode' ? EQUILIBRIUM_UNICODE : EQUILIBRIUM_ASCII;
  return `${side(sides[0]!)} ${sign} ${side(sides[1]!)}`;
}

/**
 * A reaction text (any notation, sides joined by " = ", " <=> ", " ⇌ ", " -> " or " → ") for people:
 * "Fe+2 + 2e- = Fe(s)" → "Fe²⁺ + 2e⁻ ⇌ Fe(s)". Text that is not a two-sided reaction is returned
 * unchanged.
 */
export function reactionForPeople(text: string): string {
  return respellReaction(text, 'unicode');
}

/** A reaction text for JSON: "Fe²⁺ + 2e⁻ ⇌ Fe(s)" or "Fe+2 + 2e- = Fe(s)" → "Fe^2+ + 2e^- <=> Fe(s)". */
export function reactionForJson(text: string): string {
  return respellReaction(text, 'ascii');
}

/** Elements, counts and bracketed groups, then a charge (older or caret form). */
const FORMULA_WITH_CHARGE =
  /(?<![A-Za-z^.])[A-Z][a-z]?(?:[A-Z][a-z]?|\d+|\((?:[A-Z][a-z]?|\d+)+\)\d*)*(?:\^\d*[+-]|[+-]\d*)(?![\w(^])/g;

/**
 * Formulas written in the older charge form inside free text (a note, a warning) re-spelled for
 * people: "E°(Fe+2/Fe) = −0.44 V" → "E°(Fe²⁺/Fe) = −0.44 V". Only tokens that carry a charge and
 * parse as formulas are touched (an older-form charge `Fe+2`, `OH-`, or the caret form `Fe^2+`);
 * anything else — words, numbers, source keys — is left as it is. A lone electron "e-" becomes "e⁻".
 */
export function chargesForPeople(text: string): string {
  return text
    .replace(FORMULA_WITH_CHARGE, (whole: string) => respell(whole, 'unicode'))
    .replace(/(?<![A-Za-z])e-(?![\w])/g, ELECTRON_UNICODE);
}

/** A formula with a phase tag inside free text: "Fe3O4(s)", "H2O(l)", "CO2(aq)". */
const FORMULA_WITH_PHASE = /(?<![A-Za-z^.])[A-Z][a-z]?(?:[A-Z][a-z]?|\d+|\((?:[A-Z][a-z]?|\d+)+\)\d*)*(?:\^\d*[+-])?\((?:s|l|g|aq)\)(?![\w])/g;

/**
 * Free text for people (a warning, a note, advice, a caption line): charged formulas and phase-tagged
 * formulas re-spelled in Unicode (chargesForPeople; "Fe3O4(s)" → "Fe₃O₄(s)"), the electron "e^-" as
 * "e⁻", and the ASCII equilibrium sign " <=> " as " ⇌ ". Plain words and untagged neutral formulas
 * are left as written, and so is anything in double quotes (a user's text quoted in a message, or
 * what to type). Example: "Fe^2+ + 2e^- <=> Fe(s) is slow" → "Fe²⁺ + 2e⁻ ⇌ Fe(s) is slow".
 */
export function textForPeople(text: string): string {
  // Text in double quotes is the user's own (or what to type) and is kept as written.
  return text
    .split(/("[^"]*")/)
    .map((part, k) =>
      k % 2 === 1
        ? part
        : chargesForPeople(part)
            .replace(FORMULA_WITH_PHASE, (whole: string) => respell(whole, 'unicode'))
            .replace(/(?<![A-Za-z])e\^-(?![\w])/g, ELECTRON_UNICODE)
            .replace(/ <=> /g, ` ${EQUILIBRIUM_UNICODE} `),
    )
    .join('');
}

/**
 * A species label for people: one formula, or several joined by " + " (an alloy assemblage
 * "Fe(s) + Cr2O3(s)" → "Fe(s) + Cr₂O₃(s)"), each re-spelled with formulaForPeople.
 */
export function labelForPeople(text: string): string {
  return text.split(' + ').map((part) => respell(part, 'unicode')).join(' + ');
}
