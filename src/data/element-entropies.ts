/**
 * Standard molar entropies S° of the elements in their reference states at 298.15 K and 1 bar,
 * PER MOLE OF ATOMS, in J/(mol·K). Diatomic gases are halved: S°(H) = S°(H2, g)/2, and so on.
 *
 * Used to turn a standard entropy into an entropy of formation:
 *   ΔfS° = S° − Σ_atoms n_el·S°(el) + (z/2)·S°(H2, g)
 * for a species of charge z on the conventional ionic scale (H+(aq): S° = 0).
 *
 * Sources (values recalled from memory, not read from the tables just now):
 * - CODATA 1989 key values (Cox J.D., Wagman D.D., Medvedev V.A., CODATA Key Values for
 *   Thermodynamics, Hemisphere 1989) for the elements it covers, except hydrogen;
 * - NBS 1982 (Wagman D.D. et al., The NBS tables of chemical thermodynamic properties,
 *   J. Phys. Chem. Ref. Data 11, Suppl. 2) for hydrogen (S°(H2) = 130.684; CODATA 1989 gives
 *   130.680, 0.002 J/(mol·K) per atom apart) and for the elements CODATA does not cover
 *   (Fe, Ni, Cr, Co, Mn, Mo, Au, Pt, ...).
 * The two compilations agree to within a few tenths of J/(mol·K) for every element listed, which is
 * below 0.1 kJ/mol in T·ΔfS° at 298.15 K (S: CODATA 32.054, NBS 31.80 — the largest difference here).
 * Reference states: C graphite, S rhombic, Sn white (β), P white, Br2 liquid, I2 crystal, Hg liquid.
 */

export const ELEMENT_ENTROPY_SOURCE =
  'CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989) where available; otherwise ' +
  'NBS tables of chemical thermodynamic properties (Wagman et al. 1982); hydrogen from NBS 1982; ' +
  'per mole of atoms, J/(mol·K), 298.15 K, 1 bar; recalled from memory';

/** S° per mole of atoms, J/(mol·K). Comment gives the source: C = CODATA 1989, N = NBS 1982. */
const S_PER_ATOM: Readonly<Record<string, number>> = {
  // gases (halved for diatomic molecules)
  H: 130.684 / 2, // N (CODATA 130.680)
  O: 205.152 / 2, // C (NBS 205.138)
  N: 191.609 / 2, // C
  F: 202.791 / 2, // C
  Cl: 223.081 / 2, // C (NBS 223.066)
  He: 126.153, // C
  Ne: 146.328, // C
  Ar: 154.846, // C
  Kr: 164.085, // C
  Xe: 169.685, // C
  // liquids and molecular solids (halved)
  Br: 152.21 / 2, // C, Br2(l)
  I: 116.14 / 2, // C, I2(cr)
  Hg: 75.90, // C, liquid
  // non-metals and metalloids
  C: 5.74, // C, graphite
  S: 32.054, // C, rhombic (NBS 31.80)
  P: 41.09, // C, white
  Si: 18.81, // C
  B: 5.90, // C
  Ge: 31.09, // C
  As: 35.1, // N, grey
  Se: 42.442, // N
  Te: 49.71, // N
  Sb: 45.69, // N
  Bi: 56.74, // N
  // alkali and alkaline-earth metals
  Li: 29.12, // C
  Na: 51.30, // C
  K: 64.68, // C
  Rb: 76.78, // C
  Cs: 85.23, // C
  Be: 9.50, // C
  Mg: 32.67, // C
  Ca: 41.59, // C
  Sr: 52.3, // N
  Ba: 62.8, // N
  // metals
  Al: 28.30, // C
  Ag: 42.55, // C
  Cu: 33.15, // C
  Zn: 41.63, // C
  Cd: 51.80, // C
  Pb: 64.80, // C
  Sn: 51.18, // C, white
  Ti: 30.72, // C
  U: 50.20, // C
  Th: 51.8, // C
  Fe: 27.28, // N, α
  Ni: 29.87, // N
  Co: 30.04, // N
  Cr: 23.77, // N
  Mn: 32.01, // N, α
  Mo: 28.66, // N
  W: 32.64, // N
  V: 28.91, // N
  Nb: 36.40, // N
  Ta: 41.51, // N
  Zr: 38.99, // N
  Hf: 43.56, // N
  Au: 47.40, // N
  Pt: 41.63, // N
  Pd: 37.57, // N
  Rh: 31.51, // N
  Ru: 28.53, // N
  Ir: 35.48, // N
  Os: 32.6, // N
  Re: 36.86, // N
  Ga: 40.88, // N
  In: 57.82, // N
  Tl: 64.18, // N
  Sc: 34.64, // N
  Y: 44.43, // N
  La: 56.9, // N
  Ce: 72.0, // N
};

/**
 * S° at 298.15 K, 1 bar of an element in its reference state per mole of atoms, J/(mol·K);
 * undefined for elements not in the table. Worked values: 'H' → 65.342, 'O' → 102.576,
 * 'C' → 5.74, 'Fe' → 27.28. Source: see ELEMENT_ENTROPY_SOURCE.
 */
export function elementEntropy(symbol: string): number | undefined {
  return Object.prototype.hasOwnProperty.call(S_PER_ATOM, symbol) ? S_PER_ATOM[symbol] : undefined;
}

/** Symbols covered by elementEntropy, in table order. */
export function elementsWithEntropy(): string[] {
  return Object.keys(S_PER_ATOM);
}
