/**
 * The one-way pipeline: file → spec → species at T → solution → diagram model.
 */
import { formulaMatches } from './chem/match.js';
import { buildModel } from './diagram/build.js';
import { type ComputedComposition, computeComposition } from './diagram/composition.js';
import type { BoundaryModel, DiagramModel } from './model.js';
import { solve, type Solution } from './solve/solve.js';
import { gridMap } from './solve/grid.js';
import { type BuiltSystem, buildSystem } from './system/build.js';
import { amountNumber, givenAmounts } from './system/amounts.js';
import { checkCompositionGrid, checkWorkBudget, familiesRequested } from './system/budget.js';
import { readSystemFile } from './system/read.js';
import { readSpec, type SystemSpec } from './system/spec.js';
import { InputError } from './system/errors.js';
import { referenceOffset } from './thermo/reference.js';

export interface Computed {
  spec: SystemSpec;
  built: BuiltSystem;
  solution: Solution;
  model: DiagramModel;
}

export function loadSpec(path: string): SystemSpec {
  return readSpec(readSystemFile(path), path);
}

/** How compute() works beyond the spec. */
export interface ComputeOptions {
  /**
   * Nodes per side of the topology cross-check grid (default: the spec's `grid`). A logged series
   * computes one diagram per distinct temperature and answers each row by the exact argmin at its
   * point, so it checks on a coarser grid (analysis/points-answer.ts).
   */
  checkGrid?: number;
}

export function compute(spec: SystemSpec, options: ComputeOptions = {}): Computed {
  // A composition-mode file through the fixed-activity pipeline would take totals as free
  // activities — the very error composition mode exists to avoid. Refuse until it is wired in.
  if (spec.composition) {
    throw new InputError(spec.file, 'composition', 'a fixed-activity system file here (this command does not take composition mode yet; remove composition and give activity/ligands instead)');
  }
  const built = buildSystem(spec);
  const species = built.input.species.length + (built.input.ligands ?? []).reduce((n, l) => n + l.species.length, 0);
  checkWorkBudget({ grid: spec.grid, species, families: familiesRequested(spec.extra) }, spec.file);
  const solution = solve(built.input);
  const amounts = givenAmounts(spec, built.solution.water.density);
  const model = buildModel(built.input, solution, {
    activity: amountNumber(amounts.element),
    ligands: Object.fromEntries(Object.entries(amounts.ligands).map(([k, a]) => [k, amountNumber(a)])),
    amounts,
    sources: built.sources,
    warnings: built.warnings,
    water: waterSummary(built),
    classes: spec.operating.classes,
  });
  // Topology cross-check: every species that wins at a node of the grid must have a region.
  const n = Math.min(spec.grid, options.checkGrid ?? spec.grid);
  const grid = gridMap(built.input, n, n);
  const won = new Uint8Array(built.input.species.length);
  for (let k = 0; k < grid.index.length; k++) won[grid.index[k]] = 1;
  const exact = new Set(solution.regions.filter((r) => r.area > 0).map((r) => r.index));
  const missing = built.input.species.filter((_, k) => won[k] === 1 && !exact.has(k)).map((sp) => sp.formula);
  if (missing.length) model.warnings.push(`grid check: ${missing.join(', ')} won at grid nodes but has no exact region (degenerate geometry?)`);
  withOperating(spec, model);
  return { spec, built, solution, model };
}

/** The reference electrode's second scale and the `classes` check of the operating keys, on a model. */
function withOperating(spec: SystemSpec, model: DiagramModel): void {
  const ref = spec.operating.reference;
  if (ref !== undefined && !(typeof ref === 'string' && ref === 'rhe') && !(typeof ref === 'string' && ref === 'she')) {
    const r = referenceOffset(ref, spec.temperature);
    model.reference = { id: typeof ref === 'string' ? ref : 'custom', label: r.label, offset: r.offset };
    model.warnings.push(...r.warnings);
  }
  for (const k of Object.keys(spec.operating.classes)) {
    if (!model.species.some((x) => formulaMatches(k, x.formula))) throw new InputError(spec.file, `classes.${k}`, 'a formula of a species in the system', JSON.stringify(k));
  }
}

/** A computed composition-mode diagram: the spec, its model and the point solver's setup and grid. */
export interface ComputedBath {
  kind: 'composition';
  spec: SystemSpec;
  model: DiagramModel;
  composition: ComputedComposition;
}

/** Either kind of diagram, computed. */
export type ComputedAny = (Computed & { kind: 'fixed-activity' }) | ComputedBath;

/**
 * The one dispatch by kind of diagram: a file with `composition` is solved point by point with full
 * speciation (computeComposition, on the file's `grid`), any other through compute(). Verbs that
 * take both kinds call this; compute() stays the fixed-activity path.
 */
export function computeAny(spec: SystemSpec): ComputedAny {
  if (!spec.composition) return { ...compute(spec), kind: 'fixed-activity' };
  checkCompositionGrid(spec.grid, spec.file);
  const composition = computeComposition(spec);
  const model = composition.model;
  const water = waterSummary(composition.setup.built);
  if (spec.composition.autoIonicStrength) Object.assign(water, { ionicStrength: 'auto', ionicStrengthFrom: 'the speciation at each point' });
  model.water = water;
  withOperating(spec, model);
  return { kind: 'composition', spec, model, composition };
}

/**
 * Boundaries of the same system with every dissolved species of the element that follows the
 * system's amount at activity `a` (an activity, no γ correction) — the lines of an activity family.
 * Equal to compute(atActivity(spec, a)).model.boundaries, but solves once on the already built
 * system with only those species' activities changed (no new species resolution, water state or
 * grid check).
 */
export function familyBoundaries(c: Computed, a: number): BoundaryModel[] {
  const { input } = c.built;
  const logA = Math.log10(a);
  const species = input.species.map((sp, k) => {
    if (!c.built.followsAmount[k]) return sp;
    const { logGamma: _g, molality: _m, ...rest } = sp;
    return { ...rest, logActivity: logA, activity: a };
  });
  const varied = { ...input, species };
  const model = buildModel(varied, solve(varied), {
    activity: a,
    ligands: c.spec.ligands,
    sources: c.built.sources,
    warnings: [],
    water: waterSummary(c.built),
    classes: c.spec.operating.classes,
  });
  return model.boundaries;
}

export function computeFile(path: string): Computed {
  return compute(loadSpec(path));
}

/** Water properties and solution settings used, for the model's `water` key. */
export function waterSummary(built: BuiltSystem): Record<string, number | string> {
  const s = built.solution;
  const w = s.water;
  return {
    temperatureC: w.celsius,
    pressureMPa: w.pressureMPa,
    saturationPressureMPa: w.saturationPressureMPa,
    pressurePath: w.path,
    densityKgM3: w.density,
    permittivity: w.permittivity,
    pKw: w.pKw,
    neutralPH: w.neutralPH,
    debyeHuckelA: s.A,
    debyeHuckelB: s.B,
    ionicStrength: s.settings.ionicStrength,
    ionicStrengthFrom: s.settings.ionicStrengthFrom,
    activityModel: s.settings.model,
  };
}
