/**
 * The grand potential ψ'_k of each species of an alloy system at one (pH, E), per mole of species,
 * with the main elements' atoms as the only constraints (DEVELOPERS.md, "Alloys"):
 *
 *   ψ'_k = Φ_k(pH, E) − Σ_L k_{k,L}·μ_L(pH, E)                                   [kJ/mol]
 *
 * Φ_k is the formation plane of src/solve/potentials.ts (H, O, H⁺, e⁻ exchanged with water at the
 * given pH and E; dissolved species at their threshold activity), μ_L the potential of ligand L
 * (its predominant own species, src/solve/probe.ts). With one main element M, ψ'_k / x_{k,M} is
 * exactly the ψ of the single-element solver, so the alloy LP reduces to its argmin.
 * The species' Φ planes are computed once per input (cached); only the ligand terms vary by point.
 * Valid wherever the species data are. Worked example (tested): Fe²⁺ at a = 1e-6, 25 °C,
 * ΔfG° = −78.90 kJ/mol, pH 7, E = 0: ψ' = −78.90 + RT ln 1e-6 /1000 = −113.148 kJ/mol.
 */
import { ligandPotentialsAt } from '../point.js';
import { type Plane, addScaled, planeAt } from '../plane.js';
import { formationPlane, type WaterContext } from '../potentials.js';
import type { AlloyInput } from './types.js';

export function alloyWater(input: AlloyInput): WaterContext {
  return { kelvin: input.kelvin, G_H2O: input.water.H2O * 1000, G_H2: input.water.H2 * 1000, logWaterActivity: input.logWaterActivity ?? 0 };
}

/** What does not change from point to point: Φ_k planes and ligand counts (cached per input). */
interface Prepared {
  phi: Plane[];
  /** k_{k,L} per species and ligand (ligands in solving order). */
  ligandCounts: number[][];
}
const prepared = new WeakMap<AlloyInput, Prepared>();

function prepare(input: AlloyInput): Prepared {
  let p = prepared.get(input);
  if (!p) {
    const w = alloyWater(input);
    p = {
      phi: input.species.map((sp) => formationPlane(sp, w)),
      ligandCounts: input.species.map((sp) => input.ligands.map((L) => sp.elements[L.element] ?? 0)),
    };
    prepared.set(input, p);
  }
  return p;
}

/** ψ'_k planes (J/mol) of every species, with the ligand potentials of the point (pH, E). */
export function speciesPlanesAt(input: AlloyInput, pH: number, E: number): { planes: Plane[]; ligandSpecies: Record<string, string> } {
  const { phi, ligandCounts } = prepare(input);
  const { mu, ligandSpecies } = ligandPotentialsAt(input.ligands, alloyWater(input), pH, E);
  const planes = phi.map((pl, k) => {
    let out = pl;
    ligandCounts[k].forEach((kL, m) => {
      if (kL) out = addScaled(out, mu[m], -kL);
    });
    return out;
  });
  return { planes, ligandSpecies };
}

/** ψ'_k in kJ per mol of species at (pH, E), in the order of input.species. */
export function speciesPotentialsAt(input: AlloyInput, pH: number, E: number): { psi: number[]; ligandSpecies: Record<string, string> } {
  const { phi, ligandCounts } = prepare(input);
  const { mu, ligandSpecies } = input.ligands.length
    ? ligandPotentialsAt(input.ligands, alloyWater(input), pH, E)
    : { mu: [] as Plane[], ligandSpecies: {} };
  const muAt = mu.map((pl) => planeAt(pl, pH, E));
  const psi = new Array<number>(phi.length);
  for (let k = 0; k < phi.length; k++) {
    let v = planeAt(phi[k], pH, E);
    const counts = ligandCounts[k];
    for (let m = 0; m < muAt.length; m++) if (counts[m]) v -= counts[m] * muAt[m];
    psi[k] = v / 1000;
  }
  return { psi, ligandSpecies };
}
