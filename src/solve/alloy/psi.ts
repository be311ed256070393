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
import { ligandPsiPlane } from '../ligand-psi.js';
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
  /** The same, flattened for the per-point loop: Φ_k's g, p, e and k_{k,L} at k·ligands + L. */
  phiG: Float64Array;
  phiP: Float64Array;
  phiE: Float64Array;
  counts: Float64Array;
}
const prepared = new WeakMap<AlloyInput, Prepared>();

function prepare(input: AlloyInput): Prepared {
  let p = prepared.get(input);
  if (!p) {
    const w = alloyWater(input);
    const phi = input.species.map((sp) => formationPlane(sp, w));
    const ligandCounts = input.species.map((sp) => input.ligands.map((L) => sp.elements[L.element] ?? 0));
    p = {
      phi,
      ligandCounts,
      phiG: Float64Array.from(phi, (pl) => pl.g),
      phiP: Float64Array.from(phi, (pl) => pl.p),
      phiE: Float64Array.from(phi, (pl) => pl.e),
      counts: Float64Array.from(ligandCounts.flat()),
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
  const psi = new Array<number>(input.species.length);
  const choice = speciesPsiInto(input, pH, E, psi);
  const ligandSpecies: Record<string, string> = {};
  input.ligands.forEach((L, m) => {
    ligandSpecies[L.element] = L.species[choice[m]].formula;
  });
  return { psi, ligandSpecies };
}

/**
 * ψ'_k (kJ/mol) of every species at (pH, E) written into `out`, without allocating per point; returns
 * the index (in its own species list) of each ligand's predominant species (a scratch array,
 * overwritten by the next call). The ligand recursion is
 * that of ligandPotentialsAt (src/solve/point.ts) with the same plane arithmetic, so the values are
 * the same to the last bit: the μ plane of ligand m depends only on which species won for the
 * ligands before it, so the candidate planes are memoised per input and per earlier choice.
 */
export function speciesPsiInto(input: AlloyInput, pH: number, E: number, out: number[] | Float64Array): Int32Array {
  const p = prepare(input);
  const lc = ligandCache(input);
  const nL = input.ligands.length;
  const choice = lc.choice;
  const muAt = lc.muAt;
  let key = 0;
  for (let m = 0; m < nL; m++) {
    // Step 1 of ligandPotentialsAt: ligand m's own species under the earlier ligands' μ planes.
    const planes = ligandCandidates(input, lc, m, key);
    let best = Infinity;
    let bestK = 0;
    for (let k = 0; k < planes.length; k++) {
      const v = planeAt(planes[k], pH, E);
      if (v < best) {
        best = v;
        bestK = k;
      }
    }
    choice[m] = bestK;
    lc.mu[m] = planes[bestK];
    muAt[m] = planeAt(planes[bestK], pH, E);
    key = key * planes.length + bestK + 1;
  }
  // Step 2: ψ'_k = Φ_k − Σ_L k_{k,L}·μ_L (the arithmetic of planeAt, term for term).
  const { phiG, phiP, phiE, counts } = p;
  for (let k = 0; k < phiG.length; k++) {
    let v = phiG[k] + phiP[k] * pH + phiE[k] * E;
    for (let m = 0; m < nL; m++) {
      const c = counts[k * nL + m];
      if (c) v -= c * muAt[m];
    }
    out[k] = v / 1000;
  }
  return choice;
}

/** Per input: the ligand species' formation planes, scratch for the point, and the memo of the
 *  candidate ψ planes of ligand m keyed by the earlier ligands' choices. */
interface LigandCache {
  formation: Plane[][];
  memo: Map<number, Plane[]>[];
  mu: Plane[];
  muAt: Float64Array;
  choice: Int32Array;
}
const ligandCaches = new WeakMap<AlloyInput, LigandCache>();

function ligandCache(input: AlloyInput): LigandCache {
  let c = ligandCaches.get(input);
  if (!c) {
    const w = alloyWater(input);
    const nL = input.ligands.length;
    c = {
      formation: input.ligands.map((L) => L.species.map((sp) => formationPlane(sp, w))),
      memo: input.ligands.map(() => new Map<number, Plane[]>()),
      mu: new Array<Plane>(nL),
      muAt: new Float64Array(nL),
      choice: new Int32Array(nL),
    };
    ligandCaches.set(input, c);
  }
  return c;
}

/** ψ planes of ligand m's species given μ of ligands 0…m−1 (in c.mu), memoised under `key`. */
function ligandCandidates(input: AlloyInput, c: LigandCache, m: number, key: number): Plane[] {
  let planes = c.memo[m].get(key);
  if (!planes) {
    const mu = c.mu.slice(0, m);
    planes = input.ligands[m].species.map((sp, k) => ligandPsiPlane({ ligands: input.ligands }, m, sp, c.formation[m][k], mu));
    c.memo[m].set(key, planes);
  }
  return planes;
}
