/**
 * Balanced boundary reactions and their line equations.
 *
 * For two species i, j of the main element M (x_i, x_j atoms of M) and, for each ligand L whose
 * count changes, the ligand species ℓ_L predominant on that segment:
 *   ν_i = x_j, ν_j = −x_i (M balanced); ligands balanced from the last-solved ligand back to the
 *   first (a later ligand's species may carry atoms of an earlier one); then
 *   ν(H2O) = −Σν·o,  ν(H+) = −Σν·h − 2ν(H2O),  ν(e−) = Σν·z + ν(H+)      (O, H, charge balance)
 * scaled to the smallest integers and written as a reduction (e− on the left); a no-electron
 * reaction is written with H+ on the left.
 * Line: ΔrG(pH, E) = Σ_k ν_k·Φ_k(pH, E) = 0, with Φ the formation planes (potentials.ts), since
 * H2O, H+ and e− cancel by the balances. E = E° − (m/n)·s·pH + (s/n)·Σν log a, s = ln10·RT/F;
 * a no-electron line is pH = const.
 */
import { reactionAscii } from '../chem/reaction-text.js';
import { lineEquationText } from '../diagram/line-text.js';
import type { LineCoefficients } from '../model.js';
import { LN10, R } from '../thermo/constants.js';
import { type Plane, addScaled, ZERO_PLANE } from './plane.js';
import type { SolverSpecies } from './types.js';

export interface Participant {
  sp: SolverSpecies;
  /** Φ with the activities used. */
  phi: Plane;
  /** Φ at unit activities (standard state). */
  phi0: Plane;
}

/** What every balanced reaction carries beside its species terms: H2O, H+, e− and the line. */
export interface ReactionLine {
  water: number;
  protons: number;
  electrons: number;
  text: string;
  line: LineCoefficients;
  equation: string;
}

export interface BalancedReaction extends ReactionLine {
  /** Species coefficients, products positive, in the reduction direction. */
  terms: { formula: string; phase: string; nu: number }[];
}

/**
 * Balance i ⇌ j with the given ligand species (one per ligand element, in solving order; null where
 * the ligand's count does not change) and derive the line at temperature `kelvin`.
 */
export function balance(
  element: string,
  i: Participant,
  j: Participant,
  ligands: { element: string; part: Participant | null }[],
  kelvin: number,
): BalancedReaction {
  const xi = i.sp.elements[element] ?? 0;
  const xj = j.sp.elements[element] ?? 0;
  const parts: { p: Participant; nu: number }[] = [
    { p: i, nu: xj },
    { p: j, nu: -xi },
  ];
  // Step 1: balance ligand atoms, last-solved ligand first.
  for (let k = ligands.length - 1; k >= 0; k--) {
    const L = ligands[k].element;
    const need = -parts.reduce((s, q) => s + q.nu * (q.p.sp.elements[L] ?? 0), 0);
    if (Math.abs(need) < 1e-12) continue;
    const lp = ligands[k].part;
    if (!lp) throw new Error(`no ligand species of ${L} to balance ${i.sp.formula} / ${j.sp.formula}`);
    parts.push({ p: lp, nu: need / (lp.sp.elements[L] ?? 1) });
  }
  // Step 2: integer coefficients.
  let nus = parts.map((q) => q.nu);
  const mult = integerMultiplier(nus);
  nus = nus.map((v) => Math.round(v * mult));
  let water = -sum(parts.map((q, k) => nus[k] * (q.p.sp.elements.O ?? 0)));
  let protons = -sum(parts.map((q, k) => nus[k] * (q.p.sp.elements.H ?? 0))) - 2 * water;
  let electrons = sum(parts.map((q, k) => nus[k] * q.p.sp.charge)) + protons;
  const g = gcdAll([...nus, water, protons, electrons]);
  nus = nus.map((v) => v / g);
  water /= g;
  protons /= g;
  electrons /= g;
  // Step 3: orient as a reduction (e− consumed), else with H+ consumed, else i on the left.
  let flip = electrons > 0 || (electrons === 0 && (protons > 0 || (protons === 0 && nus[0] > 0)));
  if (flip) {
    nus = nus.map((v) => -v);
    water = -water;
    protons = -protons;
    electrons = -electrons;
  }
  // Step 4: the line, from Σν·Φ.
  let phi = ZERO_PLANE;
  let phi0 = ZERO_PLANE;
  parts.forEach((q, k) => {
    phi = addScaled(phi, q.p.phi, nus[k]);
    phi0 = addScaled(phi0, q.p.phi0, nus[k]);
  });
  const n = -electrons || 0;
  const m = -protons || 0;
  const line = lineFrom(phi, phi0, n, m, kelvin);
  const terms = parts.map((q, k) => ({ formula: q.p.sp.formula, phase: q.p.sp.phase, nu: nus[k] }));
  const text = reactionText(terms, water, protons, electrons);
  return { terms, water, protons, electrons, text, line, equation: lineEquationText(line) };
}

/** Line coefficients from the reaction plane ΔrG = g + p·pH + e·E (J per reaction as written). */
export function lineFrom(phi: Plane, phi0: Plane, n: number, m: number, kelvin: number): LineCoefficients {
  if (n !== 0) {
    return { kind: 'E', intercept: -phi.g / phi.e || 0, slope: -phi.p / phi.e || 0, E0: -phi0.g / phi0.e || 0, n, m };
  }
  return { kind: 'pH', value: -phi.g / phi.p || 0, logK: -phi0.g / (R * kelvin * LN10) || 0, n, m };
}

/**
 * The reaction as text in the canonical ASCII notation (JSON's form, chem/reaction-text.ts):
 * "Fe^2+ + 2e^- <=> Fe(s)"; text for people re-spells it with reactionForPeople ("Fe²⁺ + 2e⁻ ⇌ Fe(s)").
 */
export function reactionText(
  terms: { formula: string; phase: string; nu: number }[],
  water: number,
  protons: number,
  electrons: number,
): string {
  return reactionAscii(terms, water, protons, electrons);
}

function sum(a: number[]): number {
  return a.reduce((s, v) => s + v, 0);
}

function integerMultiplier(v: number[]): number {
  for (let k = 1; k <= 720; k++) {
    if (v.every((x) => Math.abs(x * k - Math.round(x * k)) < 1e-9)) return k;
  }
  throw new Error('reaction coefficients are not rational with a small denominator');
}

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}

function gcdAll(v: number[]): number {
  return v.reduce((g, x) => gcd(g, x), 0) || 1;
}
