/**
 * Assemble the plain-data diagram model from a built system and its solution.
 */
import type { DiagramModel, RegionModel, SpeciesSummary } from '../model.js';
import type { Solution } from '../solve/solve.js';
import type { SolverInput, SolverSpecies } from '../solve/types.js';
import { KELVIN } from '../thermo/constants.js';
import { classify } from './classify.js';
import { type Verdict, verdictOf } from './verdict.js';
import { VERSION } from '../version.js';


function summary(element: string, sp: SolverSpecies, role: 'main' | 'ligand'): SpeciesSummary {
  const s: SpeciesSummary = {
    formula: sp.formula,
    phase: sp.phase,
    class: classify(element, sp),
    role,
    G: round(sp.G, 6),
  };
  if (sp.name) s.name = sp.name;
  if (sp.phase === 'aq') s.activity = sp.activity;
  if (sp.molality !== undefined) s.molality = sp.molality;
  if (sp.logGamma !== undefined) s.logGamma = sp.logGamma;
  if (sp.phase === 'g') s.pressure = sp.activity;
  if (sp.source) s.source = sp.source;
  if (sp.temperatureModel) s.temperatureModel = sp.temperatureModel;
  if (sp.estimated) s.estimated = true;
  return s;
}

function round(v: number, d: number): number {
  const k = 10 ** d;
  return Math.round(v * k) / k;
}

export function buildModel(
  input: SolverInput,
  sol: Solution,
  meta: { activity: number; ligands: Record<string, number>; amounts?: DiagramModel['amounts']; sources: string[]; warnings: string[]; water?: Record<string, number | string>; classes?: Record<string, Verdict> },
): DiagramModel {
  const regions: RegionModel[] = sol.regions
    .filter((r) => r.area > 0)
    .sort((a, b) => a.index - b.index)
    .map((r) => {
      const sp = input.species[r.index];
      const cls = classify(input.element, sp);
      const m: RegionModel = { species: sp.formula, phase: sp.phase, class: cls, verdict: verdictOf(cls, sp.formula, meta.classes), polygons: r.polygons, area: r.area };
      // No verdict where G at T is unknown (system/build.ts gAt): the field is geometry only.
      if (sp.temperatureModel === 'undetermined') {
        delete m.verdict;
        m.undetermined = true;
      }
      if (sp.name) m.name = sp.name;
      return m;
    });
  const ligandRegions: Record<string, RegionModel[]> = {};
  sol.ligandRegions.forEach((lr, m) => {
    const L = input.ligands[m];
    ligandRegions[lr.element] = lr.regions
      .sort((a, b) => a.index - b.index)
      .map((r) => {
        const sp = L.species[r.index];
        return { species: sp.formula, phase: sp.phase, class: classify(L.element, sp), polygons: r.polygons, area: r.area };
      });
  });
  const model: DiagramModel = {
    ephmap: VERSION,
    element: input.element,
    temperature: { celsius: round(input.kelvin - KELVIN, 6), kelvin: input.kelvin },
    units: { pH: 'pH (molal activity scale)', E: 'V vs SHE at the diagram temperature', G: 'kJ/mol', area: 'pH·V' },
    domain: { pH: input.pH, E: input.E },
    activity: meta.activity,
    ligands: meta.ligands,
    species: [
      ...input.species.map((s) => summary(input.element, s, 'main')),
      ...input.ligands.flatMap((L) => L.species.map((s) => summary(L.element, s, 'ligand'))),
    ],
    regions,
    boundaries: sol.boundaries.map(({ indices: _i, ...b }) => b),
    triplePoints: sol.triplePoints,
    waterLines: { ...sol.waterLines, pressures: input.pressures },
    warnings: meta.warnings,
    sources: meta.sources,
  };
  if (input.ligands.length) model.ligandRegions = ligandRegions;
  if (meta.water) model.water = meta.water;
  if (meta.amounts) model.amounts = meta.amounts;
  return model;
}
