/**
 * The answer at a point in plain data: every dissolved species' molality and activity, the solids
 * present with their amounts, each component's free form, shares of the element and of each ligand
 * held by every form, saturation indices of solids not formed, the total dissolved element, and
 * the predominant form (largest share of the main element's atoms, dissolved or solid).
 */
import type { PointSolution } from './point.js';
import type { SpeciationProblem } from './problem.js';

export interface SpeciationResult {
  status: 'ok' | 'failed';
  reason?: string;
  pH: number;
  E: number;
  predominant?: string;
  speciation: { species: string; molality: number; activity: number }[];
  solids: { species: string; amount: number }[];
  /** Per component: form → share of its total (0…1), largest first; only forms holding it. */
  shares: Record<string, { species: string; share: number }[]>;
  /** Free ligand: per ligand, the molality of its unbound forms (no main element) and its largest form. */
  freeLigand: Record<string, { molality: number; form: string }>;
  /** log10 saturation index of each solid not present. */
  saturation: { species: string; logSI: number }[];
  /** Total dissolved main element, mol/kg. */
  dissolved: number;
  ionicStrength: number;
}

/** Share of the main element held by each species (index order of the problem); solids by amount. */
export function elementShares(P: SpeciationProblem, s: PointSolution, out: Float64Array, c = 0): Float64Array {
  const nc = P.components.length;
  out.fill(0);
  for (let i = 0; i < P.nAq; i++) out[i] = (P.A[i * nc + c] * s.m[i]) / P.totals[c];
  s.active.forEach((k, q) => (out[k] = (P.A[k * nc + c] * s.lambda[q]) / P.totals[c]));
  return out;
}

/** Index of the form with the largest share of the main element (ties: lower index). */
export function predominantIndex(P: SpeciationProblem, s: PointSolution, work: Float64Array): number {
  elementShares(P, s, work);
  let best = -1;
  let bv = -1;
  for (let i = 0; i < work.length; i++) if (work[i] > bv) {
    bv = work[i];
    best = i;
  }
  return best;
}

/** Total dissolved main element, mol/kg. */
export function dissolvedElement(P: SpeciationProblem, s: PointSolution): number {
  const nc = P.components.length;
  let t = 0;
  for (let i = 0; i < P.nAq; i++) t += P.A[i * nc] * s.m[i];
  return t;
}

const label = (P: SpeciationProblem, i: number) => (i < P.nAq ? P.species[i].formula : `${P.species[i].formula}(${P.species[i].phase})`);

export function describePoint(P: SpeciationProblem, s: PointSolution): SpeciationResult {
  const nc = P.components.length;
  const base = { pH: s.pH, E: s.E };
  if (s.status !== 'ok') return { status: 'failed', reason: s.reason, ...base, speciation: [], solids: [], shares: {}, freeLigand: {}, saturation: [], dissolved: NaN, ionicStrength: NaN };
  const speciation = [];
  for (let i = 0; i < P.nAq; i++) speciation.push({ species: P.species[i].formula, molality: s.m[i], activity: s.m[i] * 10 ** s.logGamma[i] });
  const solids = s.active.map((k, q) => ({ species: label(P, k), amount: s.lambda[q] })).sort((a, b) => (a.species < b.species ? -1 : 1));
  const shares: SpeciationResult['shares'] = {};
  const work = new Float64Array(P.species.length);
  P.components.forEach((c, j) => {
    elementShares(P, s, work, j);
    const list: { species: string; share: number }[] = [];
    work.forEach((v, i) => v > 0 && list.push({ species: label(P, i), share: v }));
    shares[c] = list.sort((a, b) => b.share - a.share || (a.species < b.species ? -1 : 1));
  });
  const freeLigand: SpeciationResult['freeLigand'] = {};
  for (let c = 1; c < nc; c++) {
    let tot = 0;
    let form = '';
    let fm = -1;
    for (let i = 0; i < P.nAq; i++) {
      if (P.A[i * nc] !== 0 || P.A[i * nc + c] === 0) continue;
      tot += P.A[i * nc + c] * s.m[i];
      if (s.m[i] > fm) {
        fm = s.m[i];
        form = P.species[i].formula;
      }
    }
    freeLigand[P.components[c]] = { molality: tot, form };
  }
  const saturation = [];
  for (let k = P.nAq; k < P.species.length; k++) {
    if (s.active.includes(k)) continue;
    let si = s.logK[k];
    for (let c = 0; c < nc; c++) si += P.A[k * nc + c] * s.u[c];
    saturation.push({ species: label(P, k), logSI: si });
  }
  const p = predominantIndex(P, s, work);
  return { status: 'ok', ...base, predominant: p >= 0 ? label(P, p) : undefined, speciation, solids, shares, freeLigand, saturation, dissolved: dissolvedElement(P, s), ionicStrength: s.ionicStrength };
}
