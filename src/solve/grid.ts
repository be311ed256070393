/**
 * Grid minimum-Gibbs map: the predominant species index at every node of an nx × ny grid over the
 * domain. Used as an independent topology check of the exact polygons and for raster outputs.
 *
 * Steps: 1. planes into flat Float64Arrays (g, p, e per species; per ligand species);
 *        2. per row (fixed E), per node: μ_L = min over each ligand's planes (solving order),
 *           then ψ_i = base_i − Σ k_iL·μ_L scaled by 1/x_i, argmin into a Uint16Array.
 * No allocation per node. Memory: 2 bytes per node plus O(species) scratch.
 */
import { type Plane, scalePlane } from './plane.js';
import { formationPlane } from './potentials.js';
import { waterContext } from './solve.js';
import type { SolverInput } from './types.js';

export interface GridMap {
  nx: number;
  ny: number;
  /** Species index (into input.species) at node (i, j), row-major from pH[0], E[0]: idx[j·nx + i]. */
  index: Uint16Array;
}

export function gridMap(input: SolverInput, nx: number, ny: number): GridMap {
  const w = waterContext(input);
  const N = input.species.length;
  // Step 1: flat planes. Main planes keep ligand counts separately: ψ = (Φ − Σ k μ_L)/x.
  const mg = new Float64Array(N);
  const mp = new Float64Array(N);
  const me = new Float64Array(N);
  const nL = input.ligands.length;
  const mk = new Float64Array(N * Math.max(nL, 1));
  input.species.forEach((sp, k) => {
    const x = sp.elements[input.element] ?? 1;
    const pl = scalePlane(formationPlane(sp, w), 1 / x);
    mg[k] = pl.g;
    mp[k] = pl.p;
    me[k] = pl.e;
    input.ligands.forEach((L, m) => {
      mk[k * nL + m] = (sp.elements[L.element] ?? 0) / x;
    });
  });
  const lig = input.ligands.map((L, m) => {
    const n = L.species.length;
    const g = new Float64Array(n);
    const p = new Float64Array(n);
    const e = new Float64Array(n);
    const kPrev = new Float64Array(n * Math.max(m, 1));
    L.species.forEach((sp, k) => {
      const l = sp.elements[L.element] ?? 1;
      const pl: Plane = scalePlane(formationPlane(sp, w), 1 / l);
      g[k] = pl.g;
      p[k] = pl.p;
      e[k] = pl.e;
      for (let q = 0; q < m; q++) kPrev[k * m + q] = (sp.elements[input.ligands[q].element] ?? 0) / l;
    });
    return { n, g, p, e, kPrev };
  });
  const index = new Uint16Array(nx * ny);
  const mu = new Float64Array(Math.max(nL, 1));
  const [p0, p1] = input.pH;
  const [e0, e1] = input.E;
  const dp = nx > 1 ? (p1 - p0) / (nx - 1) : 0;
  const de = ny > 1 ? (e1 - e0) / (ny - 1) : 0;
  // Step 2: rows. Along a row E is fixed, so g + e·E is folded into one constant per species.
  const rowBase = new Float64Array(N);
  const ligBase = lig.map((L) => new Float64Array(L.n));
  for (let j = 0; j < ny; j++) {
    const E = e0 + j * de;
    const row = j * nx;
    for (let k = 0; k < N; k++) rowBase[k] = mg[k] + me[k] * E;
    for (let m = 0; m < nL; m++) for (let k = 0; k < lig[m].n; k++) ligBase[m][k] = lig[m].g[k] + lig[m].e[k] * E;
    if (nL === 0) {
      // No ligands: a plain minimum over planes.
      for (let i = 0; i < nx; i++) {
        const pH = p0 + i * dp;
        let best = Infinity;
        let arg = 0;
        for (let k = 0; k < N; k++) {
          const v = rowBase[k] + mp[k] * pH;
          if (v < best) {
            best = v;
            arg = k;
          }
        }
        index[row + i] = arg;
      }
      continue;
    }
    for (let i = 0; i < nx; i++) {
      const pH = p0 + i * dp;
      // Each ligand's μ_L at this node, in solving order.
      for (let m = 0; m < nL; m++) {
        const L = lig[m];
        const base = ligBase[m];
        let best = Infinity;
        for (let k = 0; k < L.n; k++) {
          let v = base[k] + L.p[k] * pH;
          for (let q = 0; q < m; q++) v -= L.kPrev[k * m + q] * mu[q];
          if (v < best) best = v;
        }
        mu[m] = best;
      }
      let best = Infinity;
      let arg = 0;
      for (let k = 0; k < N; k++) {
        let v = rowBase[k] + mp[k] * pH;
        for (let m = 0; m < nL; m++) v -= mk[k * nL + m] * mu[m];
        if (v < best) {
          best = v;
          arg = k;
        }
      }
      index[row + i] = arg;
    }
  }
  return { nx, ny, index };
}
