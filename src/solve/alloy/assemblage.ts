/**
 * The assemblage of an alloy at one (pH, E): the phases and dissolved species (at their threshold
 * activities) that minimise the grand potential of the bulk composition (DEVELOPERS.md, "Alloys"; issue 18).
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
import { luFactor, luSolveT } from '../linalg.js';
import { solveLp } from './lp.js';
import { memberText } from './member.js';
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
  /** Members joined with " + ", e.g. "Fe3O4 + Cr2O3 + Ni" (a neutral dissolved one tagged "(aq)": member.ts). */
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

/** Per input (cached): the constraint matrix (element × species), the bulk composition and, per
 *  element, its own species (no other main element) with their atom counts. */
interface Prepared {
  els: string[];
  A: number[][];
  b: number[];
  own: { index: number; atoms: number }[][];
}
const preparedInputs = new WeakMap<AlloyInput, Prepared>();
function prepare(input: AlloyInput): Prepared {
  let p = preparedInputs.get(input);
  if (!p) {
    const els = mainElements(input);
    const own = els.map((e) => {
      const list: { index: number; atoms: number }[] = [];
      input.species.forEach((sp, index) => {
        const atoms = sp.elements[e] ?? 0;
        if (atoms > 0 && els.every((o) => o === e || !(sp.elements[o] ?? 0))) list.push({ index, atoms });
      });
      if (list.length === 0) throw new Error(`alloy input has no species of ${e} alone`);
      return list;
    });
    p = { els, A: els.map((e) => input.species.map((sp) => sp.elements[e] ?? 0)), b: els.map((e) => input.composition[e]), own };
    preparedInputs.set(input, p);
  }
  return p;
}

/** Step 2's start: for each element, its own species of lowest ψ' per atom (first on equal values). */
function startBasis(p: Prepared, psi: number[]): number[] {
  return p.own.map((list) => {
    let best = list[0].index;
    let bestV = psi[best] / list[0].atoms;
    for (let k = 1; k < list.length; k++) {
      const v = psi[list[k].index] / list[k].atoms;
      if (v < bestV) {
        bestV = v;
        best = list[k].index;
      }
    }
    return best;
  });
}

/** The optimal support at (pH, E) without building the full answer: basis indices with n > 0
 *  (ascending), tied species indices, grand potential, and the ψ' vector used. For grids and bisection. */
export function supportAt(input: AlloyInput, pH: number, E: number): { indices: number[]; amounts: number[]; ties: number[]; grandPotential: number; ligandSpecies: Record<string, string>; psi: number[] } {
  const p = prepare(input);
  const { psi, ligandSpecies } = speciesPotentialsAt(input, pH, E);
  const sol = solveLp({ A: p.A, b: p.b, c: psi, basis: startBasis(p, psi), tieTol: TIE_KJ });
  const order = sol.basis.map((_, k) => k).filter((k) => sol.values[k] > AMOUNT_EPS).sort((i, j) => sol.basis[i] - sol.basis[j]);
  return { indices: order.map((k) => sol.basis[k]), amounts: order.map((k) => sol.values[k]), ties: sol.ties, grandPotential: sol.objective, ligandSpecies, psi };
}

/** Margin of the warm check, kJ per mol of species: far above the LP's tolerances (1e-11 pivot,
 *  1e-9 tie), so a point that passes is one where the cold simplex reaches the same basis. */
export const WARM_MARGIN_KJ = 1e-6;

/** A full, non-degenerate optimal basis kept for the warm check: its columns and the LU of B. */
export interface WarmBasis {
  indices: number[];
  lu: Float64Array;
  perm: Int32Array;
  isBasic: Uint8Array;
}

/** The warm basis of a support, or null when it cannot serve (fewer phases than main elements: a
 *  degenerate vertex, whose basis is not fixed by its support; or a singular B). */
export function warmBasis(input: AlloyInput, indices: readonly number[]): WarmBasis | null {
  const p = prepare(input);
  const m = p.els.length;
  if (indices.length !== m) return null;
  const lu = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let k = 0; k < m; k++) lu[i * m + k] = p.A[i][indices[k]];
  const perm = new Int32Array(m);
  if (!luFactor(lu, m, perm, { tol: 1e-12 })) return null;
  const isBasic = new Uint8Array(input.species.length);
  for (const j of indices) isBasic[j] = 1;
  return { indices: [...indices], lu, perm, isBasic };
}

const warmScratch = { cB: new Float64Array(8), y: new Float64Array(8), tmp: new Float64Array(8) };

/**
 * Is the warm basis (a neighbour's optimum) still optimal at a point with potentials psi, by a
 * clear margin? Duals from Bᵀy = c_B, reduced costs d_j = ψ'_j − y·a_j of every other species; all
 * above WARM_MARGIN_KJ means B is the unique optimal basis (no tie, no alternative optimum), so the
 * plain simplex (supportAt) gives the same support there and need not run. The amounts B⁻¹b do not
 * depend on the point, so feasibility is kept. False → solve from scratch.
 */
export function warmStillOptimal(input: AlloyInput, w: WarmBasis, psi: ArrayLike<number>): boolean {
  const p = prepare(input);
  const m = p.els.length;
  if (warmScratch.cB.length < m) for (const k of ['cB', 'y', 'tmp'] as const) warmScratch[k] = new Float64Array(m);
  const { cB, y, tmp } = warmScratch;
  for (let k = 0; k < m; k++) cB[k] = psi[w.indices[k]];
  luSolveT(w.lu, m, w.perm, cB, y, tmp);
  const N = input.species.length;
  for (let j = 0; j < N; j++) {
    if (w.isBasic[j]) continue;
    let d = psi[j];
    for (let i = 0; i < m; i++) d -= y[i] * p.A[i][j];
    if (!(d > WARM_MARGIN_KJ)) return false;
  }
  return true;
}

export function assemblageAt(input: AlloyInput, pH: number, E: number): Assemblage {
  const { els } = prepare(input);
  const sup = supportAt(input, pH, E);
  const phases: AssemblagePhase[] = sup.indices.map((index, k) => {
    const sp = input.species[index];
    const amount = sup.amounts[k];
    const share: Record<string, number> = {};
    for (const e of els) share[e] = (amount * (sp.elements[e] ?? 0)) / input.composition[e];
    return { index, formula: sp.formula, phase: sp.phase, amount, share };
  });
  const { verdict, dissolving } = assemblageVerdict(
    phases.map((ph) => {
      const sp = input.species[ph.index];
      return { formula: ph.formula, phase: ph.phase, share: ph.share, elements: sp.elements, charge: sp.charge };
    }),
    els,
  );
  return {
    pH,
    E,
    phases,
    label: phases.map((ph) => memberText(input.species[ph.index])).join(' + '),
    grandPotential: sup.grandPotential,
    ties: sup.ties.map((j) => memberText(input.species[j])),
    verdict,
    dissolving,
    ligandSpecies: sup.ligandSpecies,
  };
}
