/**
 * The `probe` report: predominant species at one point, evaluated exactly, with runner-up, margin,
 * the shifts that would change the answer and the nearest boundary.
 */
import { classify } from '../diagram/classify.js';
import type { RegionClass } from '../model.js';
import type { Computed } from '../pipeline.js';
import { probeGeometry, psiAt } from '../solve/probe.js';
import { F } from '../thermo/constants.js';

export interface ProbeResult {
  pH: number;
  /** Potential at the point, V vs SHE. */
  E: number;
  temperature: { celsius: number };
  predominant: string;
  class: RegionClass;
  runnerUp: string | null;
  margin: { kJPerMol: number; potentialV: number | null };
  ligandSpecies: Record<string, string>;
  shifts: { up: number | null; down: number | null; acid: number | null; alkaline: number | null };
  nearestBoundary: { between: [string, string]; reaction: string; equation: string; distanceMV: number; distancePH: number | null } | null;
}

export function probe(c: Computed, pH: number, E: number): ProbeResult {
  const input = c.built.input;
  const { psi, ligandSpecies } = psiAt(input, pH, E);
  const order = psi.map((v, k) => [v, k] as const).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const best = input.species[order[0][1]];
  const second = order.length > 1 ? input.species[order[1][1]] : null;
  const marginKJ = order.length > 1 ? order[1][0] - order[0][0] : Infinity;
  // ψ difference per volt along E between the two, for the potential margin (local, exact per plane).
  let potentialV: number | null = null;
  if (second) {
    const h = 1e-4;
    const a = psiAt(input, pH, E + h).psi;
    const slope = (a[order[1][1]] - a[order[0][1]] - (order[1][0] - order[0][0])) / h;
    potentialV = Math.abs(slope) > 1e-12 ? -marginKJ / slope : null;
  }
  const g = probeGeometry(c.model.boundaries, pH, E, input.kelvin);
  const nb = g.nearest?.boundary;
  void F;
  return {
    pH,
    E,
    temperature: { celsius: c.model.temperature.celsius },
    predominant: best.formula,
    class: classify(input.element, best),
    runnerUp: second ? second.formula : null,
    margin: { kJPerMol: Number.isFinite(marginKJ) ? marginKJ : 0, potentialV },
    ligandSpecies,
    shifts: {
      up: g.up?.shift ?? null,
      down: g.down?.shift ?? null,
      acid: g.left?.shift ?? null,
      alkaline: g.right?.shift ?? null,
    },
    nearestBoundary: nb
      ? {
          between: nb.between,
          reaction: nb.reaction,
          equation: nb.equation,
          distanceMV: g.nearest!.distanceV * 1000,
          distancePH: nearestPH(g),
        }
      : null,
  };
}

function nearestPH(g: ReturnType<typeof probeGeometry>): number | null {
  const l = g.left?.shift;
  const r = g.right?.shift;
  if (l === undefined && r === undefined) return null;
  if (l === undefined) return r!;
  if (r === undefined) return l;
  return Math.abs(l) < Math.abs(r) ? l : r;
}
