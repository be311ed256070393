/**
 * The `probe` report: the answer at one operating point, evaluated exactly from the ψ planes —
 * predominant species and its verdict (immunity / passivation / corrosion at the threshold
 * activity), runner-up and margin, and distances with one definition per name:
 *  - vertical: the change of E at this pH (mV) to the boundary above or below, the nearer one;
 *  - horizontal: the change of pH at this E to the boundary at lower or higher pH, the nearer one;
 *  - nearest boundary: the shortest distance in the (pH, E) plane with 1 pH counted as the Nernst
 *    slope s = RT·ln10/F at T (59.16 mV at 25 °C), given in mV on that scale, with the point reached.
 * Every boundary is named the same way everywhere: the pair of species it separates.
 */
import { classify } from '../diagram/classify.js';
import { type Verdict, verdictOf } from '../diagram/verdict.js';
import type { GivenAmount, RegionClass } from '../model.js';
import type { Computed } from '../pipeline.js';
import { probeGeometry, type PsiEvaluator, psiEvaluator } from '../solve/point.js';
import type { SolverSpecies } from '../solve/types.js';

/** A verdict, or 'unknown' where the species could not be carried to T (undetermined). */
export type PointVerdict = Verdict | 'unknown';
import { nernstSlope } from '../thermo/constants.js';

export interface Crossing {
  /** Change needed: V for potential, pH units for pH (signed). */
  shift: number;
  /** What lies beyond, with its verdict. */
  to: string;
  verdict: PointVerdict;
  /** The boundary crossed, named by the two species it separates. */
  between: [string, string];
  reaction: string;
}

/**
 * Margin to the runner-up: ψ(runner-up) − ψ(predominant) in kJ per mol of the element, and the
 * change of potential (at this pH) or of pH (at this potential) that closes it on the ψ planes.
 * A shift is null when the margin does not depend on that variable — e.g. no electron transfer
 * between the two (same oxidation state): no potential change reaches the runner-up — with `note`
 * saying why.
 */
export interface Margin {
  kJPerMol: number;
  potentialV: number | null;
  pH: number | null;
  note?: string;
}

export interface ProbeResult {
  pH: number;
  /** Potential at the point, V vs SHE at T. */
  E: number;
  /** The potential as given and its scale, when a reference electrode was named. */
  reference?: { label: string; E: number; offset: number };
  temperature: { celsius: number };
  predominant: string;
  class: RegionClass;
  /** 'unknown' where the predominant species is undetermined at T (no temperature data). */
  verdict: PointVerdict;
  /** Threshold activity (or molality, see `amount`) of dissolved species the verdict refers to. */
  threshold: number;
  /** The dissolved-element amount as the file gives it, with its unit (model.amounts.element). */
  amount?: GivenAmount;
  runnerUp: string | null;
  margin: Margin;
  ligandSpecies: Record<string, string>;
  crossings: { raiseE: Crossing | null; lowerE: Crossing | null; lowerPH: Crossing | null; raisePH: Crossing | null };
  /**
   * Vertical distance `mV`: signed change of E at this pH to the nearer of the boundaries above and
   * below (crossings.raiseE / lowerE). Horizontal distance `pH`: signed change of pH at this E to
   * the nearer of the boundaries at lower and higher pH (crossings.lowerPH / raisePH).
   */
  distance: { mV: number | null; pH: number | null; definition: string };
  /** Shortest distance in the (pH, E) plane, 1 pH counted as the Nernst slope (see `metric`). */
  nearestBoundary: {
    between: [string, string];
    reaction: string;
    equation: string;
    at: { pH: number; E: number };
    distance: { value: number; unit: 'mV'; metric: string };
  } | null;
  /** One sentence: which change of condition crosses first. */
  advice: string;
  /** The diagram's warnings, led by the caveat for this point when its species is undetermined. */
  warnings: string[];
}

/** The verdict of a species at T: 'unknown' when its G could not be carried there. */
function pointVerdict(element: string, sp: SolverSpecies, classes: Record<string, Verdict>): PointVerdict {
  if (sp.temperatureModel === 'undetermined') return 'unknown';
  return verdictOf(classify(element, sp), sp.formula, classes);
}

/**
 * Per system: the ψ evaluator, a scratch array, each species' class and verdict, and what the
 * answer holds that does not depend on the point (threshold amount, metric text), built once.
 */
export interface ProbeContext {
  psi: PsiEvaluator;
  buf: Float64Array;
  classes: RegionClass[];
  verdicts: PointVerdict[];
  amount?: GivenAmount;
  metric: string;
}
const contexts = new WeakMap<Computed, ProbeContext>();

/** The per-system part of the answer (see ProbeContext), built on first use and kept with `c`. */
export function contextOf(c: Computed): ProbeContext {
  let ctx = contexts.get(c);
  if (!ctx) {
    const input = c.built.input;
    const classes = input.species.map((sp) => classify(input.element, sp));
    ctx = {
      psi: psiEvaluator(input),
      buf: new Float64Array(input.species.length),
      classes,
      verdicts: input.species.map((sp) => pointVerdict(input.element, sp, c.spec.operating.classes)),
      amount: c.model.amounts ? thresholdAmount(c) : undefined,
      metric: metricText(input.kelvin),
    };
    contexts.set(c, ctx);
  }
  return ctx;
}

/** Index of the smallest ψ (the first on a tie). */
export function argmin(psi: Float64Array): number {
  let k = 0;
  for (let i = 1; i < psi.length; i++) if (psi[i] < psi[k]) k = i;
  return k;
}

export function probe(c: Computed, pH: number, E: number, ref?: { label: string; E: number; offset: number }): ProbeResult {
  const input = c.built.input;
  const ctx = contextOf(c);
  const psi = ctx.buf;
  const ligandSpecies = { ...ctx.psi(pH, E, psi) };
  // Predominant (smallest ψ) and runner-up (next; ties go to the lower index, as a stable sort).
  const k1 = argmin(psi);
  let k2 = -1;
  for (let i = 0; i < psi.length; i++) if (i !== k1 && (k2 < 0 || psi[i] < psi[k2])) k2 = i;
  const best = input.species[k1];
  const second = k2 >= 0 ? input.species[k2] : null;
  const marginKJ = k2 >= 0 ? psi[k2] - psi[k1] : 0;
  const margin: Margin = second ? marginShifts(ctx, pH, E, k1, k2, marginKJ) : { kJPerMol: 0, potentialV: null, pH: null };
  if (second && margin.potentialV === null && margin.pH === null && !movesWithActivity(best, input.element) && !movesWithActivity(second, input.element)) {
    margin.note = FIXED_ORDER_NOTE;
  }
  const winnerAt = (x: number, y: number) => {
    ctx.psi(x, y, psi);
    const k = argmin(psi);
    return { formula: input.species[k].formula, verdict: ctx.verdicts[k] };
  };
  const g = probeGeometry(c.model.boundaries, pH, E, input.kelvin);
  const cross = (x: { shift: number; boundary: { between: [string, string]; reaction: string } } | undefined, dx: number, dy: number): Crossing | null => {
    if (!x) return null;
    // Just beyond the boundary (0.05 mV or 0.001 pH further).
    const w = winnerAt(pH + dx * (x.shift + Math.sign(x.shift) * 1e-3), E + dy * (x.shift + Math.sign(x.shift) * 5e-5));
    return { shift: x.shift, to: w.formula, verdict: w.verdict, between: x.boundary.between, reaction: x.boundary.reaction };
  };
  const crossings = {
    raiseE: cross(g.up, 0, 1),
    lowerE: cross(g.down, 0, 1),
    lowerPH: cross(g.left, 1, 0),
    raisePH: cross(g.right, 1, 0),
  };
  const nearestE = nearerShift(g.up?.shift, g.down?.shift);
  const nearestP = nearerShift(g.left?.shift, g.right?.shift);
  const cls = ctx.classes[k1];
  const verdict = ctx.verdicts[k1];
  const warnings = [...c.model.warnings];
  if (verdict === 'unknown') {
    warnings.unshift(`no verdict here: ${best.formula} cannot be carried to ${c.model.temperature.celsius} °C (only ΔfG° given); its field is placed with its 25 °C ΔfG°`);
  }
  const nb = g.nearest?.boundary;
  const r: ProbeResult = {
    pH,
    E,
    temperature: { celsius: c.model.temperature.celsius },
    predominant: best.formula,
    class: cls,
    verdict,
    threshold: c.model.activity,
    ...(ctx.amount ? { amount: ctx.amount } : {}),
    runnerUp: second ? second.formula : null,
    margin,
    ligandSpecies,
    crossings,
    distance: { mV: nearestE === null ? null : nearestE * 1000, pH: nearestP, definition: DISTANCE_DEFINITION },
    nearestBoundary: nb ? nearestOf(g.nearest!, ctx.metric) : null,
    advice: '',
    warnings,
  };
  if (ref) r.reference = ref;
  r.advice = advice(r);
  return r;
}

/**
 * The shifts that close the margin: ψ is a plane in (pH, E) within a ligand cell, so the margin
 * changes by its slope times the shift; slopes from a 1 mV and a 0.001 pH step. A slope below
 * 0.01 kJ/mol per V (about 1e-4 electrons per atom) or per pH counts as none.
 */
function marginShifts(ctx: ProbeContext, pH: number, E: number, i: number, j: number, m: number): Margin {
  const hE = 1e-3;
  const hP = 1e-3;
  const buf = ctx.buf;
  ctx.psi(pH, E + hE, buf);
  const slopeE = (buf[j] - buf[i] - m) / hE;
  ctx.psi(pH + hP, E, buf);
  const slopeP = (buf[j] - buf[i] - m) / hP;
  const potentialV = Math.abs(slopeE) > 0.01 ? -m / slopeE : null;
  const dpH = Math.abs(slopeP) > 0.01 ? -m / slopeP : null;
  const out: Margin = { kJPerMol: m, potentialV, pH: dpH };
  if (potentialV === null && dpH === null) out.note = 'no change of potential or pH alone reaches the runner-up (no electron or H+ exchanged with it; it depends on the ligand or dissolved activities)';
  else if (potentialV === null) out.note = 'the runner-up is reached without electron transfer (same oxidation state): no change of potential reaches it, only a change of pH';
  else if (dpH === null) out.note = 'the runner-up is reached without H+ or OH- exchange: no change of pH reaches it, only a change of potential';
  return out;
}

/**
 * Whether a species' ψ moves with an activity the file sets: a dissolved or gaseous species (its
 * own activity or pressure) or one holding a ligand (neither the element, H nor O). Between two
 * species that do not (pure solids or liquids of the element and water, e.g. NiO and Ni(OH)₂) the
 * margin is fixed at a given temperature.
 */
function movesWithActivity(sp: SolverSpecies, element: string): boolean {
  return sp.phase === 'aq' || sp.phase === 'g' || Object.keys(sp.elements).some((e) => e !== element && e !== 'H' && e !== 'O');
}

/** The margin note between two such species (no shift of pH, E or activity closes the margin). */
const FIXED_ORDER_NOTE =
  'no change of potential, pH or activity reaches the runner-up: both are pure phases exchanging no electron, H+ or ligand with each other (the difference is water), so their order changes only with temperature';

/** The element's amount; the default threshold read as a molality (ionic strength given) says so. */
function thresholdAmount(c: Computed): GivenAmount {
  const a = c.model.amounts!.element;
  const molal = c.model.species.some((x) => x.role === 'main' && x.molality !== undefined);
  return a.kind === 'activity' && a.isDefault && molal ? { kind: 'molality', value: a.value, molality: a.value, isDefault: true } : a;
}

/** The smaller in size of two signed shifts (the first on a tie), or null when neither exists. */
function nearerShift(a: number | undefined, b: number | undefined): number | null {
  if (a === undefined) return b ?? null;
  return b !== undefined && Math.abs(b) < Math.abs(a) ? b : a;
}

/** What `distance.mV` and `distance.pH` are, stated in the JSON answer beside them. */
const DISTANCE_DEFINITION =
  'mV: vertical distance (change of E at this pH) to the nearer boundary above or below; pH: horizontal distance (change of pH at this potential) to the nearer boundary at lower or higher pH; null: no boundary that way within the diagram';

/** The metric of the nearest-boundary distance at T (kelvin), in words. */
function metricText(kelvin: number): string {
  const s = nernstSlope(kelvin) * 1000;
  return `shortest distance in the (pH, E) plane, 1 pH counted as ${s.toFixed(2)} mV (RT ln10/F at T)`;
}

/** The nearest boundary in the plane, with its metric stated. */
function nearestOf(n: NonNullable<ReturnType<typeof probeGeometry>['nearest']>, metric: string): NonNullable<ProbeResult['nearestBoundary']> {
  const b = n.boundary;
  return {
    between: b.between,
    reaction: b.reaction,
    equation: b.equation,
    at: { pH: n.at[0], E: n.at[1] },
    distance: { value: n.distanceV * 1000, unit: 'mV', metric },
  };
}

function advice(r: ProbeResult): string {
  const a = adviceOfResult(r);
  return adviceText(a.k, a.shift, a.to, a.verdict);
}

/** The advice's parts (adviceChoice's k, the signed shift, the species and verdict beyond). */
export interface AdviceParts {
  k: number;
  shift: number;
  to: string;
  verdict: PointVerdict;
}

/** The advice parts of a full probe result (its `advice` is adviceText of them). */
export function adviceOfResult(r: ProbeResult): AdviceParts {
  const c = r.crossings;
  const k = adviceChoice(c.raiseE?.shift, c.lowerE?.shift, c.lowerPH?.shift, c.raisePH?.shift);
  const x = k === 0 ? c.raiseE : k === 1 ? c.lowerE : k === 2 ? c.lowerPH : c.raisePH;
  return { k, shift: x?.shift ?? 0, to: x?.to ?? '', verdict: x?.verdict ?? 'unknown' };
}

/**
 * Which change of condition the advice names: 0 raise E, 1 lower E, 2 lower pH, 3 raise pH (the
 * signed shifts to the boundaries, undefined where there is none), or -1 when there is none. A
 * potential change is compared with a pH change on the Nernst scale (59 mV ≈ 1 pH unit at 25 °C);
 * the smallest change wins (the first listed on a tie).
 */
export function adviceChoice(raiseE: number | undefined, lowerE: number | undefined, lowerPH: number | undefined, raisePH: number | undefined): number {
  const s0 = raiseE !== undefined ? Math.abs(raiseE) / 0.059 : Infinity;
  const s1 = lowerE !== undefined ? Math.abs(lowerE) / 0.059 : Infinity;
  const s2 = lowerPH !== undefined ? Math.abs(lowerPH) : Infinity;
  const s3 = raisePH !== undefined ? Math.abs(raisePH) : Infinity;
  let k = -1;
  let best = Infinity;
  if (s0 !== Infinity) (k = 0), (best = s0);
  if (s1 !== Infinity && (k < 0 || s1 < best)) (k = 1), (best = s1);
  if (s2 !== Infinity && (k < 0 || s2 < best)) (k = 2), (best = s2);
  if (s3 !== Infinity && (k < 0 || s3 < best)) k = 3;
  return k;
}

/** The advice when no boundary is met along E or pH. */
export const ADVICE_NONE = 'No boundary within the diagram along E or pH from this point.';
/** The advice sentence's words before the shift and after it, per choice k (adviceChoice). */
export const ADVICE_HEAD = ['Nearest change: raising the potential by ', 'Nearest change: lowering the potential by ', 'Nearest change: lowering the pH by ', 'Nearest change: raising the pH by '] as const;
export const ADVICE_AFTER_SHIFT = [' mV reaches ', ' mV reaches ', ' reaches ', ' reaches '] as const;

/** The shift as the advice prints it: mV without decimals for E (k 0, 1), pH to 2 decimals, sign dropped. */
export function adviceShiftText(k: number, shift: number): string {
  return k === 0 ? (shift * 1000).toFixed(0) : k === 1 ? (-shift * 1000).toFixed(0) : k === 2 ? (-shift).toFixed(2) : shift.toFixed(2);
}

/**
 * The advice sentence for choice `k` (adviceChoice): the shift, and the species and verdict beyond.
 * Example: adviceText(2, −0.3055, "Fe^2+", "corrosion") → "Nearest change: lowering the pH by 0.31
 * reaches Fe^2+ (corrosion)."
 */
export function adviceText(k: number, shift: number, to: string, verdict: PointVerdict): string {
  if (k < 0) return ADVICE_NONE;
  return `${ADVICE_HEAD[k]}${adviceShiftText(k, shift)}${ADVICE_AFTER_SHIFT[k]}${to} (${verdict}).`;
}
