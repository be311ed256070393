/**
 * The `probe` report: the answer at one operating point, evaluated exactly from the ψ planes —
 * predominant species and its verdict (immunity / passivation / corrosion at the threshold
 * activity), runner-up and margin, the nearest boundary, the distance to it in mV (at fixed pH) and
 * in pH units (at fixed E), and which change of condition would cross it.
 */
import { classify } from '../diagram/classify.js';
import { type Verdict, verdictOf } from '../diagram/verdict.js';
import type { RegionClass } from '../model.js';
import type { Computed } from '../pipeline.js';
import { probeGeometry, type PsiEvaluator, psiEvaluator } from '../solve/point.js';

export interface Crossing {
  /** Change needed: V for potential, pH units for pH (signed). */
  shift: number;
  /** What lies beyond, with its verdict. */
  to: string;
  verdict: Verdict;
  reaction: string;
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
  verdict: Verdict;
  /** Threshold activity of dissolved species the verdict refers to. */
  threshold: number;
  runnerUp: string | null;
  margin: { kJPerMol: number; potentialV: number | null };
  ligandSpecies: Record<string, string>;
  crossings: { raiseE: Crossing | null; lowerE: Crossing | null; lowerPH: Crossing | null; raisePH: Crossing | null };
  /** Distance to the nearest boundary: mV along E at this pH, pH units along pH at this E. */
  distance: { mV: number | null; pH: number | null };
  nearestBoundary: { between: [string, string]; reaction: string; equation: string; distanceMV: number } | null;
  /** One sentence: which change of condition crosses first. */
  advice: string;
}

/** Per system: the ψ evaluator, a scratch array and each species' class and verdict (built once). */
interface ProbeContext {
  psi: PsiEvaluator;
  buf: Float64Array;
  classes: RegionClass[];
  verdicts: Verdict[];
}
const contexts = new WeakMap<Computed, ProbeContext>();

function contextOf(c: Computed): ProbeContext {
  let ctx = contexts.get(c);
  if (!ctx) {
    const input = c.built.input;
    const classes = input.species.map((sp) => classify(input.element, sp));
    ctx = {
      psi: psiEvaluator(input),
      buf: new Float64Array(input.species.length),
      classes,
      verdicts: input.species.map((sp, k) => verdictOf(classes[k], sp.formula, c.spec.operating.classes)),
    };
    contexts.set(c, ctx);
  }
  return ctx;
}

/** Index of the smallest ψ (the first on a tie). */
function argmin(psi: Float64Array): number {
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
  let potentialV: number | null = null;
  if (second) {
    const h = 1e-4;
    ctx.psi(pH, E + h, psi);
    const slope = (psi[k2] - psi[k1] - marginKJ) / h;
    potentialV = Math.abs(slope) > 1e-12 ? -marginKJ / slope : null;
  }
  const winnerAt = (x: number, y: number) => {
    ctx.psi(x, y, psi);
    const k = argmin(psi);
    return { formula: input.species[k].formula, verdict: ctx.verdicts[k] };
  };
  const g = probeGeometry(c.model.boundaries, pH, E, input.kelvin);
  const cross = (x: { shift: number; boundary: { reaction: string } } | undefined, dx: number, dy: number): Crossing | null => {
    if (!x) return null;
    // Just beyond the boundary (0.05 mV or 0.001 pH further).
    const w = winnerAt(pH + dx * (x.shift + Math.sign(x.shift) * 1e-3), E + dy * (x.shift + Math.sign(x.shift) * 5e-5));
    return { shift: x.shift, to: w.formula, verdict: w.verdict, reaction: x.boundary.reaction };
  };
  const crossings = {
    raiseE: cross(g.up, 0, 1),
    lowerE: cross(g.down, 0, 1),
    lowerPH: cross(g.left, 1, 0),
    raisePH: cross(g.right, 1, 0),
  };
  const dE = [g.up?.shift, g.down?.shift].filter((v): v is number => v !== undefined);
  const dP = [g.left?.shift, g.right?.shift].filter((v): v is number => v !== undefined);
  const nearestE = dE.length ? dE.reduce((a, b) => (Math.abs(b) < Math.abs(a) ? b : a)) : null;
  const nearestP = dP.length ? dP.reduce((a, b) => (Math.abs(b) < Math.abs(a) ? b : a)) : null;
  const cls = ctx.classes[k1];
  const verdict = ctx.verdicts[k1];
  const nb = g.nearest?.boundary;
  const r: ProbeResult = {
    pH,
    E,
    temperature: { celsius: c.model.temperature.celsius },
    predominant: best.formula,
    class: cls,
    verdict,
    threshold: c.model.activity,
    runnerUp: second ? second.formula : null,
    margin: { kJPerMol: marginKJ, potentialV },
    ligandSpecies,
    crossings,
    distance: { mV: nearestE === null ? null : nearestE * 1000, pH: nearestP },
    nearestBoundary: nb ? { between: nb.between, reaction: nb.reaction, equation: nb.equation, distanceMV: g.nearest!.distanceV * 1000 } : null,
    advice: '',
  };
  if (ref) r.reference = ref;
  r.advice = advice(r);
  return r;
}

function advice(r: ProbeResult): string {
  const c = r.crossings;
  // Compare a potential change with a pH change on the Nernst scale (59 mV ≈ 1 pH unit at 25 °C);
  // the smallest change wins (the first listed on a tie).
  const sizes = [c.raiseE ? Math.abs(c.raiseE.shift) / 0.059 : Infinity, c.lowerE ? Math.abs(c.lowerE.shift) / 0.059 : Infinity, c.lowerPH ? Math.abs(c.lowerPH.shift) : Infinity, c.raisePH ? Math.abs(c.raisePH.shift) : Infinity];
  let k = -1;
  for (let i = 0; i < 4; i++) if (sizes[i] !== Infinity && (k < 0 || sizes[i] < sizes[k])) k = i;
  if (k < 0) return 'No boundary within the diagram along E or pH from this point.';
  let text: string;
  if (k === 0) text = `raising the potential by ${(c.raiseE!.shift * 1000).toFixed(0)} mV reaches ${c.raiseE!.to} (${c.raiseE!.verdict})`;
  else if (k === 1) text = `lowering the potential by ${(-c.lowerE!.shift * 1000).toFixed(0)} mV reaches ${c.lowerE!.to} (${c.lowerE!.verdict})`;
  else if (k === 2) text = `lowering the pH by ${(-c.lowerPH!.shift).toFixed(2)} reaches ${c.lowerPH!.to} (${c.lowerPH!.verdict})`;
  else text = `raising the pH by ${c.raisePH!.shift.toFixed(2)} reaches ${c.raisePH!.to} (${c.raisePH!.verdict})`;
  return `Nearest change: ${text}.`;
}
