/**
 * The assemblage of an alloy at one (pH, E): the phases and dissolved species (at their threshold
 * activities) that minimise the grand potential of the bulk composition (DESIGN §8, issue 18).
 *
 * Steps:
 *  1. ψ'_k of every species at the point (psi.ts);
 *  2. the LP  min Σ n_k ψ'_k  s.t.  Σ n_k x_{k,e} = X_e for each main element e, n ≥ 0 (lp.ts),
 *     started from each element's own lowest-ψ species (one element only: already optimal, so a
 *     one-element "alloy" gives exactly the single-element predominant species);
 *  3. the phases with n > 0, their amounts (mol per mol of alloy atoms) and shares of each element;
 *  4. alternative optima (reduced cost within 1e-9 kJ/mol) named in `ties`;
 *  5. the verdict (verdict.ts).
 * This is the single point solver of the alloy kind: probe, grid and refinement call it.
 */
import type { Phase } from '../../model.js';
import { solveLp } from './lp.js';
import { speciesPotentialsAt } from './psi.js';
import { mainElements, type AlloyInput } from './types.js';
import { type AlloyVerdict, assemblageVerdict } from './verdict.js';

export interface AssemblagePhase {
  /** Index in input.species. */
  index: number;
  formula: string;
  phase: Phase;
  /** mol of this species per mol of alloy atoms (main-element atoms). */
  amount: number;
  /** Fraction of each main element's atoms held by this species (0–1; elements it lacks: 0). */
  share: Record<string, number>;
}

export interface Assemblage {
  pH: number;
  E: number;
  /** Species present, in the order of input.species. */
  phases: AssemblagePhase[];
  /** Formulas joined with " + ", e.g. "Fe3O4 + Cr2O3 + Ni". */
  label: string;
  /** Σ n_k ψ'_k, kJ per mol of alloy atoms. */
  grandPotential: number;
  /** Species absent from the assemblage that could replace part of it at equal grand potential
   *  (within 1e-9 kJ/mol): the point lies on a boundary; empty inside a region. */
  ties: string[];
  verdict: AlloyVerdict;
  /** Main elements with a share in a dissolved species. */
  dissolving: string[];
  /** Predominant species of each ligand. */
  ligandSpecies: Record<string, string>;
}

/** Amounts below this (mol per mol of alloy) are a degenerate vertex's zero, not a phase. */
const AMOUNT_EPS = 1e-12;
/** Tie tolerance on reduced costs, kJ per mol of species. */
export const TIE_KJ = 1e-9;

/** Step 2's start: for each element, its own species (no other main element) of lowest ψ' per atom. */
function startBasis(input: AlloyInput, els: string[], psi: number[]): number[] {
  return els.map((e) => {
    let best = -1;
    let bestV = Infinity;
    input.species.forEach((sp, k) => {
      const x = sp.elements[e] ?? 0;
      if (x <= 0 || els.some((o) => o !== e && (sp.elements[o] ?? 0) > 0)) return;
      const v = psi[k] / x;
      if (v < bestV) {
        bestV = v;
        best = k;
      }
    });
    if (best < 0) throw new Error(`alloy input has no species of ${e} alone`);
    return best;
  });
}

export function assemblageAt(input: AlloyInput, pH: number, E: number): Assemblage {
  const els = mainElements(input);
  const { psi, ligandSpecies } = speciesPotentialsAt(input, pH, E);
  const A = els.map((e) => input.species.map((sp) => sp.elements[e] ?? 0));
  const b = els.map((e) => input.composition[e]);
  const sol = solveLp({ A, b, c: psi, basis: startBasis(input, els, psi), tol: TIE_KJ });
  const present = sol.basis
    .map((index, k) => ({ index, amount: sol.values[k] }))
    .filter((p) => p.amount > AMOUNT_EPS)
    .sort((p, q) => p.index - q.index);
  const phases: AssemblagePhase[] = present.map(({ index, amount }) => {
    const sp = input.species[index];
    const share = Object.fromEntries(els.map((e) => [e, (amount * (sp.elements[e] ?? 0)) / input.composition[e]]));
    return { index, formula: sp.formula, phase: sp.phase, amount, share };
  });
  const { verdict, dissolving } = assemblageVerdict(
    phases.map((p) => ({ ...p, elements: input.species[p.index].elements, charge: input.species[p.index].charge })),
    els,
  );
  return {
    pH,
    E,
    phases,
    label: phases.map((p) => p.formula).join(' + '),
    grandPotential: sol.objective,
    ties: sol.ties.map((j) => input.species[j].formula),
    verdict,
    dissolving,
    ligandSpecies,
  };
}
