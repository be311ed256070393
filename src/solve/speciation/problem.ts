/**
 * The speciation problem at one temperature, in typed arrays: components (the main element, then
 * each ligand), species (dissolved and condensed) with their stoichiometry over the components,
 * and each species' standard formation plane in log10 units.
 *
 * With u_c = μ_c/(RT ln10) the grand potential of component c (per atom of the element, per unit
 * of the ligand) and Φ°_i(pH, E) the formation plane at unit activity (src/solve/potentials.ts),
 * equilibrium gives for every species
 *   log10 a_i = Σ_c A_ic·u_c + k_i(pH, E),   k_i = −Φ°_i/(RT ln10) = kg_i + kp_i·pH + ke_i·E,
 * a dissolved species' molality is m_i = a_i/γ_i, a solid is present only where log10 a_i = 0
 * (saturation index SI_i = Σ A_ic u_c + k_i ≤ 0 otherwise). Units: mol/kg of water.
 * Gases are not part of a closed bath and are left out (listed in `leftOut`).
 */
import { LN10, R } from '../../thermo/constants.js';
import { formationPlane, type WaterContext } from '../potentials.js';
import type { SolverSpecies } from '../types.js';

export interface SpeciationProblem {
  /** Component names: the main element first, then the ligands. */
  components: string[];
  /** Totals per component, mol/kg. */
  totals: Float64Array;
  /** Dissolved species, then solids (index < nAq are dissolved). */
  species: SolverSpecies[];
  nAq: number;
  /** Stoichiometry, row-major [species][component]. */
  A: Float64Array;
  charge: Float64Array;
  kg: Float64Array;
  kp: Float64Array;
  ke: Float64Array;
  /** log10 Kw at T (for H⁺/OH⁻ in the automatic ionic strength). */
  logKw: number;
  kelvin: number;
  leftOut: string[];
}

/** Build the problem from species at T (as buildSystem gives them) and the totals. */
export function speciationProblem(
  components: string[],
  totals: number[],
  species: SolverSpecies[],
  w: WaterContext,
  logKw: number,
): SpeciationProblem {
  const leftOut = species.filter((s) => s.phase === 'g').map((s) => `${s.formula}(g)`);
  const aq = species.filter((s) => s.phase === 'aq');
  const solid = species.filter((s) => s.phase === 's' || s.phase === 'l');
  const list = [...aq, ...solid];
  const n = list.length;
  const nc = components.length;
  const A = new Float64Array(n * nc);
  const charge = new Float64Array(n);
  const kg = new Float64Array(n);
  const kp = new Float64Array(n);
  const ke = new Float64Array(n);
  const s = R * w.kelvin * LN10;
  list.forEach((sp, i) => {
    components.forEach((c, j) => (A[i * nc + j] = sp.elements[c] ?? 0));
    charge[i] = sp.charge;
    const pl = formationPlane({ ...sp, logActivity: 0 }, w);
    kg[i] = -pl.g / s;
    kp[i] = -pl.p / s;
    ke[i] = -pl.e / s;
  });
  return { components, totals: Float64Array.from(totals), species: list, nAq: aq.length, A, charge, kg, kp, ke, logKw, kelvin: w.kelvin, leftOut };
}
