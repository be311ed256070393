/**
 * Grand potential planes ψ(pH, E) (the derivation is below; DEVELOPERS.md, "The solver in one paragraph").
 *
 * A species with x atoms of an element M (or ligand L), o oxygen, h hydrogen, charge z forms as
 *   x M + o H2O → species + (2o − h) H+ + (2o − h + z) e−
 * with μ(H+) = −ln10·RT·pH, μ(e−) = −F·E + ½·G(H2, T) (SHE at the same T), μ(H2O) = G(H2O, T)
 * + RT ln a_w. Hence
 *   Φ_i(pH, E) = μ_i − o·μ(H2O) + (2o − h)·μ(H+) + (2o − h + z)·μ(e−)        [J/mol]
 * a plane in (pH, E); ψ_i = (Φ_i − Σ_L k_L·μ_L)/x. Units: J/mol of species (Φ), J per mol of
 * M atoms (ψ). Valid wherever the species data are (0–300 °C for the built-in library).
 * Worked example: Fe²⁺ at a = 1e-6, 25 °C, ΔfG° = −78.90 kJ/mol: Φ = −78900 + RT ln 1e-6
 * + 2·(−F·E) = −113148 − 192971·E J/mol; Fe(s) has Φ = 0, so Φ(Fe²⁺) = Φ(Fe) at
 * E = −0.58635 V, the Fe²⁺/Fe line at 1e-6.
 */
import { F, LN10, R } from '../thermo/constants.js';
import type { Plane } from './plane.js';
import type { SolverSpecies } from './types.js';

export interface WaterContext {
  kelvin: number;
  /** J/mol */
  G_H2O: number;
  /** J/mol */
  G_H2: number;
  logWaterActivity: number;
}

/** Φ_i: the formation plane of a species from its elements' reference (see module comment). */
export function formationPlane(sp: SolverSpecies, w: WaterContext): Plane {
  const o = sp.elements.O ?? 0;
  const h = sp.elements.H ?? 0;
  const z = sp.charge;
  const RT = R * w.kelvin;
  const nH = 2 * o - h;
  const nE = nH + z;
  const mu = sp.G * 1000 + RT * LN10 * sp.logActivity;
  const muW = w.G_H2O + RT * LN10 * w.logWaterActivity;
  return {
    g: mu - o * muW + nE * 0.5 * w.G_H2,
    p: -nH * RT * LN10,
    e: -nE * F,
  };
}
