/**
 * Activity coefficients for the speciation solver: log10 γ per species at an ionic strength, with
 * the models of src/thermo/activity.ts (Davies, extended Debye–Hückel, ideal), and the ionic
 * strength of a computed speciation.
 */
import { daviesLogGamma, extendedDebyeHuckelLogGamma, type ActivityModelName } from '../../thermo/activity.js';
import type { SpeciationProblem } from './problem.js';

export interface GammaSettings {
  model: ActivityModelName;
  /** Debye–Hückel A and B at T (kg^½ mol^-½, Å⁻¹ kg^½ mol^-½). */
  A: number;
  B: number;
  /** Ion size for 'debye-huckel', Å. */
  ionSize: number;
  /** A fixed ionic strength (mol/kg), or 'auto' (from the speciation). */
  ionicStrength: number | 'auto';
}

/** log10 γ of charge z at ionic strength I (0 for neutral species and the ideal model). */
export function logGammaAt(g: GammaSettings, z: number, I: number): number {
  if (z === 0 || g.model === 'ideal' || I <= 0) return 0;
  return g.model === 'davies' ? daviesLogGamma(z, I, g.A) : extendedDebyeHuckelLogGamma(z, I, g.A, g.B, g.ionSize);
}

/** Fill lg[i] (dissolved species) at I. */
export function fillLogGamma(P: SpeciationProblem, g: GammaSettings, I: number, lg: Float64Array): void {
  for (let i = 0; i < P.nAq; i++) lg[i] = logGammaAt(g, P.charge[i], I);
}

/**
 * Ionic strength of the speciation, mol/kg: I = ½ Σ m_i z_i² over the computed ions, plus H⁺ and
 * OH⁻ from pH and Kw, plus singly charged spectator counter-ions balancing the net charge
 * (½·|Σ m_i z_i|) — the salts a bath is made from (K⁺, Na⁺, SO₄²⁻ counted as monovalent).
 * Example: 0.2 mol/kg Ag(CN)₂⁻ with 0.2 mol/kg CN⁻ at pH 12 (H⁺, OH⁻ ≈ 0.01): ½(0.2 + 0.2 + 0.01)
 * + ½·0.41 = 0.41.
 */
export function speciationIonicStrength(P: SpeciationProblem, m: Float64Array, pH: number, lg1: number): number {
  let s = 0;
  let q = 0;
  for (let i = 0; i < P.nAq; i++) {
    const z = P.charge[i];
    s += m[i] * z * z;
    q += m[i] * z;
  }
  const mH = 10 ** (-pH - lg1);
  const mOH = 10 ** (P.logKw + pH - lg1);
  return 0.5 * (s + mH + mOH) + 0.5 * Math.abs(q + mH - mOH);
}
