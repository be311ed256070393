/**
 * The balanced reaction between two neighbouring assemblages of an alloy (issue 18), and its line.
 *
 * Steps:
 *  1. species coefficients ν_k = n_k(B) − n_k(A) (mol per mol of alloy atoms; every main element
 *     balances by construction, since both assemblages hold the whole bulk composition);
 *  2. each ligand balanced with its predominant own species at the boundary point;
 *  3. O with H₂O, H with H⁺, charge with e⁻;
 *  4. oriented as a reduction (electrons on the left; with no electrons, protons on the left) and
 *     scaled to the smallest whole numbers when a multiplier up to 720 makes every coefficient whole
 *     within 1e-9, else to a largest species coefficient of 1 (rounded to 6 decimals in the text);
 *  5. the line: ΔrG(pH, E) = Σ ν_k ψ'_k (the ψ' planes of psi.ts include H⁺, e⁻ and H₂O exchange) is
 *     affine where the ligands' predominant species do not change, so its plane is read from three
 *     evaluations 1e-3 apart at the boundary point: E = −(g + p·pH)/e, or pH = −g/p when e = 0;
 *     E° (or log K) from g less RT ln10 Σ ν log10 a (every activity 1).
 * Reference: DEVELOPERS.md ("The alloy kind"); the same balancing as the single-element boundaries (src/solve/reaction.ts).
 * Worked example (tested): Fe (alone) between Fe and Fe^2+ → "Fe^2+ + 2e^- <=> Fe(s)", E = const.
 */
import type { LineCoefficients } from '../model.js';
import { speciesPotentialsAt } from '../solve/alloy/psi.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import { type ReactionLine, reactionText } from '../solve/reaction.js';
import type { SolverSpecies } from '../solve/types.js';
import { lineEquationText } from './line-text.js';

export interface AssemblageAmounts {
  indices: number[];
  amounts: number[];
}

export interface AlloyReaction extends ReactionLine {
  /** Signed coefficients of every term (negative: left side), after scaling. */
  terms: { formula: string; phase: string; nu: number; elements: Record<string, number>; charge: number }[];
}

const EPS = 1e-12;

/** Steps 1–2: species and ligand coefficients of A → B. */
function speciesTerms(input: AlloyInput, a: AssemblageAmounts, b: AssemblageAmounts, ligandSpecies: Record<string, string>): Map<SolverSpecies, number> {
  const nu = new Map<SolverSpecies, number>();
  const add = (sp: SolverSpecies, v: number) => nu.set(sp, (nu.get(sp) ?? 0) + v);
  a.indices.forEach((k, i) => add(input.species[k], -a.amounts[i]));
  b.indices.forEach((k, i) => add(input.species[k], b.amounts[i]));
  for (const L of input.ligands) {
    let d = 0;
    for (const [sp, v] of nu) d += v * (sp.elements[L.element] ?? 0);
    if (Math.abs(d) <= EPS) continue;
    const own = L.species.find((s) => s.formula === ligandSpecies[L.element]) ?? L.species[0];
    add(own, -d / (own.elements[L.element] ?? 1));
  }
  return nu;
}

export function assemblageReaction(input: AlloyInput, a: AssemblageAmounts, b: AssemblageAmounts, at: [number, number]): AlloyReaction {
  const { ligandSpecies } = speciesPotentialsAt(input, at[0], at[1]);
  const nu = speciesTerms(input, a, b, ligandSpecies);
  // Step 3: O, H, charge.
  let O = 0;
  let H = 0;
  let q = 0;
  for (const [sp, v] of nu) {
    O += v * (sp.elements.O ?? 0);
    H += v * (sp.elements.H ?? 0);
    q += v * sp.charge;
  }
  let water = -O;
  let protons = -(H + 2 * water);
  let electrons = q + protons; // e⁻ on the right: Σ charge − electrons = 0
  let terms = [...nu].filter(([, v]) => Math.abs(v) > EPS).map(([sp, v]) => ({ formula: sp.formula, phase: sp.phase, nu: v, elements: sp.elements, charge: sp.charge }));
  // Step 4: orientation and scale.
  const flip = electrons > EPS || (Math.abs(electrons) <= EPS && protons > EPS);
  let s = flip ? -1 : 1;
  const all = [...terms.map((t) => t.nu), water, protons, electrons].filter((v) => Math.abs(v) > EPS);
  const k = wholeMultiplier(all) ?? 1 / Math.max(...terms.map((t) => Math.abs(t.nu)));
  s *= k;
  const r = (v: number) => (Math.abs(v * s) <= 1e-9 ? 0 : Math.round(v * s * 1e6) / 1e6);
  terms = terms.map((t) => ({ ...t, nu: r(t.nu) }));
  water = r(water);
  protons = r(protons);
  electrons = r(electrons);
  const text = reactionText(terms, water, protons, electrons);
  // Step 5: the line, from ΔrG per reaction as written (J).
  const dG = (pH: number, E: number) => {
    const { psi } = speciesPotentialsAt(input, pH, E);
    let g = 0;
    for (const [sp, v] of nu) {
      const idx = input.species.indexOf(sp);
      if (idx >= 0) g += v * s * psi[idx];
    }
    return g;
  };
  const h = 1e-3;
  const g0 = dG(at[0], at[1]);
  const gp = (dG(at[0] + h, at[1]) - g0) / h;
  const ge = (dG(at[0], at[1] + h) - g0) / h;
  const g = g0 - gp * at[0] - ge * at[1];
  const n = -electrons;
  const m = -protons;
  // Standard state (every activity 1): remove each term's RT ln10 · ν · log10 a.
  const RTln10 = (8.314462618e-3 * input.kelvin * Math.LN10);
  let logQ = 0;
  for (const [sp, v] of nu) logQ += v * s * (sp.logActivity ?? 0);
  const gStd = g - RTln10 * logQ;
  const line: LineCoefficients = Math.abs(ge) > 1e-9 * Math.max(1, Math.abs(gp))
    ? { kind: 'E', intercept: -g / ge || 0, slope: -gp / ge || 0, E0: -gStd / ge || 0, n, m }
    : { kind: 'pH', value: -g / gp || 0, logK: -gStd / RTln10 || 0, n, m };
  return { terms, water, protons, electrons, text, line, equation: lineEquationText(line) };
}

/** The smallest k ≤ 720 that makes every value whole within 1e-9 (relative to the smallest), or null. */
function wholeMultiplier(v: number[]): number | null {
  const base = Math.min(...v.map(Math.abs));
  for (let k = 1; k <= 720; k++) {
    const f = k / base;
    if (v.every((x) => Math.abs(x * f - Math.round(x * f)) < 1e-7)) return f;
  }
  return null;
}
