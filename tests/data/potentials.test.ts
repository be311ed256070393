/**
 * Standard potentials from the library against the handbook electrochemical series:
 *   E° = −ΔrG°/(nF), ΔrG° from the library's ΔfG° (SHE convention: H+(aq), H2(g), e- all zero).
 * Check values: tests/fixtures/standard-potentials.csv — CRC Handbook of Chemistry and Physics,
 * "Electrochemical Series" (P. Vanysek), Table 1, values recalled from memory (see the file header).
 * A couple is compared within 10 mV, or it is listed in DATASET_DIFFERENCES with the value its own
 * compilation implies (checked within 2 mV) and both sources named.
 */
import { describe, it, expect } from 'vitest';
import { readFileSync, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { loadLibrary, defaultSpeciesDir } from '../../src/data/library.js';
import { F } from '../../src/thermo/constants.js';
import { parseReaction, imbalance, missing, reactionGibbs, electrons, reactionElements, type Reaction } from './reactions.js';

const TOL_V = 0.010;

interface Couple {
  reaction: Reaction;
  E0: number;
  n: number;
}

const csv = readFileSync(fileURLToPath(new URL('../fixtures/standard-potentials.csv', import.meta.url)), 'utf8');
const couples: Couple[] = csv
  .split(/\r?\n/)
  .filter((l) => l.trim() && !l.startsWith('#') && !l.startsWith('reaction,'))
  .map((l) => {
    const [reaction, e0, n] = l.split(',');
    return { reaction: parseReaction(reaction!), E0: Number(e0), n: Number(n) };
  });

/**
 * Couples where the library's default compilation and the handbook differ by more than 10 mV.
 * `expected` is E° implied by the library's source (checked within 2 mV, so a copying error
 * still fails); `handbook` is the CSV value.
 */
const DATASET_DIFFERENCES: Record<string, { expected: number; sources: string }> = {
  'Fe+2 + 2e- = Fe(s)': {
    expected: -0.409,
    sources:
      'NBS 1982 (Wagman et al.) ΔfG°(Fe+2) = −78.90 kJ/mol gives −0.409 V; the handbook (Bratsch 1989) prints −0.447 V. ' +
      'Documented in the reference file header and species/README.md; alternatives BR89 and PB66 in Fe.json.',
  },
  'Fe+3 + 3e- = Fe(s)': {
    expected: -0.016,
    sources:
      'NBS 1982 ΔfG°(Fe+3) = −4.7 kJ/mol gives −0.016 V; the handbook −0.037 V follows from its Fe+2 value ' +
      '((2·(−0.447) + 0.771)/3 = −0.041 V), i.e. the same Fe+2 discrepancy.',
  },
  'Ni+2 + 2e- = Ni(s)': {
    expected: -0.236,
    sources:
      'NBS 1982 ΔfG°(Ni+2) = −45.6 kJ/mol gives −0.236 V; the handbook (Bratsch 1989) prints −0.257 V. Alternative BR89 in Ni.json.',
  },
  'Ni(OH)2(s) + 2e- = Ni(s) + 2OH-': {
    expected: -0.688,
    sources:
      'NBS 1982 ΔfG°(Ni(OH)2) = −447.2 kJ/mol gives −0.688 V; the handbook prints the older −0.72 V (Latimer era).',
  },
  'H2O2(aq) + 2H+ + 2e- = 2H2O(l)': {
    expected: 1.763,
    sources: 'NBS 1982 ΔfG°(H2O2, aq) = −134.03 kJ/mol gives 1.763 V; the handbook prints 1.776 V.',
  },
  // The two below rest on species of Al.json and Cr.json (written by the other data helper, whose notes
  // there document the same differences).
  'Al+3 + 3e- = Al(s)': {
    expected: -1.676,
    sources:
      'NBS 1982 ΔfG°(Al+3) = −485.0 kJ/mol gives −1.676 V; the handbook prints the older −1.662 V (CODATA 1989 implies −1.698 V).',
  },
  'Cr2O7-2 + 14H+ + 6e- = 2Cr+3 + 7H2O(l)': {
    expected: 1.364,
    sources:
      'NBS 1982 ΔfG°(Cr2O7-2) = −1301.1 kJ/mol with Pourbaix (1974) ΔfG°(Cr+3) = −215.48 kJ/mol gives 1.364 V; ' +
      'the handbook prints 1.232 V (Latimer gives 1.33 V).',
  },
};

const lib = loadLibrary();
const speciesDir = defaultSpeciesDir();
const fileFor = (el: string): string => `${speciesDir}/${el === 'H' || el === 'O' ? 'water' : el}.json`;

const covered: Couple[] = [];
const skipped: { text: string; missing: string[] }[] = [];
for (const c of couples) {
  const miss = missing(lib, c.reaction);
  if (miss.length === 0) covered.push(c);
  else skipped.push({ text: c.reaction.text, missing: miss });
}

describe('handbook standard potentials from library ΔfG°', () => {
  it('reports coverage', () => {
    // Not a check: makes the output say what was covered and what was skipped for lack of species.
    console.log(
      `standard potentials: ${covered.length} of ${couples.length} couples covered; skipped:\n` +
        skipped.map((s) => `  ${s.text}  (missing ${s.missing.join(', ')})`).join('\n'),
    );
    expect(covered.length + skipped.length).toBe(couples.length);
  });

  it('covers every couple whose elements all have a species file', () => {
    const shouldCover = couples.filter((c) => reactionElements(c.reaction).every((el) => existsSync(fileFor(el))));
    const notCovered = shouldCover.filter((c) => !covered.includes(c)).map((c) => c.reaction.text);
    expect(notCovered).toEqual([]);
    // our part of the library alone (water, Fe, Cu, Zn, Ni, S, Cl) covers at least these
    for (const t of [
      '2H2O(l) + 2e- = H2(g) + 2OH-', 'Zn+2 + 2e- = Zn(s)', 'Fe+2 + 2e- = Fe(s)', 'Ni+2 + 2e- = Ni(s)',
      'Fe+3 + 3e- = Fe(s)', 'S(s) + 2H+ + 2e- = H2S(aq)', 'Cu+2 + e- = Cu+', 'Cu+2 + 2e- = Cu(s)',
      'O2(g) + 2H2O(l) + 4e- = 4OH-', 'Cu+ + e- = Cu(s)', 'Fe+3 + e- = Fe+2', 'O2(g) + 4H+ + 4e- = 2H2O(l)',
      'Cl2(g) + 2e- = 2Cl-', 'H2O2(aq) + 2H+ + 2e- = 2H2O(l)', 'Cu2O(s) + H2O(l) + 2e- = 2Cu(s) + 2OH-',
      'Ni(OH)2(s) + 2e- = Ni(s) + 2OH-', '2H+ + 2e- = H2(g)',
    ]) {
      expect(covered.map((c) => c.reaction.text), t).toContain(t);
    }
  });

  for (const c of couples) {
    it(`${c.reaction.text} is balanced in elements and charge, with n = ${c.n}`, () => {
      expect(imbalance(c.reaction)).toEqual({});
      expect(electrons(c.reaction)).toBe(c.n);
    });
  }

  for (const c of covered) {
    const doc = DATASET_DIFFERENCES[c.reaction.text];
    it(`${c.reaction.text}: handbook ${c.E0} V${doc ? ' (documented data-set difference)' : ''}`, () => {
      const E0 = (-reactionGibbs(lib, c.reaction) * 1000) / (c.n * F);
      if (doc) {
        // E° implied by the library's own compilation (see `sources`), within 2 mV
        expect(Math.abs(E0 - doc.expected), doc.sources).toBeLessThan(0.002);
        // and the difference from the handbook is real (otherwise remove the table entry)
        expect(Math.abs(E0 - c.E0)).toBeGreaterThan(TOL_V);
      } else {
        // CRC Handbook electrochemical series (Vanysek), recalled from memory — see fixture header
        expect(Math.abs(E0 - c.E0), `library E° = ${E0.toFixed(4)} V`).toBeLessThan(TOL_V);
      }
    });
  }

  it('every documented difference names a couple of the fixture', () => {
    const texts = couples.map((c) => c.reaction.text);
    for (const k of Object.keys(DATASET_DIFFERENCES)) expect(texts, k).toContain(k);
  });
});
