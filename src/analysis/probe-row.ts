/**
 * The answer at one point reduced to what a row of a logged series prints (`probe --points`),
 * computed without building the whole ProbeResult: every field equal, bit for bit, to the same
 * field of `probe()` (probe.ts) at the same point — tests/analysis/probe-row.test.ts checks that on
 * a sweep of points for every library element.
 *
 * Steps (the same arithmetic as probe(), in the same order, on the same per-system context):
 *  1. ψ of every species at the point: predominant (argmin, first on a tie), runner-up (next
 *     smallest, lower index on a tie) and the margin ψ₂ − ψ₁ in kJ per mol of the element;
 *  2. the crossings of the vertical and horizontal lines with the exact boundaries and the nearest
 *     boundary (solve/point.ts geometryHits, into a scratch record: nothing allocated per row);
 *  3. the vertical and horizontal distances (the nearer of the two shifts each way);
 *  4. the advice: the smallest change on the Nernst scale (probe.ts adviceChoice), and the species
 *     just beyond that one boundary only (probe() finds it beyond all four);
 *  5. the warnings: the model's, led by the caveat when the predominant species is undetermined
 *     (one array per system and species, kept).
 * The runner-up shifts of the margin (probe.ts marginShifts) and the crossing records are not
 * printed in a row, so they are not computed here.
 */
import type { Computed } from '../pipeline.js';
import { geometryHits, newGeometryHits } from '../solve/point.js';
import { adviceChoice, type AdviceParts, adviceText, argmin, contextOf, type PointVerdict, type ProbeContext } from './probe.js';

/** The printed fields of probe() at one point (names as in ProbeResult, flattened). */
export interface RowProbe {
  /** ProbeResult.predominant, .verdict, .runnerUp. */
  predominant: string;
  verdict: PointVerdict;
  runnerUp: string | null;
  /** ProbeResult.margin.kJPerMol. */
  marginKJ: number;
  /** ProbeResult.distance.mV and .pH. */
  distanceMV: number | null;
  distancePH: number | null;
  /** ProbeResult.nearestBoundary?.reaction (null when there is no boundary). */
  nearestReaction: string | null;
  /** ProbeResult.advice as its parts (adviceOf gives the sentence; a row writes it part by part). */
  advice: AdviceParts;
  /** ProbeResult.warnings (shared: never modify). */
  warnings: readonly string[];
  /** ProbeResult.temperature.celsius. */
  celsius: number;
}

export function newRowProbe(): RowProbe {
  return { predominant: '', verdict: 'unknown', runnerUp: null, marginKJ: 0, distanceMV: null, distancePH: null, nearestReaction: null, advice: { k: -1, shift: 0, to: '', verdict: 'unknown' }, warnings: [], celsius: 0 };
}

/** The advice sentence of a row (probe.ts adviceText; equal to ProbeResult.advice). */
export function adviceOf(a: AdviceParts): string {
  return adviceText(a.k, a.shift, a.to, a.verdict);
}

/** Per system: probe()'s context and the warnings per predominant species (built when first met). */
interface RowContext {
  c: Computed;
  ctx: ProbeContext;
  warnings: (readonly string[] | undefined)[];
}

const hits = newGeometryHits();
let last: RowContext | undefined;
/** One context per system, kept while the system is (a log moving between conditions reuses them). */
const contexts = new WeakMap<Computed, RowContext>();

function rowContext(c: Computed): RowContext {
  if (last?.c === c) return last;
  let r = contexts.get(c);
  if (r === undefined) contexts.set(c, (r = { c, ctx: contextOf(c), warnings: [] }));
  last = r;
  return r;
}

/** Step 5: probe()'s warnings for predominant species `k`. */
function warningsFor(r: RowContext, k: number): readonly string[] {
  let w = r.warnings[k];
  if (w === undefined) {
    const model = r.c.model;
    const all = [...model.warnings];
    if (r.ctx.verdicts[k] === 'unknown') {
      all.unshift(`no verdict here: ${r.c.built.input.species[k].formula} cannot be carried to ${model.temperature.celsius} °C (only ΔfG° given); its field is placed with its 25 °C ΔfG°`);
    }
    r.warnings[k] = w = all;
  }
  return w;
}

/** The printed fields of probe(c, pH, E) into `out` (see the module comment). */
export function probeRow(c: Computed, pH: number, E: number, out: RowProbe): RowProbe {
  const r = rowContext(c);
  const ctx = r.ctx;
  const species = c.built.input.species;
  const psi = ctx.buf;
  // Step 1.
  ctx.psi(pH, E, psi);
  const k1 = argmin(psi);
  let k2 = -1;
  for (let i = 0; i < psi.length; i++) if (i !== k1 && (k2 < 0 || psi[i] < psi[k2])) k2 = i;
  out.predominant = species[k1].formula;
  out.verdict = ctx.verdicts[k1];
  out.runnerUp = k2 >= 0 ? species[k2].formula : null;
  out.marginKJ = k2 >= 0 ? psi[k2] - psi[k1] : 0;
  // Step 2.
  const boundaries = c.model.boundaries;
  const g = geometryHits(boundaries, pH, E, c.built.input.kelvin, hits);
  // Step 3.
  const up = g.bUp >= 0 ? g.up : undefined;
  const down = g.bDown >= 0 ? g.down : undefined;
  const left = g.bLeft >= 0 ? g.left : undefined;
  const right = g.bRight >= 0 ? g.right : undefined;
  const nearestE = nearerShift(up, down);
  out.distanceMV = nearestE === null ? null : nearestE * 1000;
  out.distancePH = nearerShift(left, right);
  out.nearestReaction = g.bNear >= 0 ? boundaries[g.bNear].reaction : null;
  // Step 4: just beyond the chosen boundary (0.05 mV or 0.001 pH further), as probe() steps.
  const k = adviceChoice(up, down, left, right);
  const a = out.advice;
  a.k = k;
  if (k < 0) (a.shift = 0), (a.to = ''), (a.verdict = 'unknown');
  else {
    const shift = k === 0 ? up! : k === 1 ? down! : k === 2 ? left! : right!;
    const dx = k < 2 ? 0 : 1;
    const dy = k < 2 ? 1 : 0;
    ctx.psi(pH + dx * (shift + Math.sign(shift) * 1e-3), E + dy * (shift + Math.sign(shift) * 5e-5), psi);
    const w = argmin(psi);
    a.shift = shift;
    a.to = species[w].formula;
    a.verdict = ctx.verdicts[w];
  }
  // Step 5.
  out.warnings = warningsFor(r, k1);
  out.celsius = c.model.temperature.celsius;
  return out;
}

/** The smaller in size of two signed shifts (the first on a tie), or null when neither exists (as probe.ts). */
function nearerShift(a: number | undefined, b: number | undefined): number | null {
  if (a === undefined) return b ?? null;
  return b !== undefined && Math.abs(b) < Math.abs(a) ? b : a;
}
