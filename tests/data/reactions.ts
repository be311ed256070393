/**
 * Test helper: parses reaction strings of the reference files ("Fe+2 + 2e- = Fe(s)") and evaluates
 * their standard Gibbs energy from the species library. Not a test file itself.
 */
import { parseFormula, splitPhase } from '../../src/chem/formula.js';
import { formulaMatches } from '../../src/chem/match.js';
import { isElectron } from '../../src/chem/reaction-text.js';
import type { LibrarySpecies } from '../../src/data/library.js';
import type { Phase } from '../../src/model.js';

export interface Term {
  coef: number;
  /** Formula without phase tag; "e-" for the electron. */
  formula: string;
  phase?: Phase;
}

export interface Reaction {
  text: string;
  left: Term[];
  right: Term[];
}

function parseSide(side: string): Term[] {
  return side
    .trim()
    .split(/\s+\+\s+/)
    .map((raw) => {
      const m = /^(\d+(?:\.\d+)?)?(.+)$/.exec(raw.trim());
      if (!m) throw new Error(`bad term "${raw}"`);
      const coef = m[1] ? Number(m[1]) : 1;
      const body = m[2]!;
      if (isElectron(body)) return { coef, formula: 'e-' };
      const { formula, phase } = splitPhase(body);
      return { coef, formula, ...(phase ? { phase } : {}) };
    });
}

/** "A + 2B = C" → terms; a charged species without phase tag is aqueous. */
export function parseReaction(text: string): Reaction {
  const sides = text.split(/\s+=\s+/);
  if (sides.length !== 2) throw new Error(`reaction "${text}" must have one " = "`);
  return { text, left: parseSide(sides[0]!), right: parseSide(sides[1]!) };
}

/** Element and charge totals of products minus reactants (all zero for a balanced reaction). */
export function imbalance(r: Reaction): Record<string, number> {
  const out: Record<string, number> = {};
  const add = (terms: Term[], sign: number): void => {
    for (const t of terms) {
      if (t.formula === 'e-') {
        out.charge = (out.charge ?? 0) - sign * t.coef;
        continue;
      }
      const f = parseFormula(t.formula);
      for (const [el, n] of Object.entries(f.elements)) out[el] = (out[el] ?? 0) + sign * t.coef * n;
      out.charge = (out.charge ?? 0) + sign * t.coef * f.charge;
    }
  };
  add(r.right, 1);
  add(r.left, -1);
  for (const k of Object.keys(out)) if (Math.abs(out[k]!) < 1e-9) delete out[k];
  return out;
}

/** The library entry of a term: same formula in any notation, its phase (aq when untagged), or undefined. */
export function lookup(lib: readonly LibrarySpecies[], t: Term): LibrarySpecies | undefined {
  const phase = t.phase ?? 'aq';
  return lib.find((s) => formulaMatches(t.formula, s.formula) && s.phase === phase);
}

/** Terms of the reaction that the library lacks (electrons excluded). */
export function missing(lib: readonly LibrarySpecies[], r: Reaction): string[] {
  return [...r.left, ...r.right]
    .filter((t) => t.formula !== 'e-' && !lookup(lib, t))
    .map((t) => `${t.formula}(${t.phase ?? 'aq'})`);
}

/** Standard reaction Gibbs energy ΔrG° = Σν ΔfG°(products) − Σν ΔfG°(reactants), kJ/mol (electrons 0 on the SHE scale). */
export function reactionGibbs(lib: readonly LibrarySpecies[], r: Reaction, pick?: (s: LibrarySpecies) => number): number {
  const g = pick ?? ((s: LibrarySpecies) => s.dfG);
  const sum = (terms: Term[]): number =>
    terms.reduce((acc, t) => (t.formula === 'e-' ? acc : acc + t.coef * g(lookup(lib, t)!)), 0);
  return sum(r.right) - sum(r.left);
}

/** Electrons consumed by the reaction as written (left side). */
export function electrons(r: Reaction): number {
  return r.left.filter((t) => t.formula === 'e-').reduce((a, t) => a + t.coef, 0);
}

/** Non-H, non-O elements of a reaction (decides which species file must cover it). */
export function reactionElements(r: Reaction): string[] {
  const els = new Set<string>();
  for (const t of [...r.left, ...r.right]) {
    if (t.formula === 'e-') continue;
    for (const el of Object.keys(parseFormula(t.formula).elements)) if (el !== 'H' && el !== 'O') els.add(el);
  }
  return [...els];
}
