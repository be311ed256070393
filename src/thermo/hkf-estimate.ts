/**
 * Estimated revised-HKF parameters for an aqueous species that no compilation covers, from its
 * charge, S° and (where known) Cp°. Every species carried with these is flagged `estimated`.
 *
 * Steps:
 * 1. ω (solvation): charged species — Born effective radius r_e = r_x + |z|·k_z with k_z = 0.94 Å
 *    for cations and 0 for anions (Shock & Helgeson 1988, GCA 52, 2009) and a typical
 *    crystallographic radius r_x per charge (TYPICAL_RX below; the compilations' ions give ω within
 *    about 10 % of these: Na⁺ 0.33, Fe²⁺ 1.43, Al³⁺ 2.87, Cl⁻ 1.46, SO₄²⁻ 3.15 ×10⁵ cal/mol);
 *    conventional ω = η(z²/r_e − z/3.082). Neutral species — ω = −1514.4·S° + 0.34·10⁵ cal/mol
 *    (S° in cal/(mol·K); Shock & Helgeson 1990, GCA 54, 915, as recalled).
 * 2. c2, c1 (non-solvation heat capacity): with a known Cp°, c2·10⁻⁴ = 0.2037·Cp° − 3.0346
 *    (Cp° in cal/(mol·K); Shock & Helgeson 1988, as recalled) and c1 fitted so that the model
 *    reproduces Cp° at 25 °C: c1 = Cp° − c2/(T_r − Θ)² − ω·T_r·X_r. Without Cp°, c1 = c2 = 0: the
 *    heat capacity is the Born term alone (ω·T·X), which dominates for ions.
 * 3. a1–a4 (volume): zero — the library has no V°; along the saturation curve (P < 100 bar) the
 *    volume terms change G by under 0.1 kJ/mol.
 * Units: S°, Cp° in J/(mol·K); result in the tabulated (scaled) units of hkf.ts.
 * Worked example: z = +2, no Cp° → r_e = 0.75 + 1.88 = 2.63 Å, ω = 1.4476·10⁵ cal/mol.
 */
import { bornReference } from './born.js';
import { CAL, ETA, type HkfParameters, THETA } from './hkf.js';
import { T_REF } from './constants.js';

/** Typical crystallographic radius r_x (Å) by charge: small metal cations, larger anions and oxo/complex anions. */
export const TYPICAL_RX: Readonly<Record<string, number>> = { '1': 0.95, '2': 0.75, '3': 0.65, '4': 0.6, '-1': 1.81, '-2': 3.0, '-3': 3.5, '-4': 4.0 };

/** Conventional ω (cal/mol) of a charged species from its charge (step 1). */
export function estimatedOmegaIon(charge: number): number {
  const z = charge;
  const key = String(Math.max(-4, Math.min(4, z)));
  const rx = TYPICAL_RX[key]!;
  const re = rx + (z > 0 ? 0.94 * z : 0);
  return ETA * ((z * z) / re - z / 3.082);
}

/** Estimated parameters (scaled units) from charge, S° (J/(mol·K)) and optional Cp° (J/(mol·K)). */
export function estimateHkf(charge: number, S: number, Cp?: number): HkfParameters {
  const omega = charge === 0 ? -1514.4 * (S / CAL) + 0.34e5 : estimatedOmegaIon(charge);
  let c1 = 0;
  let c2 = 0;
  if (Cp !== undefined) {
    const cpCal = Cp / CAL;
    c2 = (0.2037 * cpCal - 3.0346) * 1e4;
    c1 = cpCal - c2 / (T_REF - THETA) ** 2 - omega * T_REF * bornReference().X;
  }
  return { a1: 0, a2: 0, a3: 0, a4: 0, c1, c2: c2 / 1e4, omega: omega / 1e5 };
}
