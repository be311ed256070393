/**
 * The ψ-plane ligand recursion, in one place. With ligands solved in order L₀, L₁, … and μ_q the
 * plane of ligand q's predominant species (per mol of L_q):
 *   ligand species s of L_m:  ψ_s = (Φ_s − Σ_{q<m} k_{s,q}·μ_q) / l_s   (l_s = atoms of L_m in s)
 *   main species i:           ψ_i = (Φ_i − Σ_{q} k_{i,q}·μ_q) / x_i     (x_i = atoms of M in i)
 * where Φ is the formation plane (J/mol) and k the count of each ligand element in the species.
 * Used by the exact solver (cells, envelopes) and by the point evaluation; the grid map keeps the
 * same recursion flattened into typed arrays for speed (grid.ts).
 */
import { type Plane, addScaled, scalePlane } from './plane.js';
import type { SolverInput, SolverSpecies } from './types.js';

/** Φ − Σ_{q<count} k_q·μ_q: the plane with the first `count` ligands' potentials taken out. */
export function withoutLigands(input: Pick<SolverInput, 'ligands'>, sp: SolverSpecies, phi: Plane, mu: readonly Plane[], count: number): Plane {
  let pl = phi;
  for (let q = 0; q < count; q++) {
    const kq = sp.elements[input.ligands[q].element] ?? 0;
    if (kq) pl = addScaled(pl, mu[q], -kq);
  }
  return pl;
}

/** ψ of a species of ligand m, per mol of that ligand element, given μ of ligands 0…m−1. */
export function ligandPsiPlane(input: Pick<SolverInput, 'ligands'>, m: number, sp: SolverSpecies, phi: Plane, mu: readonly Plane[]): Plane {
  return scalePlane(withoutLigands(input, sp, phi, mu, m), 1 / (sp.elements[input.ligands[m].element] ?? 1));
}

/** ψ of a main species, per mol of the main element, given μ of every ligand. */
export function mainPsiPlane(input: Pick<SolverInput, 'ligands' | 'element'>, sp: SolverSpecies, phi: Plane, mu: readonly Plane[]): Plane {
  return scalePlane(withoutLigands(input, sp, phi, mu, input.ligands.length), 1 / (sp.elements[input.element] ?? 1));
}
