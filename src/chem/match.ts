/**
 * Does a formula a user wrote name a given species? Users may write a species in any notation the
 * reader takes (`Fe^2+`, `Fe²⁺`, older `Fe+2`), so every look-up by formula — `exclude`, `pick`,
 * `classes`, `ligandSpecies`, inline species of `cell` — compares parsed formulas, not spellings.
 *
 * Rule: the same text, or both parse and have the same element counts and charge (sameFormula).
 * Text that does not parse matches only itself.
 * Example: formulaMatches("Fe+2", "Fe^2+") → true; formulaMatches("Fe²⁺", "Fe^3+") → false.
 */
import { type Formula, parseFormula, sameFormula } from './parse.js';

const cache = new Map<string, Formula | null>();

function parsed(text: string): Formula | null {
  let f = cache.get(text);
  if (f === undefined) {
    try {
      f = parseFormula(text);
    } catch {
      f = null;
    }
    if (cache.size > 10000) cache.clear();
    cache.set(text, f);
  }
  return f;
}

export function formulaMatches(given: string, formula: string): boolean {
  if (given === formula) return true;
  const a = parsed(given);
  const b = parsed(formula);
  return a !== null && b !== null && sameFormula(a, b);
}
