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

/**
 * ψ of every main species at (pH, E) into `out` (same values, bit for bit, as psiAt: the same
 * plane arithmetic in the same order), for many points on one system. Without ligands the planes
 * are fixed, so they are built once here and each call costs one multiply-add per species; with
 * ligands μ_L is piecewise, so each call goes through psiAt. Returns the ligands' species.
 */
export type PsiEvaluator = (pH: number, E: number, out: Float64Array) => Record<string, string>;

export function psiEvaluator(input: SolverInput): PsiEvaluator {
  if (input.ligands.length) {
    return (pH, E, out) => {
      const r = psiAt(input, pH, E);
      out.set(r.psi);
      return r.ligandSpecies;
    };
  }
  const w = waterContext(input);
  const n = input.species.length;
  const g = new Float64Array(n);
  const p = new Float64Array(n);
  const e = new Float64Array(n);
  const div = new Float64Array(n);
  input.species.forEach((sp, k) => {
    const pl = formationPlane(sp, w);
    g[k] = pl.g;
    p[k] = pl.p;
    e[k] = pl.e;
    div[k] = sp.elements[input.element] ?? 1;
  });
  const none: Record<string, string> = {};
  return (pH, E, out) => {
    for (let k = 0; k < n; k++) out[k] = (g[k] + p[k] * pH + e[k] * E) / div[k] / 1000;
    return none;
  };
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

/**
 * Step 4's hits as numbers and boundary indices (-1: none), filled in place by geometryHits so
 * that many points on one system allocate nothing; probeGeometry wraps them in objects.
 */
export interface GeometryHits {
  up: number;
  down: number;
  left: number;
  right: number;
  bUp: number;
  bDown: number;
  bLeft: number;
  bRight: number;
  bNear: number;
  /** Nearest point's offset from the point and the point itself, pH scaled by s to volts. */
  nx: number;
  ny: number;
  ncx: number;
  ncy: number;
  /** The Nernst slope s(T), V per pH. */
  s: number;
}

export function newGeometryHits(): GeometryHits {
  return { up: 0, down: 0, left: 0, right: 0, bUp: -1, bDown: -1, bLeft: -1, bRight: -1, bNear: -1, nx: 0, ny: 0, ncx: 0, ncy: 0, s: 0 };
}

/** Step 4: crossings of the vertical and horizontal lines through the point with the boundaries. */
export function probeGeometry(boundaries: BoundaryModel[], pH: number, E: number, kelvin: number): ProbeGeometry {
  const h = geometryHits(boundaries, pH, E, kelvin, newGeometryHits());
  const g: ProbeGeometry = {};
  if (h.bUp >= 0) g.up = { shift: h.up, boundary: boundaries[h.bUp] };
  if (h.bDown >= 0) g.down = { shift: h.down, boundary: boundaries[h.bDown] };
  if (h.bRight >= 0) g.right = { shift: h.right, boundary: boundaries[h.bRight] };
  if (h.bLeft >= 0) g.left = { shift: h.left, boundary: boundaries[h.bLeft] };
  if (h.bNear >= 0) g.nearest = { boundary: boundaries[h.bNear], distanceV: Math.hypot(h.nx, h.ny), at: [h.ncx / h.s, h.ncy] };
  return g;
}

/**
 * Step 4 into `out`: for every boundary segment, the crossing of the vertical line pH = const
 * (shift in E, V) and of the horizontal line E = const (shift in pH), and the segment's closest
 * point with 1 pH counted as s(T) volts; the nearest of each kind kept (the first on a tie).
 */
export function geometryHits(boundaries: BoundaryModel[], pH: number, E: number, kelvin: number, out: GeometryHits): GeometryHits {
  const s = nernstSlope(kelvin);
  let up = Infinity, down = -Infinity, left = -Infinity, right = Infinity;
  let bUp = -1, bDown = -1, bLeft = -1, bRight = -1, bNear = -1;
  let best2 = Infinity, nx = 0, ny = 0, ncx = 0, ncy = 0;
  const px = pH * s;
  for (let i = 0; i < boundaries.length; i++) {
    const pts = boundaries[i].points;
    for (let k = 0; k + 1 < pts.length; k++) {
      const a = pts[k];
      const b = pts[k + 1];
      const x1 = a[0], y1 = a[1], x2 = b[0], y2 = b[1];
      // Vertical line pH = const.
      if ((x1 - pH) * (x2 - pH) <= 0 && x1 !== x2) {
        const d = y1 + ((pH - x1) / (x2 - x1)) * (y2 - y1) - E;
        if (d > 0 && d < up) (up = d), (bUp = i);
        if (d < 0 && d > down) (down = d), (bDown = i);
      }
      // Horizontal line E = const.
      if ((y1 - E) * (y2 - E) <= 0 && y1 !== y2) {
        const d = x1 + ((E - y1) / (y2 - y1)) * (x2 - x1) - pH;
        if (d > 0 && d < right) (right = d), (bRight = i);
        if (d < 0 && d > left) (left = d), (bLeft = i);
      }
      // Nearest point, pH scaled by s to volts (squared distance compared; its root taken once).
      const ax = x1 * s;
      const dx = x2 * s - ax;
      const dy = y2 - y1;
      const l2 = dx * dx + dy * dy;
      const t = l2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (E - y1) * dy) / l2)) : 0;
      const cx = ax + t * dx;
      const cy = y1 + t * dy;
      const d2 = (px - cx) * (px - cx) + (E - cy) * (E - cy);
      if (d2 < best2) (best2 = d2), (bNear = i), (nx = px - cx), (ny = E - cy), (ncx = cx), (ncy = cy);
    }
  }
  out.up = up;
  out.down = down;
  out.left = left;
  out.right = right;
  out.bUp = bUp;
  out.bDown = bDown;
  out.bLeft = bLeft;
  out.bRight = bRight;
  out.bNear = bNear;
  out.nx = nx;
  out.ny = ny;
  out.ncx = ncx;
  out.ncy = ncy;
  out.s = s;
  return out;
}
