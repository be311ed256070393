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
import { probeGeometry, psiAt } from '../solve/point.js';
import type { SolverSpecies } from '../solve/types.js';

/** A verdict, or 'unknown' where the species could not be carried to T (undetermined). */
export type PointVerdict = Verdict | 'unknown';

export interface Crossing {
  /** Change needed: V for potential, pH units for pH (signed). */
  shift: number;
  /** What lies beyond, with its verdict. */
  to: string;
  verdict: PointVerdict;
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
  /** 'unknown' where the predominant species is undetermined at T (no temperature data). */
  verdict: PointVerdict;
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
  /** The diagram's warnings, led by the caveat for this point when its species is undetermined. */
  warnings: string[];
}

/** The verdict of a species at T: 'unknown' when its G could not be carried there. */
function pointVerdict(element: string, sp: SolverSpecies, classes: Record<string, Verdict>): PointVerdict {
  if (sp.temperatureModel === 'undetermined') return 'unknown';
  return verdictOf(classify(element, sp), sp.formula, classes);
}

export function probe(c: Computed, pH: number, E: number, ref?: { label: string; E: number; offset: number }): ProbeResult {
  const input = c.built.input;
  const classes = c.spec.operating.classes;
  const { psi, ligandSpecies } = psiAt(input, pH, E);
  const order = psi.map((v, k) => [v, k] as const).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const best = input.species[order[0][1]];
  const second = order.length > 1 ? input.species[order[1][1]] : null;
  const marginKJ = order.length > 1 ? order[1][0] - order[0][0] : 0;
  let potentialV: number | null = null;
  if (second) {
    const h = 1e-4;
    const a = psiAt(input, pH, E + h).psi;
    const slope = (a[order[1][1]] - a[order[0][1]] - marginKJ) / h;
    potentialV = Math.abs(slope) > 1e-12 ? -marginKJ / slope : null;
  }
  const winnerAt = (x: number, y: number) => {
    const p = psiAt(input, x, y).psi;
    const k = p.indexOf(Math.min(...p));
    const sp = input.species[k];
    return { formula: sp.formula, verdict: pointVerdict(input.element, sp, classes) };
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
  const cls = classify(input.element, best);
  const verdict = pointVerdict(input.element, best, classes);
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
    runnerUp: second ? second.formula : null,
    margin: { kJPerMol: marginKJ, potentialV },
    ligandSpecies,
    crossings,
    distance: { mV: nearestE === null ? null : nearestE * 1000, pH: nearestP },
    nearestBoundary: nb ? { between: nb.between, reaction: nb.reaction, equation: nb.equation, distanceMV: g.nearest!.distanceV * 1000 } : null,
    advice: '',
    warnings,
  };
  if (ref) r.reference = ref;
  r.advice = advice(r);
  return r;
}

function advice(r: ProbeResult): string {
  const opts: { size: number; text: string }[] = [];
  const c = r.crossings;
  // Compare a potential change with a pH change on the Nernst scale (59 mV ≈ 1 pH unit at 25 °C).
  if (c.raiseE) opts.push({ size: Math.abs(c.raiseE.shift) / 0.059, text: `raising the potential by ${(c.raiseE.shift * 1000).toFixed(0)} mV reaches ${c.raiseE.to} (${c.raiseE.verdict})` });
  if (c.lowerE) opts.push({ size: Math.abs(c.lowerE.shift) / 0.059, text: `lowering the potential by ${(-c.lowerE.shift * 1000).toFixed(0)} mV reaches ${c.lowerE.to} (${c.lowerE.verdict})` });
  if (c.lowerPH) opts.push({ size: Math.abs(c.lowerPH.shift), text: `lowering the pH by ${(-c.lowerPH.shift).toFixed(2)} reaches ${c.lowerPH.to} (${c.lowerPH.verdict})` });
  if (c.raisePH) opts.push({ size: Math.abs(c.raisePH.shift), text: `raising the pH by ${c.raisePH.shift.toFixed(2)} reaches ${c.raisePH.to} (${c.raisePH.verdict})` });
  if (!opts.length) return 'No boundary within the diagram along E or pH from this point.';
  opts.sort((a, b) => a.size - b.size);
  return `Nearest change: ${opts[0].text}.`;
}
