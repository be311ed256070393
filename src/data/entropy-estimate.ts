/**
 * Estimated S° for library species that carry only ΔfG°: additive entropy contributions in the
 * manner of Latimer (Latimer, "Oxidation Potentials", 2nd ed. 1952, appendix III: the entropy of a
 * solid is a sum of contributions of its constituents; that of an aqueous ion adds a charge term).
 *
 * Model (one set of coefficients per phase class, condensed = s/l and aqueous = aq):
 *   S° ≈ Σ_el n_el·s_el + k1·z + k2·z²      (the z terms for aqueous species only)
 * The coefficients s_el, k1, k2 are fitted at load time by least squares (normal equations with a
 * small ridge term, 1e-6) to every library species of that class that has S° (given, or third-law
 * from ΔfH°). Deterministic: the library order fixes the sums. An element that appears in no fitted
 * species of the class gives no estimate (undefined). Typical error on the fitted species: see
 * species/README.md (printed by the test); units J/(mol·K).
 * This is a rough estimate: species using it are flagged `estimated`.
 */
import type { LibrarySpecies } from './library.js';

export interface EntropyFit {
  /** Coefficient names (element symbols, then 'z', 'z2' for aqueous). */
  names: string[];
  coef: number[];
  /** Root-mean-square residual over the fitted species, J/(mol·K). */
  rms: number;
  count: number;
  /** Mean coefficient of the fitted metals, used for a metal the class has no data for. */
  metalMean: number;
}

export type PhaseClass = 'aq' | 'condensed';

export const phaseClass = (phase: string): PhaseClass | undefined => (phase === 'aq' ? 'aq' : phase === 's' || phase === 'l' ? 'condensed' : undefined);

function row(names: string[], elements: Record<string, number>, charge: number): number[] {
  return names.map((n) => (n === 'z' ? charge : n === 'z2' ? charge * charge : elements[n] ?? 0));
}

/** Solves A x = b (symmetric positive definite, small) by Gaussian elimination with pivoting. */
function solve(A: number[][], b: number[]): number[] {
  const n = b.length;
  const M = A.map((r, i) => [...r, b[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[p]![c]!)) p = r;
    [M[c], M[p]] = [M[p]!, M[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k <= n; k++) M[r]![k]! -= f * M[c]![k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= M[r]![k]! * x[k]!;
    x[r] = s / M[r]![r]!;
  }
  return x;
}

/**
 * Fits the additive model for one phase class. `entropy(s)` gives each species' S° or undefined.
 */
export function fitEntropy(lib: readonly LibrarySpecies[], cls: PhaseClass, entropy: (s: LibrarySpecies) => number | undefined): EntropyFit {
  const data = lib.filter((s) => phaseClass(s.phase) === cls && entropy(s) !== undefined && Object.keys(s.elements).length > 0);
  const els = [...new Set(data.flatMap((s) => Object.keys(s.elements)))].sort();
  const names = cls === 'aq' ? [...els, 'z', 'z2'] : els;
  const n = names.length;
  // Step 1: normal equations AᵀA x = Aᵀb with a small ridge for elements seen in few species.
  const A = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const b = new Array<number>(n).fill(0);
  for (const s of data) {
    const r = row(names, s.elements, s.charge);
    const y = entropy(s)!;
    for (let i = 0; i < n; i++) {
      b[i]! += r[i]! * y;
      for (let j = 0; j < n; j++) A[i]![j]! += r[i]! * r[j]!;
    }
  }
  for (let i = 0; i < n; i++) A[i]![i]! += 1e-6;
  // Step 2: solve, then the residual for the record.
  const coef = solve(A, b);
  let ss = 0;
  for (const s of data) {
    const r = row(names, s.elements, s.charge);
    const e = r.reduce((acc, v, i) => acc + v * coef[i]!, 0) - entropy(s)!;
    ss += e * e;
  }
  const metals = names.map((nm, i) => [nm, coef[i]!] as const).filter(([nm]) => !['H', 'O', 'C', 'N', 'S', 'Cl', 'z', 'z2'].includes(nm));
  const metalMean = metals.reduce((a, [, c]) => a + c, 0) / Math.max(1, metals.length);
  return { names, coef, rms: Math.sqrt(ss / Math.max(1, data.length)), count: data.length, metalMean };
}

/** The estimate for a composition, or undefined when an element is not covered by the fit. */
export function estimateEntropy(fit: EntropyFit, elements: Record<string, number>, charge: number, cls: PhaseClass): number | undefined {
  let s = 0;
  for (const [el, k] of Object.entries(elements)) {
    const i = fit.names.indexOf(el);
    if (i >= 0) s += k * fit.coef[i]!;
    else if (/^[A-Z][a-z]?$/.test(el) && !['H', 'O', 'C', 'N', 'S', 'Cl'].includes(el)) s += k * fit.metalMean;
    else return undefined;
  }
  if (cls === 'aq') s += charge * fit.coef[fit.names.indexOf('z')]! + charge * charge * fit.coef[fit.names.indexOf('z2')]!;
  return s;
}

const OX: Readonly<Record<string, number>> = { H: 1, O: -2, Cl: -1, N: -3, S: -2 };

/**
 * Oxidation state of the metal (the one element outside H, O, Cl, N, S, C) of a species, with
 * H +1, O −2, Cl −1, N −3, S −2 and C +2 in cyanide (as many N as C) else +4; undefined when the
 * species holds no single such element.
 */
export function metalOxidationState(elements: Record<string, number>, charge: number): { metal: string; ox: number } | undefined {
  const metals = Object.keys(elements).filter((e) => !(e in OX) && e !== 'C');
  if (metals.length !== 1) return undefined;
  const metal = metals[0]!;
  let rest = 0;
  for (const [e, n] of Object.entries(elements)) {
    if (e === metal) continue;
    if (e === 'C') rest += n * ((elements.N ?? 0) === n ? 2 : 4);
    else rest += n * OX[e]!;
  }
  return { metal, ox: (charge - rest) / elements[metal]! };
}

/**
 * S° estimate anchored on a parent: the species of the same phase class, same metal and same
 * oxidation state with a known S° (the fewest atoms first, then library order) corrects the
 * additive estimate by its own residual: S°(X) ≈ S°(P) + [fit(X) − fit(P)]. Without a parent the
 * plain additive estimate is used. Returns the value and the parent's formula (if any).
 */
export function estimateEntropyAnchored(
  lib: readonly LibrarySpecies[],
  fit: EntropyFit,
  target: { elements: Record<string, number>; charge: number; phase: string },
  entropy: (s: LibrarySpecies) => number | undefined,
): { S: number; parent?: string } | undefined {
  const cls = phaseClass(target.phase);
  if (!cls) return undefined;
  const own = estimateEntropy(fit, target.elements, target.charge, cls);
  if (own === undefined) return undefined;
  const ox = metalOxidationState(target.elements, target.charge);
  if (!ox) return { S: own };
  const size = (s: { elements: Record<string, number> }): number => Object.values(s.elements).reduce((a, b) => a + b, 0);
  const parents = lib
    .filter((s) => phaseClass(s.phase) === cls && entropy(s) !== undefined && (s.elements[ox.metal] ?? 0) > 0)
    .filter((s) => {
      const o = metalOxidationState(s.elements, s.charge);
      return o !== undefined && o.metal === ox.metal && Math.abs(o.ox - ox.ox) < 1e-9;
    });
  let best: LibrarySpecies | undefined;
  for (const p of parents) if (!best || size(p) < size(best)) best = p;
  if (!best) return { S: own };
  const fp = estimateEntropy(fit, best.elements, best.charge, cls);
  if (fp === undefined) return { S: own };
  return { S: entropy(best)! + own - fp, parent: best.formula };
}

/** S° given, or third-law from ΔfH° (see thermo/gibbs.ts entropyFromFormation), or undefined. */
export type EntropyOf = (s: LibrarySpecies) => number | undefined;

export interface LibraryEntropyEstimator {
  fits: Record<PhaseClass, EntropyFit>;
  /** Anchored estimate for a composition (see estimateEntropyAnchored), or undefined. */
  estimate(target: { elements: Record<string, number>; charge: number; phase: string }): { S: number; parent?: string } | undefined;
}

const estimators = new WeakMap<object, LibraryEntropyEstimator>();

/** The estimator for a loaded library, fitted once per library (cached on its first species). */
export function libraryEntropyEstimator(lib: readonly LibrarySpecies[], entropy: EntropyOf): LibraryEntropyEstimator {
  const key = lib[0] as object | undefined;
  const hit = key ? estimators.get(key) : undefined;
  if (hit) return hit;
  const fits = { aq: fitEntropy(lib, 'aq', entropy), condensed: fitEntropy(lib, 'condensed', entropy) };
  const est: LibraryEntropyEstimator = {
    fits,
    estimate: (t) => {
      const cls = phaseClass(t.phase);
      return cls ? estimateEntropyAnchored(lib, fits[cls], t, entropy) : undefined;
    },
  };
  if (key) estimators.set(key, est);
  return est;
}
