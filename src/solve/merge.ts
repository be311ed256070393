/**
 * Merge convex pieces into regions and shared boundaries.
 *
 * Pieces come from several cells (ligand predominance cells); a species' region is the union of
 * its pieces. Algorithm:
 *   1. weld vertices closer than the weld tolerance (weldTolerance: relative to the pieces' extent;
 *      a spatial hash), so equal points get one id;
 *   2. split every piece edge at welded vertices lying on it (removes T-junctions between cells);
 *   3. an edge whose reverse belongs to the same owner is interior and dropped; the rest are ring
 *      edges; those whose reverse belongs to another owner are boundary edges between the two;
 *   4. chain ring edges into rings (leftmost turn at pinch points), sort outer rings (CCW) and
 *      holes (CW), and give each hole to the smallest outer ring containing it.
 */
import type { Polygon, Ring } from '../model.js';
import { type Pt, signedArea } from './clip.js';

export interface MergeInput {
  owner: number;
  /** Cell (ligand context) the piece came from. */
  cell: number;
  pts: Pt[];
}

export interface BoundaryEdge {
  /** Owner on the left of u→v, owner on the right (or -1 on the domain edge). */
  left: number;
  right: number;
  leftCell: number;
  rightCell: number;
  u: number;
  v: number;
}

export interface MergeResult {
  vertices: Pt[];
  /** owner → polygons (outer ring first, then holes). */
  regions: Map<number, Polygon[]>;
  /** Edges between different owners, each once (left owner < right owner). */
  boundaries: BoundaryEdge[];
}

/** Weld tolerance relative to the extent of the pieces (pH and V units are of order 1–10). */
const WELD_REL = 1e-11;

/** Weld tolerance for a set of pieces: WELD_REL × the largest |coordinate| (at least 1). */
export function weldTolerance(pieces: readonly MergeInput[]): number {
  let span = 0;
  for (const pc of pieces) for (const [x, y] of pc.pts) span = Math.max(span, Math.abs(x), Math.abs(y));
  return WELD_REL * Math.max(span, 1);
}

class VertexWelder {
  readonly pts: Pt[] = [];
  private readonly grid = new Map<string, number[]>();
  private readonly cell: number;

  constructor(private readonly weld: number) {
    this.cell = weld * 16;
  }

  id(p: Pt): number {
    const cx = Math.floor(p[0] / this.cell);
    const cy = Math.floor(p[1] / this.cell);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const list = this.grid.get(`${cx + dx},${cy + dy}`);
        if (!list) continue;
        for (const k of list) {
          const q = this.pts[k];
          if (Math.abs(q[0] - p[0]) <= this.weld && Math.abs(q[1] - p[1]) <= this.weld) return k;
        }
      }
    }
    const k = this.pts.length;
    this.pts.push([p[0], p[1]]);
    const key = `${cx},${cy}`;
    const list = this.grid.get(key);
    if (list) list.push(k);
    else this.grid.set(key, [k]);
    return k;
  }
}

interface DirEdge {
  u: number;
  v: number;
  owner: number;
  cell: number;
}

export function mergePieces(pieces: MergeInput[]): MergeResult {
  // Step 1: weld vertices (tolerance scaled to the extent of the domain).
  const weld = weldTolerance(pieces);
  const welder = new VertexWelder(weld);
  const rings: { owner: number; cell: number; ids: number[] }[] = [];
  for (const pc of pieces) {
    const ids: number[] = [];
    for (const p of pc.pts) {
      const k = welder.id(p);
      if (ids.length === 0 || ids[ids.length - 1] !== k) ids.push(k);
    }
    while (ids.length > 1 && ids[0] === ids[ids.length - 1]) ids.pop();
    if (ids.length >= 3) rings.push({ owner: pc.owner, cell: pc.cell, ids });
  }
  const V = welder.pts;

  // Step 2: split edges at welded vertices that lie on them.
  const edges: DirEdge[] = [];
  for (const r of rings) {
    const n = r.ids.length;
    for (let k = 0; k < n; k++) {
      const u = r.ids[k];
      const v = r.ids[(k + 1) % n];
      const chain = splitEdge(V, u, v, weld);
      for (let m = 0; m + 1 < chain.length; m++) {
        edges.push({ u: chain[m], v: chain[m + 1], owner: r.owner, cell: r.cell });
      }
    }
  }
  const byKey = new Map<string, DirEdge>();
  for (const e of edges) byKey.set(`${e.u},${e.v}`, e);

  // Step 3: classify edges.
  const ringEdges = new Map<number, DirEdge[]>();
  const boundaries: BoundaryEdge[] = [];
  for (const e of edges) {
    const twin = byKey.get(`${e.v},${e.u}`);
    if (twin && twin.owner === e.owner) continue;
    let list = ringEdges.get(e.owner);
    if (!list) ringEdges.set(e.owner, (list = []));
    list.push(e);
    if (twin && e.owner < twin.owner) {
      boundaries.push({ left: e.owner, right: twin.owner, leftCell: e.cell, rightCell: twin.cell, u: e.u, v: e.v });
    }
  }

  // Step 4: rings per owner.
  const regions = new Map<number, Polygon[]>();
  const owners = [...ringEdges.keys()].sort((a, b) => a - b);
  for (const owner of owners) {
    const closed = chainRings(V, ringEdges.get(owner)!);
    regions.set(owner, assembleHoles(closed));
  }
  return { vertices: V, regions, boundaries };
}

/** Vertex ids on segment u→v (inclusive), in order along it. */
function splitEdge(V: Pt[], u: number, v: number, weld: number): number[] {
  const a = V[u];
  const b = V[v];
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const xmin = Math.min(a[0], b[0]) - weld;
  const xmax = Math.max(a[0], b[0]) + weld;
  const ymin = Math.min(a[1], b[1]) - weld;
  const ymax = Math.max(a[1], b[1]) + weld;
  const inner: [number, number][] = [];
  for (let w = 0; w < V.length; w++) {
    if (w === u || w === v) continue;
    const p = V[w];
    if (p[0] < xmin || p[0] > xmax || p[1] < ymin || p[1] > ymax) continue;
    const t = ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2;
    if (t <= 0 || t >= 1) continue;
    const qx = a[0] + t * dx - p[0];
    const qy = a[1] + t * dy - p[1];
    if (qx * qx + qy * qy <= 4 * weld * weld) inner.push([t, w]);
  }
  inner.sort((p, q) => p[0] - q[0]);
  return [u, ...inner.map((x) => x[1]), v];
}

/** Chain directed edges into closed rings, taking the leftmost turn where several leave a vertex. */
function chainRings(V: Pt[], list: DirEdge[]): Ring[] {
  const out = new Map<number, number[]>(); // vertex → indices into list
  list.forEach((e, k) => {
    const l = out.get(e.u);
    if (l) l.push(k);
    else out.set(e.u, [k]);
  });
  const used = new Uint8Array(list.length);
  const rings: Ring[] = [];
  for (let s = 0; s < list.length; s++) {
    if (used[s]) continue;
    const ids: number[] = [];
    let k = s;
    while (!used[k]) {
      used[k] = 1;
      const e = list[k];
      ids.push(e.u);
      const cand = (out.get(e.v) ?? []).filter((c) => !used[c]);
      if (cand.length === 0) break;
      k = cand.length === 1 ? cand[0] : leftmost(V, e, cand.map((c) => list[c]), cand);
    }
    if (ids.length >= 3) rings.push(ids.map((i) => [V[i][0], V[i][1]] as [number, number]));
  }
  return rings;
}

function leftmost(V: Pt[], e: DirEdge, cands: DirEdge[], idx: number[]): number {
  const a = V[e.u];
  const b = V[e.v];
  const inAng = Math.atan2(b[1] - a[1], b[0] - a[0]);
  let best = idx[0];
  let bestTurn = -Infinity;
  cands.forEach((c, k) => {
    const q = V[c.v];
    let turn = Math.atan2(q[1] - b[1], q[0] - b[0]) - inAng;
    while (turn <= -Math.PI) turn += 2 * Math.PI;
    while (turn > Math.PI) turn -= 2 * Math.PI;
    if (turn > bestTurn) {
      bestTurn = turn;
      best = idx[k];
    }
  });
  return best;
}

function assembleHoles(rings: Ring[]): Polygon[] {
  const outers = rings.filter((r) => signedArea(r) > 0);
  const holes = rings.filter((r) => signedArea(r) < 0);
  const polys: Polygon[] = outers.map((r) => [r]);
  for (const h of holes) {
    // A point just to the left of a hole edge lies inside the region, hence inside its outer ring.
    const a = h[0];
    const b = h[1];
    const mx = (a[0] + b[0]) / 2 - (b[1] - a[1]) * 1e-6;
    const my = (a[1] + b[1]) / 2 + (b[0] - a[0]) * 1e-6;
    let best = -1;
    let bestArea = Infinity;
    outers.forEach((o, k) => {
      const ar = signedArea(o);
      if (ar < bestArea && pointInRing(o, mx, my)) {
        best = k;
        bestArea = ar;
      }
    });
    if (best >= 0) polys[best].push(h);
  }
  return polys;
}

export function pointInRing(ring: Ring, x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
