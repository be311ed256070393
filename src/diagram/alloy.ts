/**
 * Alloy diagrams (issue 18), the model: assemblage regions traced with the generic machinery of
 * src/solve/trace over the field of alloy-field.ts, boundaries with the balanced reaction between
 * the two assemblages (alloy-reaction.ts), triple points joined. Same DiagramModel contract as the
 * other kinds, plus `kind: 'alloy'`, `alloy` (composition, activities) and, per region, `assemblage`,
 * `alloyVerdict` and `dissolving`. Deterministic: the same spec gives the same JSON.
 *
 * Steps:
 *  1. the alloy input (src/system/alloy-build.ts);
 *  2. assemblages discovered by the LP at every grid node, the field over them, the grid sampled;
 *  3. without ligands: exact convex regions by half-plane clipping of the assemblages' G planes
 *     (alloy-exact.ts; boundaries and triple points exact to rounding); with ligands: regions and
 *     boundaries traced, vertices refined by regula falsi to 1e-8 of a cell (the margin is a
 *     difference of piecewise-linear ψ' sums), triple points joined;
 *  4. per region its assemblage (assemblageAt at an inside point), verdict and fill class:
 *     immune → metal, passive → solid, corroding → dissolved, partly corroding → its own group;
 *  5. per boundary the reaction and line; the LP is asked at its midpoint whether some assemblage
 *     the grid missed is lower there (a warning names it).
 */
import type { BoundaryModel, DiagramModel, RegionClass, RegionModel, SpeciesSummary } from '../model.js';
import { supportAt } from '../solve/alloy/assemblage.js';
import { speciesPotentialsAt } from '../solve/alloy/psi.js';
import { isDissolved, memberText } from '../solve/alloy/member.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import { type AlloyVerdict, assemblageVerdict } from '../solve/alloy/verdict.js';
import { waterLines } from '../solve/solve.js';
import { joinTriplePoints } from '../solve/trace/junctions.js';
import { type TracedBoundary, traceRegions } from '../solve/trace/regions.js';
import type { SolverInput } from '../solve/types.js';
import type { AlloySpec } from '../system/alloy-spec.js';
import { amountNumber, givenAmounts } from '../system/amounts.js';
import { type BuiltAlloy, buildAlloySystem } from '../system/alloy-build.js';
import { KELVIN } from '../thermo/constants.js';
import { VERSION } from '../version.js';
import { exactAlloyRegions, type ExactAlloy } from './alloy-exact.js';
import { alloyField, alloyGrid, type AlloyLabel, discoverAssemblages } from './alloy-field.js';
import { assemblageReaction } from './alloy-reaction.js';
import type { Verdict } from './verdict.js';

export interface AlloyOptions {
  /** Nodes per axis (default: the spec's grid). */
  grid?: number;
}

export interface ComputedAlloy {
  spec: AlloySpec;
  built: BuiltAlloy;
  labels: AlloyLabel[];
  model: DiagramModel;
}

/** Fill class of each alloy verdict (partly corroding gets the fourth tint group). */
export const ALLOY_CLASS: Record<AlloyVerdict, RegionClass> = { immune: 'element', passive: 'solid', corroding: 'dissolved', 'partly-corroding': 'gas' };
/** The trade verdict of each alloy verdict (partly corroding is corrosion of the dissolving element). */
const TRADE: Record<AlloyVerdict, Verdict> = { immune: 'immunity', passive: 'passivation', corroding: 'corrosion', 'partly-corroding': 'corrosion' };

/** Short name of an alloy, e.g. "Fe–Cr–Ni". */
export function alloyName(composition: Record<string, number>): string {
  return Object.keys(composition).join('\u2013');
}

export function computeAlloy(spec: AlloySpec, opts: AlloyOptions = {}): ComputedAlloy {
  // Step 1.
  const built = buildAlloySystem(spec);
  const input = built.input;
  const n = opts.grid ?? spec.base.grid;
  const { pH, E } = spec.base;
  // Step 2 (with step 5's check fed back: an assemblage found lower than both sides of a traced
  // boundary joins the labels and the trace is redone, at most three times).
  const { labels, psi } = discoverAssemblages(input, pH, E, n);
  let traced = traceAlloy(input, labels, psi, pH, E, n);
  for (let round = 0; round < 3; round++) {
    const extra = missedLabels(input, labels, traced.boundaries);
    if (!extra.length) break;
    labels.push(...extra);
    traced = traceAlloy(input, labels, psi, pH, E, n);
  }
  const warnings = [...built.warnings];
  // Step 4.
  const regions: RegionModel[] = traced.regions.map((r) => regionModel(input, labels[r.label], r.polygons, r.area));
  // Step 5.
  const boundaries: BoundaryModel[] = traced.boundaries.map((b) => {
    const [i, j] = b.between;
    const mid = b.points[Math.floor(b.points.length / 2)];
    const missed = missedAt(input, labels, [i, j], mid);
    if (missed) warnings.push(`alloy: near pH ${mid[0].toFixed(2)}, E ${mid[1].toFixed(3)} V the assemblage ${labelText(input, missed)} is lower than both sides of a traced boundary; raise the grid`);
    const rx = assemblageReaction(input, labels[i], labels[j], mid);
    return {
      between: [labelText(input, labels[i]), labelText(input, labels[j])],
      ligandSpecies: rx.terms.filter((t) => input.ligands.some((L) => L.species.some((s) => s.formula === t.formula))).map((t) => t.formula),
      reaction: rx.text,
      equation: rx.equation,
      line: rx.line,
      points: b.points,
    };
  });
  const triples = traced.triples;
  const els = Object.keys(input.composition);
  // Ligand totals as the single-element model gives them: the number used (activity, or molality from
  // mg/L at the water's density), with the amount as written kept in `amounts` for captions.
  const amounts = givenAmounts(spec.base, built.solution.water.density);
  const model: DiagramModel = {
    kind: 'alloy',
    ephmap: VERSION,
    element: alloyName(input.composition),
    temperature: { celsius: Math.round((input.kelvin - KELVIN) * 1e6) / 1e6, kelvin: input.kelvin },
    units: { pH: 'pH (molal activity scale)', E: 'V vs SHE at the diagram temperature', G: 'kJ/mol', area: 'pH·V', amount: 'mol per mol of alloy atoms' },
    domain: { pH, E },
    activity: Math.min(...els.map((e) => spec.activities[e])),
    ligands: Object.fromEntries(Object.entries(amounts.ligands).map(([k, a]) => [k, amountNumber(a)])),
    amounts,
    species: input.species.map((sp) => summary(els, sp)),
    regions,
    boundaries,
    triplePoints: triples.map((t) => ({ species: t.labels.map((k) => labelText(input, labels[k])), pH: t.x, E: t.y })),
    waterLines: { ...waterLines({ ...input, element: els[0] } as SolverInput), pressures: input.pressures },
    warnings: [...new Set(warnings)],
    sources: built.sources,
    alloy: { composition: { ...input.composition }, activities: { ...spec.activities }, grid: { nx: n, ny: n } },
  };
  return { spec, built, labels, model };
}

/** Steps 2–3: grid, regions, boundaries and triple points over the given labels. */
function traceAlloy(input: AlloyInput, labels: readonly AlloyLabel[], psi: number[][], pH: [number, number], E: [number, number], n: number): ExactAlloy {
  // No ligands: every assemblage's grand potential is a plane, and the regions are exact convex
  // polygons (alloy-exact.ts). With ligands: traced on the grid and refined.
  if (input.ligands.length === 0) return exactAlloyRegions(input, labels, pH, E);
  const field = alloyField(input, labels);
  const g = alloyGrid(labels, psi, pH, E, n);
  const traced = traceRegions(field, g);
  return { ...traced, triples: joinTriplePoints(field, g, traced.boundaries) };
}

/** Assemblages lower than both sides at some traced boundary's midpoint (new labels, deduplicated). */
function missedLabels(input: AlloyInput, labels: readonly AlloyLabel[], boundaries: readonly TracedBoundary[]): AlloyLabel[] {
  const out: AlloyLabel[] = [];
  for (const b of boundaries) {
    const m = missedAt(input, labels, b.between, b.points[Math.floor(b.points.length / 2)]);
    if (m && !labels.some((l) => l.key === m.key) && !out.some((l) => l.key === m.key)) out.push(m);
  }
  return out;
}

/** "Cr2O3 + Fe3O4 + Ni": the assemblage's members in the order of the species list (a neutral
 *  dissolved one tagged, "Cu + Zn(OH)2(aq)": solve/alloy/member.ts). */
export function labelText(input: AlloyInput, l: { indices: number[] }): string {
  return l.indices.map((k) => memberText(input.species[k])).join(' + ');
}

/** Step 4: the region of one assemblage, its verdict from its phases and their shares. */
function regionModel(input: AlloyInput, l: AlloyLabel, polygons: [number, number][][][], area: number): RegionModel {
  const els = Object.keys(input.composition);
  const { verdict, dissolving } = assemblageVerdict(
    l.indices.map((k, i) => {
      const sp = input.species[k];
      const share = Object.fromEntries(els.map((e) => [e, (l.amounts[i] * (sp.elements[e] ?? 0)) / input.composition[e]]));
      return { formula: sp.formula, phase: sp.phase, elements: sp.elements, charge: sp.charge, share };
    }),
    els,
  );
  const phases = l.indices.map((k) => input.species[k]);
  const cls = ALLOY_CLASS[verdict];
  return {
    species: labelText(input, l),
    phase: phases.some((p) => p.phase === 's' || p.phase === 'l') ? 's' : phases.some((p) => p.phase === 'g') ? 'g' : 'aq',
    class: cls,
    verdict: TRADE[verdict],
    polygons,
    area,
    assemblage: l.indices.map((k, i) => ({ species: input.species[k].formula, phase: input.species[k].phase, amount: round(l.amounts[i]), dissolved: isDissolved(input.species[k]) })),
    alloyVerdict: verdict,
    dissolving,
  };
}

/** Step 5's check: the LP's assemblage at the boundary point when it is lower (by > 1e-7 kJ/mol)
 *  than the two traced sides, i.e. an assemblage that won at no grid node; else null. */
function missedAt(input: AlloyInput, labels: readonly AlloyLabel[], pair: [number, number], at: [number, number]): AlloyLabel | null {
  const s = supportAt(input, at[0], at[1]);
  const { psi } = speciesPotentialsAt(input, at[0], at[1]);
  const G = (l: AlloyLabel) => l.indices.reduce((sum, k, i) => sum + l.amounts[i] * psi[k], 0);
  const side = Math.min(G(labels[pair[0]]), G(labels[pair[1]]));
  return s.grandPotential < side - 1e-7 ? { key: s.indices.join(','), indices: s.indices, amounts: s.amounts } : null;
}

function summary(els: string[], sp: AlloyInput['species'][number]): SpeciesSummary {
  const metal = sp.charge === 0 && (sp.phase === 's' || sp.phase === 'l') && Object.keys(sp.elements).length === 1 && els.includes(Object.keys(sp.elements)[0]);
  const cls: RegionClass = sp.phase === 'aq' ? 'dissolved' : sp.phase === 'g' ? 'gas' : metal ? 'element' : 'solid';
  const s: SpeciesSummary = { formula: sp.formula, phase: sp.phase, class: cls, role: 'main', G: Math.round(sp.G * 1e6) / 1e6 };
  if (sp.name) s.name = sp.name;
  if (sp.source) s.source = sp.source;
  if (sp.activity !== undefined && sp.phase === 'aq') s.activity = sp.activity;
  if (sp.temperatureModel) s.temperatureModel = sp.temperatureModel;
  if (sp.estimated) s.estimated = true;
  return s;
}

const round = (v: number) => Math.round(v * 1e12) / 1e12;
