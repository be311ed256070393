/**
 * `probe` in composition mode (the bath as made up): the full speciation at one operating point
 * from the point solver, the predominant form (largest share of the element's atoms, dissolved or
 * solid) and its verdict. Steps: 1. solve the mass balances at (pH, E) (speciationAt); 2. on a
 * failed solve, return `status: 'failed'` with the reason and verdict `unknown` — never an answer;
 * 3. the predominant form's class gives the verdict (immunity / passivation / corrosion, with the
 * file's `classes` overrides); 4. the total dissolved element is set against the corrosion
 * threshold (the trade's 10⁻⁶ mol/kg; `activity` is refused in composition mode), stated beside the verdict.
 * 5. where species whose G at T is unknown (only ΔfG°, away from 25 °C) hold 1 % or more of the
 * element (diagram/composition-undetermined.ts), the verdict is `unknown`, naming them in
 * `undetermined` and `reason` — the shares they take could belong to any other form.
 * Example (tests/analysis/composition-probe.test.ts): 0.5 mol/kg Cu with 1 mol/kg NH₃ at pH 10,
 * +0.3 V: CuO predominates (passivation), Cu(NH₃)₄²⁺ cannot hold the copper.
 */
import { classify } from '../diagram/classify.js';
import { type CompositionSetup, speciationAt } from '../diagram/composition-setup.js';
import { UNDETERMINED_SHARE, undeterminedHolders } from '../diagram/composition-undetermined.js';
import { type Verdict, verdictOf } from '../diagram/verdict.js';
import type { RegionClass } from '../model.js';
import type { SpeciationProblem } from '../solve/speciation/problem.js';
import type { SystemSpec } from '../system/spec.js';

export interface CompositionProbeResult {
  mode: 'composition';
  /** What the answer describes. */
  basis: 'the bath as made up';
  status: 'ok' | 'failed';
  /** Why the point solver failed (status failed), or why there is no verdict (undetermined species). */
  reason?: string;
  /** Species without G at T holding 1 % or more of the element here (verdict unknown); absent: none. */
  undetermined?: { species: string; share: number }[];
  pH: number;
  /** Potential at the point, V vs SHE at T. */
  E: number;
  reference?: { label: string; E: number; offset: number };
  temperature: { celsius: number };
  /** Totals of the file, mol/kg, by component (the element first). */
  totals: Record<string, number>;
  /** The form holding the largest share of the element's atoms: its formula as in the species data. */
  predominant: string | null;
  /** Its phase ('aq' dissolved, 's' solid). */
  phase: string | null;
  class: RegionClass | null;
  verdict: Verdict | 'unknown';
  /** Corrosion threshold for the total dissolved element, mol/kg. */
  threshold: number;
  /** Total dissolved element, mol/kg (null when failed). */
  dissolved: number | null;
  /** The dissolved total set against the threshold. */
  dissolvedVsThreshold: 'above' | 'below' | 'unknown';
  /** Every dissolved species: molality (mol/kg) and activity. */
  speciation: { species: string; molality: number; activity: number }[];
  /** Every solid present: amount in mol per kg of water. */
  solids: { species: string; amount: number }[];
  /** Per component (element, then each ligand): forms holding it with their share, largest first. */
  shares: Record<string, { species: string; share: number }[]>;
  freeLigand: Record<string, { molality: number; form: string }>;
  /** log10 saturation index of each solid not formed (≤ 0 at equilibrium). */
  saturation: { species: string; logSI: number }[];
  ionicStrength: number | null;
  /** How the ionic strength was taken: `not given (ideal solution)`, `given`, a background, or from the speciation (auto). */
  ionicStrengthFrom: string;
  /** The activity-coefficient model used (`ideal`, `davies`, `debye-huckel`). */
  activityModel: string;
}

/** Species-data formula of a described label ('CuO(s)' → 'CuO'; dissolved formulas unchanged). */
function dataFormula(P: SpeciationProblem, label: string): { formula: string; index: number } {
  const i = P.species.findIndex((s, k) => (k < P.nAq ? s.formula : `${s.formula}(${s.phase})`) === label);
  return { formula: i >= 0 ? P.species[i].formula : label, index: i };
}

/** How the solver takes the ionic strength, as composition-setup.ts sets it up (auto: Davies unless a model is named). */
function ionicStrengthBasis(spec: SystemSpec, setup: CompositionSetup): { ionicStrengthFrom: string; activityModel: string } {
  const s = setup.built.solution.settings;
  const auto = spec.composition?.autoIonicStrength === true;
  return {
    ionicStrengthFrom: auto ? 'from the speciation at this point (ionicStrength: auto)' : s.ionicStrengthFrom,
    activityModel: auto && s.model === 'ideal' ? 'davies' : s.model,
  };
}

export function compositionProbe(spec: SystemSpec, setup: CompositionSetup, pH: number, E: number, ref?: { label: string; E: number; offset: number }): CompositionProbeResult {
  const P = setup.solver.problem;
  // Step 1: the speciation.
  const r = speciationAt(setup, pH, E);
  const base = {
    mode: 'composition' as const,
    basis: 'the bath as made up' as const,
    pH,
    E,
    ...(ref ? { reference: ref } : {}),
    temperature: { celsius: spec.temperature },
    totals: setup.totals,
    threshold: spec.activity,
    ...ionicStrengthBasis(spec, setup),
  };
  // Step 2: a failed solve is reported, with no verdict.
  if (r.status !== 'ok' || r.predominant === undefined) {
    return { ...base, status: 'failed', reason: r.reason ?? 'no predominant form', predominant: null, phase: null, class: null, verdict: 'unknown', dissolved: null, dissolvedVsThreshold: 'unknown', speciation: [], solids: [], shares: {}, freeLigand: {}, saturation: [], ionicStrength: null };
  }
  // Step 3: the predominant form's class and verdict.
  const { formula, index } = dataFormula(P, r.predominant);
  const sp = P.species[index];
  const cls = classify(spec.element, sp);
  const verdict = verdictOf(cls, formula, spec.operating.classes);
  const solids = r.solids.map((s) => ({ species: dataFormula(P, s.species).formula, amount: s.amount }));
  // Step 5: no verdict where species without G at T hold part of the element.
  const byIndex = new Float64Array(P.species.length);
  for (const x of r.shares[spec.element] ?? []) {
    const k = dataFormula(P, x.species).index;
    if (k >= 0) byIndex[k] = x.share;
  }
  const held = undeterminedHolders(P, byIndex);
  const unknown = held.length
    ? { verdict: 'unknown' as const, undetermined: held, reason: `${held.map((h) => `${h.species} (${(100 * h.share).toPrecision(3)} %)`).join(', ')} ${held.length > 1 ? 'hold' : 'holds'} part of the element (${100 * UNDETERMINED_SHARE} % or more) but cannot be carried to ${spec.temperature} °C (only ΔfG° given); no verdict` }
    : { verdict };
  // Step 4: the dissolved total against the threshold.
  return {
    ...base,
    status: 'ok',
    predominant: formula,
    phase: sp.phase,
    class: cls,
    ...unknown,
    dissolved: r.dissolved,
    dissolvedVsThreshold: r.dissolved > spec.activity ? 'above' : 'below',
    speciation: r.speciation,
    solids,
    shares: r.shares,
    freeLigand: r.freeLigand,
    saturation: r.saturation,
    ionicStrength: r.ionicStrength,
  };
}
