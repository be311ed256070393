/**
 * The grand potential ψ'_k of each species of an alloy system at one (pH, E), per mole of species,
 * with the main elements' atoms as the only constraints (DESIGN §2, §8):
 *
 *   ψ'_k = Φ_k(pH, E) − Σ_L k_{k,L}·μ_L(pH, E)                                   [kJ/mol]
 *
 * Φ_k is the formation plane of src/solve/potentials.ts (H, O, H⁺, e⁻ exchanged with water at the
 * given pH and E; dissolved species at their threshold activity), μ_L the potential of ligand L
 * (its predominant own species, src/solve/probe.ts). With one main element M, ψ'_k / x_{k,M} is
 * exactly the ψ of the single-element solver, so the alloy LP reduces to its argmin.
 * Valid wherever the species data are. Worked example (tested): Fe+2 at a = 1e-6, 25 °C,
 * ΔfG° = −78.90 kJ/mol, pH 7, E = 0: ψ' = −78.90 + RT ln 1e-6 /1000 = −113.148 kJ/mol.
 */
import { ligandPotentialsAt } from '../probe.js';
import { type Plane, addScaled, planeAt } from '../plane.js';
import { formationPlane, type WaterContext } from '../potentials.js';
import type { AlloyInput } from './types.js';

export function alloyWater(input: AlloyInput): WaterContext {
  return { kelvin: input.kelvin, G_H2O: input.water.H2O * 1000, G_H2: input.water.H2 * 1000, logWaterActivity: input.logWaterActivity ?? 0 };
}

/** ψ'_k planes (J/mol) of every species, with the ligand potentials of the point (pH, E). */
export function speciesPlanesAt(input: AlloyInput, pH: number, E: number): { planes: Plane[]; ligandSpecies: Record<string, string> } {
  const w = alloyWater(input);
  const { mu, ligandSpecies } = ligandPotentialsAt(input.ligands, w, pH, E);
  const planes = input.species.map((sp) => {
    let pl = formationPlane(sp, w);
    input.ligands.forEach((L, m) => {
      const kL = sp.elements[L.element] ?? 0;
      if (kL) pl = addScaled(pl, mu[m], -kL);
    });
    return pl;
  });
  return { planes, ligandSpecies };
}

/** ψ'_k in kJ per mol of species at (pH, E), in the order of input.species. */
export function speciesPotentialsAt(input: AlloyInput, pH: number, E: number): { psi: number[]; ligandSpecies: Record<string, string> } {
  const { planes, ligandSpecies } = speciesPlanesAt(input, pH, E);
  return { psi: planes.map((pl) => planeAt(pl, pH, E) / 1000), ligandSpecies };
}
