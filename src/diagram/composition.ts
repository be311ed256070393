/**
 * Composition mode, the model: a grid of point solutions (speciation at each (pH, E)), each form's
 * region traced with marching squares and its vertices refined with the point solver, boundaries as
 * refined polylines with the exchange reaction that dominates at their midpoint, iso-solubility
 * lines of the total dissolved element. Same DiagramModel contract as the fixed-activity kind,
 * plus `kind`, `composition` and `isoSolubility`. Deterministic: the same spec gives the same JSON.
 */
import type { BoundaryModel, DiagramModel, IsoSolubilityLine, RegionModel, SpeciesSummary } from '../model.js';
import { balance, type Participant } from '../solve/reaction.js';
import { formationPlane } from '../solve/potentials.js';
import { waterContext, waterLines } from '../solve/solve.js';
import { speciationField } from '../solve/speciation/field.js';
import type { PointSolution } from '../solve/speciation/point.js';
import type { SpeciationProblem } from '../solve/speciation/problem.js';
import { type GridSample, sampleGrid } from '../solve/trace/grid.js';
import { traceIsoLines } from '../solve/trace/iso.js';
import { uncoveredPolygons } from '../solve/trace/gaps.js';
import { joinTriplePoints } from '../solve/trace/junctions.js';
import { traceRegions, type TracedBoundary, undeterminedPolygons } from '../solve/trace/regions.js';
import type { SolverSpecies } from '../solve/types.js';
import type { SystemSpec } from '../system/spec.js';
import { KELVIN } from '../thermo/constants.js';
import { VERSION } from '../version.js';
import { classify } from './classify.js';
import { type CompositionSetup, compositionSetup } from './composition-setup.js';
import { UNDETERMINED_SHARE, undeterminedIndices, undeterminedShareAreas } from './composition-undetermined.js';
import { verdictOf } from './verdict.js';

/** Default iso-solubility levels, mol/kg: every decade from 10⁻⁸ to 10⁻². */
export const ISO_LEVELS = [1e-8, 1e-7, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2];

export interface CompositionOptions {
  /** Nodes per axis (default: the spec's grid). */
  grid?: number;
  /** Extra iso-solubility levels, mol/kg (added to ISO_LEVELS; default: the file's solubilityLevels). */
  levels?: number[];
}

export interface ComputedComposition {
  setup: CompositionSetup;
  grid: GridSample<unknown>;
  model: DiagramModel;
}

export function computeComposition(spec: SystemSpec, opts: CompositionOptions = {}): ComputedComposition {
  // Step 1: the point solver and its field.
  const setup = compositionSetup(spec);
  const P = setup.solver.problem;
  const field = speciationField(setup.solver);
  // Step 2: grid, regions, refined boundaries.
  const n = opts.grid ?? spec.grid;
  const g = sampleGrid(field, spec.pH, spec.E, n, n);
  const traced = traceRegions(field, g);
  const input = setup.built.input;
  const regions: RegionModel[] = traced.regions.map((r) => {
    const sp = P.species[r.label];
    const cls = classify(input.element, sp);
    const m: RegionModel = { species: sp.formula, phase: sp.phase, class: cls, verdict: verdictOf(cls, sp.formula, spec.operating.classes), polygons: r.polygons, area: r.area };
    if (sp.name) m.name = sp.name;
    // No verdict where G at T is unknown (system/build.ts gAt), as in the fixed-activity model.
    if (input.species.some((x) => x.formula === sp.formula && x.phase === sp.phase && x.temperatureModel === 'undetermined')) {
      delete m.verdict;
      m.undetermined = true;
    }
    return m;
  });
  const triples = joinTriplePoints(field, g, traced.boundaries);
  const boundaries = traced.boundaries.map((b) => boundaryModel(setup, b));
  // Step 3: iso-solubility lines.
  // Levels at or above the element's total have no line (the dissolved total never exceeds it; at
  // the total itself the contour is degenerate wherever everything is dissolved and gave NaN vertices).
  const total = setup.totals[input.element]!;
  const levels = [...new Set([...ISO_LEVELS, ...(opts.levels ?? spec.composition?.levels ?? [])])].filter((l) => l < total * (1 - 1e-9)).sort((a, b) => a - b);
  const isoSolubility: IsoSolubilityLine[] = levels.map((level) => ({ level, lines: traceIsoLines(field, g, Math.log10(level)) }));
  const warnings = [...setup.warnings];
  if (g.failed) warnings.push(`composition mode: ${g.failed} of ${n * n} grid points could not be solved; they are undetermined (no region drawn there)`);
  // Step 4: undetermined areas, never blank ones: the unsolved nodes, then whatever the traced
  // regions leave uncovered (slivers near triple points the junctions could not close).
  const failedPolys = undeterminedPolygons(g);
  const gaps = uncoveredPolygons(g, [...regions.flatMap((r) => r.polygons), ...failedPolys]);
  // Step 5: where species without G at T hold a share of the element, no verdict either.
  const und = undeterminedIndices(P);
  const heldPolys = undeterminedShareAreas(g, und, P.species.length);
  if (heldPolys.length) warnings.push(`composition mode: no verdict where ${und.map((k) => P.species[k].formula).join(', ')} (G unknown at this temperature) hold ${100 * UNDETERMINED_SHARE} % or more of ${input.element}; that area is drawn as undetermined`);
  if (gaps.length) warnings.push(`composition mode: ${gaps.length} small area(s) near region junctions are not resolved at grid ${n}; they are drawn as undetermined (a finer grid shrinks them)`);
  const comp = spec.composition!;
  const model: DiagramModel = {
    kind: 'composition',
    ephmap: VERSION,
    element: input.element,
    temperature: { celsius: Math.round((input.kelvin - KELVIN) * 1e6) / 1e6, kelvin: input.kelvin },
    units: { pH: 'pH (molal activity scale)', E: 'V vs SHE at the diagram temperature', G: 'kJ/mol', area: 'pH·V', composition: 'mol/kg of water' },
    domain: { pH: spec.pH, E: spec.E },
    activity: setup.totals[input.element],
    ligands: Object.fromEntries(Object.entries(setup.totals).slice(1)),
    species: P.species.map((s) => summary(input.element, s, (s.elements[input.element] ?? 0) > 0 ? 'main' : 'ligand')),
    regions,
    boundaries,
    triplePoints: triples.map((t) => ({ species: t.labels.map((k) => P.species[k].formula), pH: t.x, E: t.y })),
    waterLines: { ...waterLines(input), pressures: input.pressures },
    warnings,
    sources: setup.built.sources,
    composition: { totals: setup.totals, units: 'mol/kg', ionicStrength: comp.autoIonicStrength ? 'auto' : setup.solver.gamma.ionicStrength, grid: { nx: n, ny: n, failed: g.failed }, undetermined: [...heldPolys, ...failedPolys, ...gaps], ...(heldPolys.length ? { heldBy: und.map((k) => P.species[k].formula) } : {}), ...(gaps.length ? { unresolved: gaps.length } : {}) },
    isoSolubility,
  };
  return { setup, grid: g as GridSample<unknown>, model };
}

function summary(element: string, sp: SolverSpecies, role: 'main' | 'ligand'): SpeciesSummary {
  const s: SpeciesSummary = { formula: sp.formula, phase: sp.phase, class: classify(element, sp), role, G: Math.round(sp.G * 1e6) / 1e6 };
  if (sp.name) s.name = sp.name;
  if (sp.source) s.source = sp.source;
  if (sp.temperatureModel) s.temperatureModel = sp.temperatureModel;
  if (sp.estimated) s.estimated = true;
  return s;
}

/** A traced boundary with the exchange reaction at its midpoint (actual activities there). */
function boundaryModel(setup: CompositionSetup, b: TracedBoundary): BoundaryModel {
  const P = setup.solver.problem;
  const input = setup.built.input;
  const mid = b.points[Math.floor(b.points.length / 2)];
  const sol = setup.solver.solve(mid[0], mid[1]);
  const part = (k: number): Participant => participant(P, sol, k, waterContext(input));
  const ligands = P.components.slice(1).map((L, c) => {
    let best = -1;
    for (let i = 0; i < P.nAq; i++) {
      if (P.A[i * P.components.length] !== 0 || P.A[i * P.components.length + c + 1] === 0) continue;
      if (best < 0 || sol.m[i] > sol.m[best]) best = i;
    }
    return { element: L, part: best >= 0 ? part(best) : null };
  });
  const [i, j] = b.between;
  const r = balance(input.element, part(i), part(j), ligands, input.kelvin);
  const used = new Set(r.terms.map((t) => t.formula));
  return {
    between: [P.species[i].formula, P.species[j].formula],
    ligandSpecies: ligands.filter((l) => l.part && used.has(l.part.sp.formula)).map((l) => l.part!.sp.formula),
    reaction: r.text,
    equation: r.equation,
    line: r.line,
    points: b.points,
  };
}

function participant(P: SpeciationProblem, sol: PointSolution, k: number, w: ReturnType<typeof waterContext>): Participant {
  const sp = P.species[k];
  const logA = k < P.nAq && sol.status === 'ok' ? Math.log10(sol.m[k]) + sol.logGamma[k] : 0;
  return { sp, phi: formationPlane({ ...sp, logActivity: logA }, w), phi0: formationPlane({ ...sp, logActivity: 0 }, w) };
}
