/**
 * The answer at one (pH, E), evaluated exactly from the ψ planes (not read off a grid).
 *
 * Steps: 1. each ligand's μ_L = min over its own species (in solving order); 2. ψ_i of every main
 * species; 3. sort: predominant, runner-up, margin ψ₂ − ψ₁ (kJ per mol of the element);
 * 4. from the exact boundaries: the nearest crossing straight up/down in E (V) and left/right in
 * pH, and the nearest boundary in the metric where one pH unit counts as one Nernst slope s(T).
 */
import type { BoundaryModel } from '../model.js';
import { nernstSlope } from '../thermo/constants.js';
import { type Plane, planeAt } from './plane.js';
import { ligandPsiPlane, withoutLigands } from './ligand-psi.js';
import { formationPlane } from './potentials.js';
import { waterContext } from './solve.js';
import type { SolverInput } from './types.js';

export interface PointPsi {
  /** ψ per main species, kJ per mol of element, same order as input.species. */
  psi: number[];
  /** Predominant species of each ligand, by formula. */
  ligandSpecies: Record<string, string>;
}

/**
 * Step 1: each ligand's potential plane μ_L at (pH, E) — the minimum over its own species, ligands in
 * solving order (a ligand species may hold earlier ligands) — and its predominant species.
 */
export function ligandPotentialsAt(
  ligands: SolverInput['ligands'],
  w: ReturnType<typeof waterContext>,
  pH: number,
  E: number,
): { mu: Plane[]; ligandSpecies: Record<string, string> } {
  const mu: Plane[] = [];
  const ligandSpecies: Record<string, string> = {};
  ligands.forEach((L, m) => {
    let best = Infinity;
    let bestPlane: Plane | null = null;
    let bestK = 0;
    L.species.forEach((sp, k) => {
      const pl = ligandPsiPlane({ ligands }, m, sp, formationPlane(sp, w), mu);
      const v = planeAt(pl, pH, E);
      if (v < best) {
        best = v;
        bestPlane = pl;
        bestK = k;
      }
    });
    mu.push(bestPlane!);
    ligandSpecies[L.element] = L.species[bestK].formula;
  });
  return { mu, ligandSpecies };
}

export function psiAt(input: SolverInput, pH: number, E: number): PointPsi {
  const w = waterContext(input);
  const { mu, ligandSpecies } = ligandPotentialsAt(input.ligands, w, pH, E);
  const psi = input.species.map((sp) => {
    const pl = withoutLigands(input, sp, formationPlane(sp, w), mu, input.ligands.length);
    return planeAt(pl, pH, E) / (sp.elements[input.element] ?? 1) / 1000;
  });
  return { psi, ligandSpecies };
}

export interface LineHit {
  /** Signed shift to the boundary, V (for E) or pH units. */
  shift: number;
  boundary: BoundaryModel;
}

export interface ProbeGeometry {
  up?: LineHit;
  down?: LineHit;
  left?: LineHit;
  right?: LineHit;
  nearest?: { boundary: BoundaryModel; distanceV: number; at: [number, number] };
}

/** Step 4: crossings of the vertical and horizontal lines through the point with the boundaries. */
export function probeGeometry(boundaries: BoundaryModel[], pH: number, E: number, kelvin: number): ProbeGeometry {
  const s = nernstSlope(kelvin);
  const g: ProbeGeometry = {};
  let best = Infinity;
  for (const b of boundaries) {
    for (let k = 0; k + 1 < b.points.length; k++) {
      const [x1, y1] = b.points[k];
      const [x2, y2] = b.points[k + 1];
      // Vertical line pH = const.
      if ((x1 - pH) * (x2 - pH) <= 0 && x1 !== x2) {
        const y = y1 + ((pH - x1) / (x2 - x1)) * (y2 - y1);
        const d = y - E;
        if (d > 0 && (!g.up || d < g.up.shift)) g.up = { shift: d, boundary: b };
        if (d < 0 && (!g.down || d > g.down.shift)) g.down = { shift: d, boundary: b };
      }
      // Horizontal line E = const.
      if ((y1 - E) * (y2 - E) <= 0 && y1 !== y2) {
        const x = x1 + ((E - y1) / (y2 - y1)) * (x2 - x1);
        const d = x - pH;
        if (d > 0 && (!g.right || d < g.right.shift)) g.right = { shift: d, boundary: b };
        if (d < 0 && (!g.left || d > g.left.shift)) g.left = { shift: d, boundary: b };
      }
      // Nearest point, pH scaled by s to volts.
      const ax = x1 * s;
      const bx = x2 * s;
      const px = pH * s;
      const dx = bx - ax;
      const dy = y2 - y1;
      const l2 = dx * dx + dy * dy;
      const t = l2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (E - y1) * dy) / l2)) : 0;
      const cx = ax + t * dx;
      const cy = y1 + t * dy;
      const dist = Math.hypot(px - cx, E - cy);
      if (dist < best) {
        best = dist;
        g.nearest = { boundary: b, distanceV: dist, at: [cx / s, cy] };
      }
    }
  }
  return g;
}
