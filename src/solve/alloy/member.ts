/**
 * How one member of an alloy assemblage is named in its label (issue 18): its formula, with the
 * phase tag "(aq)" on a neutral dissolved species ("Cu + Zn(OH)2(aq)"), so that it is never read as
 * the solid of the same formula. An ion needs no tag (its charge says it is dissolved), a solid,
 * liquid or gas none either (the alloy labels name solids bare, as the single-element ones do).
 * Names only; no chemistry.
 */
import type { Phase } from '../../model.js';

/** True for a species that is dissolved (in solution, at its threshold activity). */
export function isDissolved(sp: { phase: Phase | string }): boolean {
  return sp.phase === 'aq';
}

/** "Zn(OH)2(aq)" for the neutral dissolved Zn(OH)2, the formula itself otherwise. */
export function memberText(sp: { formula: string; phase: Phase | string; charge: number }): string {
  return isDissolved(sp) && sp.charge === 0 && !/\((s|l|g|aq)\)$/.test(sp.formula) ? `${sp.formula}(aq)` : sp.formula;
}
