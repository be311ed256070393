/**
 * The predominance solver: ligand cells, exact pieces, merged regions, boundaries with their
 * reactions, triple points and water lines (DEVELOPERS.md, "The solver in one paragraph").
 *
 * Steps:
 *   1. formation planes Φ for every species at T (potentials.ts);
 *   2. ligand recursion: the domain rectangle is split into cells where each ligand's own
 *      predominant species is fixed; within a cell μ_L is a plane;
 *   3. in each cell the main-element planes ψ_i = (Φ_i − Σ k_L μ_L)/x_i are exact planes, and their
 *      lower envelope is clipped exactly (envelope.ts);
 *   4. pieces are merged into regions and shared boundaries (merge.ts);
 *   5. each boundary run gets its balanced reaction with the ligand species of its cell.
 */
import type { BoundaryModel, Polygon, TriplePoint, WaterLine } from '../model.js';
import { F, LN10, R } from '../thermo/constants.js';
import { type ConvexPoly, type Pt, rectangle, signedArea } from './clip.js';
import { lowerEnvelope } from './envelope.js';
import { mergePieces, type MergeInput, type MergeResult } from './merge.js';
import type { Plane } from './plane.js';
import { ligandPsiPlane, mainPsiPlane } from './ligand-psi.js';
import { formationPlane, type WaterContext } from './potentials.js';
import { lineEquationText } from '../diagram/line-text.js';
import { balance, lineFrom, type Participant } from './reaction.js';
import type { SolverInput, SolverSpecies } from './types.js';

export interface LigandCell {
  poly: ConvexPoly;
  /** Per ligand (solving order): index of its predominant species. */
  species: number[];
  /** Per ligand: μ_L plane (J per mol of L atoms). */
  mu: Plane[];
}

export interface Solution {
  regions: { index: number; polygons: Polygon[]; area: number }[];
  boundaries: (BoundaryModel & { indices: [number, number] })[];
  triplePoints: TriplePoint[];
  waterLines: { hydrogen: WaterLine; oxygen: WaterLine };
  ligandRegions: { element: string; regions: { index: number; polygons: Polygon[]; area: number }[] }[];
  cells: LigandCell[];
  /** Formation planes of main species (J/mol). */
  phi: Plane[];
  /** Formation planes of each ligand's species. */
  ligandPhi: Plane[][];
}

export function waterContext(input: SolverInput): WaterContext {
  return {
    kelvin: input.kelvin,
    G_H2O: input.water.H2O * 1000,
    G_H2: input.water.H2 * 1000,
    logWaterActivity: input.logWaterActivity ?? 0,
  };
}

/** Φ at unit activity: the standard-state plane of a species. */
function standardPlane(sp: SolverSpecies, w: WaterContext): Plane {
  return formationPlane({ ...sp, logActivity: 0 }, w);
}

/** ψ planes of the main species within one ligand cell; null where a species has no M. */
export function mainPlanes(input: SolverInput, phi: Plane[], cell: LigandCell): Plane[] {
  return input.species.map((sp, k) => mainPsiPlane(input, sp, phi[k], cell.mu));
}

/** Step 2: ligand cells. */
export function ligandCells(input: SolverInput, ligandPhi: Plane[][]): LigandCell[] {
  let cells: LigandCell[] = [{ poly: rectangle(input.pH, input.E), species: [], mu: [] }];
  input.ligands.forEach((L, m) => {
    const next: LigandCell[] = [];
    for (const cell of cells) {
      const planes = L.species.map((sp, k) => ligandPsiPlane(input, m, sp, ligandPhi[m][k], cell.mu));
      for (const pc of lowerEnvelope(cell.poly, planes)) {
        next.push({ poly: pc.poly, species: [...cell.species, pc.owner], mu: [...cell.mu, planes[pc.owner]] });
      }
    }
    cells = next;
  });
  return cells;
}

export function solve(input: SolverInput): Solution {
  const w = waterContext(input);
  // Step 1: formation planes.
  const phi = input.species.map((sp) => formationPlane(sp, w));
  const phi0 = input.species.map((sp) => standardPlane(sp, w));
  const ligandPhi = input.ligands.map((L) => L.species.map((sp) => formationPlane(sp, w)));
  const ligandPhi0 = input.ligands.map((L) => L.species.map((sp) => standardPlane(sp, w)));
  // Step 2: ligand cells.
  const cells = ligandCells(input, ligandPhi);
  // Step 3: exact pieces per cell.
  const pieces: MergeInput[] = [];
  cells.forEach((cell, c) => {
    for (const pc of lowerEnvelope(cell.poly, mainPlanes(input, phi, cell))) {
      pieces.push({ owner: pc.owner, cell: c, pts: pc.poly.pts });
    }
  });
  // Step 4: regions and boundaries.
  const merged = mergePieces(pieces);
  const regions = regionsWithArea(merged.regions);
  // Step 5: reactions per boundary run.
  const part = (k: number): Participant => ({ sp: input.species[k], phi: phi[k], phi0: phi0[k] });
  const ligPart = (m: number, k: number): Participant => ({
    sp: input.ligands[m].species[k],
    phi: ligandPhi[m][k],
    phi0: ligandPhi0[m][k],
  });
  const groups = new Map<string, { a: number; b: number; cell: number; edges: [number, number][] }>();
  for (const be of merged.boundaries) {
    const a = be.left;
    const b = be.right;
    // Only ligands whose count changes across this pair distinguish reactions.
    const cell = cells[be.leftCell];
    const key = [a, b, ...relevantLigands(input, a, b).map((m) => cell.species[m])].join('|');
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { a, b, cell: be.leftCell, edges: [] }));
    g.edges.push([be.u, be.v]);
  }
  const boundaries: Solution['boundaries'] = [];
  const keys = [...groups.keys()];
  for (const key of keys) {
    const g = groups.get(key)!;
    const cell = cells[g.cell];
    const rel = new Set(relevantLigands(input, g.a, g.b));
    const ligs = input.ligands.map((L, m) => ({ element: L.element, part: rel.has(m) ? ligPart(m, cell.species[m]) : null }));
    const rx = balance(input.element, part(g.a), part(g.b), ligs, input.kelvin);
    for (const chain of chainPolylines(g.edges)) {
      boundaries.push({
        between: [input.species[g.a].formula, input.species[g.b].formula],
        indices: [g.a, g.b],
        ligandSpecies: ligs.filter((l) => l.part).map((l) => l.part!.sp.formula),
        reaction: rx.text,
        equation: rx.equation,
        line: rx.line,
        points: chain.map((v) => [merged.vertices[v][0], merged.vertices[v][1]] as [number, number]),
      });
    }
  }
  boundaries.sort(compareBoundaries);
  const triplePoints = triplePointsOf(merged, input);
  // Ligand underlay regions.
  const ligandRegions = input.ligands.map((L, m) => {
    const lm = mergePieces(cells.map((cell, c) => ({ owner: cell.species[m], cell: c, pts: cell.poly.pts })));
    return {
      element: L.element,
      regions: regionsWithArea(lm.regions),
    };
  });
  return { regions, boundaries, triplePoints, waterLines: waterLines(input), ligandRegions, cells, phi, ligandPhi };
}

/** Triple points: welded vertices touched by boundaries of three or more species, by pH then E. */
function triplePointsOf(merged: MergeResult, input: SolverInput): TriplePoint[] {
  const touch = new Map<number, Set<number>>();
  for (const be of merged.boundaries) {
    for (const v of [be.u, be.v]) {
      let s = touch.get(v);
      if (!s) touch.set(v, (s = new Set()));
      s.add(be.left).add(be.right);
    }
  }
  const triplePoints: TriplePoint[] = [];
  for (const [v, s] of touch) {
    if (s.size >= 3) {
      const idx = [...s].sort((x, y) => x - y);
      triplePoints.push({ species: idx.map((k) => input.species[k].formula), pH: merged.vertices[v][0], E: merged.vertices[v][1] });
    }
  }
  triplePoints.sort((p, q) => p.pH - q.pH || p.E - q.E);
  return triplePoints;
}

/** Each merged region (owner index → polygons) with its total area, in the map's order. */
function regionsWithArea(regions: MergeResult['regions']): { index: number; polygons: Polygon[]; area: number }[] {
  return [...regions.entries()].map(([index, polygons]) => ({
    index,
    polygons,
    area: polygons.reduce((s, p) => s + p.reduce((t, r) => t + signedArea(r), 0), 0),
  }));
}

/** Ligands (indices) whose atom count per M atom differs between species a and b. */
function relevantLigands(input: SolverInput, a: number, b: number): number[] {
  const A = input.species[a];
  const B = input.species[b];
  const xa = A.elements[input.element] ?? 1;
  const xb = B.elements[input.element] ?? 1;
  const out: number[] = [];
  input.ligands.forEach((L, m) => {
    if (Math.abs((A.elements[L.element] ?? 0) / xa - (B.elements[L.element] ?? 0) / xb) > 1e-12) out.push(m);
  });
  // A later ligand's species may carry an earlier ligand: include it too.
  return out;
}

/** Chain undirected edges into polylines (open chains first from their ends, then cycles). */
function chainPolylines(edges: [number, number][]): number[][] {
  const adj = new Map<number, number[]>();
  edges.forEach(([u, v], k) => {
    for (const x of [u, v]) {
      const l = adj.get(x);
      if (l) l.push(k);
      else adj.set(x, [k]);
    }
  });
  const used = new Uint8Array(edges.length);
  const out: number[][] = [];
  const walk = (start: number) => {
    const chain = [start];
    let cur = start;
    for (;;) {
      const next = (adj.get(cur) ?? []).find((k) => !used[k]);
      if (next === undefined) break;
      used[next] = 1;
      const [u, v] = edges[next];
      cur = u === cur ? v : u;
      chain.push(cur);
    }
    return chain;
  };
  const ends = [...adj.entries()].filter(([, l]) => l.length % 2 === 1).map(([v]) => v).sort((a, b) => a - b);
  for (const v of ends) if ((adj.get(v) ?? []).some((k) => !used[k])) out.push(walk(v));
  for (let k = 0; k < edges.length; k++) if (!used[k]) out.push(walk(edges[k][0]));
  return out;
}

function compareBoundaries(a: BoundaryModel, b: BoundaryModel): number {
  const ka = `${a.between[0]}\u0000${a.between[1]}`;
  const kb = `${b.between[0]}\u0000${b.between[1]}`;
  if (ka !== kb) return ka < kb ? -1 : 1;
  return a.points[0][0] - b.points[0][0] || a.points[0][1] - b.points[0][1];
}

/**
 * Water stability lines at T (SHE at the same T):
 *   2H+ + 2e− = H2(g):          E = −s·pH − (s/2)·log p(H2)
 *   O2(g) + 4H+ + 4e− = 2H2O(l): E = [G(O2) + 2G(H2) − 2G(H2O)]/(4F) − s·pH + (s/4)·log p(O2) (− (s/2)·log a_w)
 * Worked example, 25 °C, 1 bar: E°(O2/H2O) = 2·237.129 kJ/(4F) = 1.2288 V.
 */
export function waterLines(input: SolverInput): { hydrogen: WaterLine; oxygen: WaterLine } {
  const T = input.kelvin;
  const RT = R * T;
  const GH2 = input.water.H2 * 1000;
  const GO2 = input.water.O2 * 1000;
  const GW = input.water.H2O * 1000;
  const lw = input.logWaterActivity ?? 0;
  // ΔrG as planes (J per reaction as written), reduction direction.
  const h: Plane = { g: GH2 + RT * LN10 * Math.log10(input.pressures.H2) - GH2, p: 2 * RT * LN10, e: 2 * F };
  const h0: Plane = { g: 0, p: 2 * RT * LN10, e: 2 * F };
  // μ_e = −F·E + ½G_H2: the −½G_H2 per electron cancels G(H2) of the product in the H2 line.
  const oG = 2 * (GW + RT * LN10 * lw) - (GO2 + RT * LN10 * Math.log10(input.pressures.O2)) - 2 * GH2;
  const o: Plane = { g: oG, p: 4 * RT * LN10, e: 4 * F };
  const o0: Plane = { g: 2 * GW - GO2 - 2 * GH2, p: 4 * RT * LN10, e: 4 * F };
  const mk = (pl: Plane, p0: Plane, n: number, m: number, reaction: string): WaterLine => {
    const line = lineFrom(pl, p0, n, m, T);
    const pts = clipLine(line.intercept!, line.slope!, input.pH, input.E);
    return { reaction, equation: lineEquationText(line), line, points: pts };
  };
  return {
    hydrogen: mk(h, h0, 2, 2, '2H^+ + 2e^- <=> H2(g)'),
    oxygen: mk(o, o0, 4, 4, 'O2(g) + 4H^+ + 4e^- <=> 2H2O(l)'),
  };
}

/** The segment of E = a + b·pH inside the domain rectangle (empty if it misses). */
function clipLine(a: number, b: number, pH: [number, number], E: [number, number]): [number, number][] {
  let t0 = pH[0];
  let t1 = pH[1];
  if (Math.abs(b) > 1e-15) {
    const pA = (E[0] - a) / b;
    const pB = (E[1] - a) / b;
    t0 = Math.max(t0, Math.min(pA, pB));
    t1 = Math.min(t1, Math.max(pA, pB));
  } else if (a < E[0] || a > E[1]) return [];
  if (t1 <= t0) return [];
  return [
    [t0, a + b * t0],
    [t1, a + b * t1],
  ];
}

export type { Pt };
