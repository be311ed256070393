/**
 * Iso-lines of a TraceField's scalar value (e.g. log10 of the total dissolved element) at given
 * levels: marching squares on the grid values (contour.ts), every crossing refined with the point
 * solver on φ = value − level (refine.ts); the frame parts of d3-contour's closed rings are dropped,
 * leaving open polylines (or closed rings that never touch the frame).
 */
import { contourRings } from './contour.js';
import type { TraceField } from './field.js';
import { gridEdge, type GridSample } from './grid.js';
import { refineCrossing } from './refine.js';

export function traceIsoLines<S>(field: TraceField<S>, g: GridSample<S>, level: number, tolT = 1e-8): [number, number][][] {
  if (!field.value) return [];
  const floor = -1e3;
  const vals = Float64Array.from(g.value, (v) => (Number.isFinite(v) ? v : floor));
  const lines: [number, number][][] = [];
  for (const poly of contourRings(g, vals, level)) {
    for (const ring of poly) {
      const pts = ring.map((v) => {
        if (v.frame || v.a === undefined) return null;
        const a = v.a;
        const b = v.b!;
        const { xa, ya, xb, yb, warm } = gridEdge(g, a, b);
        const phi = (t: number) => {
          const v1 = field.value!(field.solve(xa + (xb - xa) * t, ya + (yb - ya) * t, warm));
          return (Number.isFinite(v1) ? v1 : floor) - level;
        };
        const c = refineCrossing(phi, vals[a] - level, vals[b] - level, tolT);
        // A degenerate crossing (the value flat at the level on both ends) has no position: split there.
        if (!Number.isFinite(c.t)) return null;
        return [xa + (xb - xa) * c.t, ya + (yb - ya) * c.t] as [number, number];
      });
      // Split at frame vertices; a ring without any is kept closed.
      const k0 = pts.findIndex((p) => p === null);
      if (k0 < 0) {
        lines.push(pts as [number, number][]);
        continue;
      }
      let cur: [number, number][] = [];
      for (let k = 1; k <= pts.length; k++) {
        const p = pts[(k0 + k) % pts.length];
        if (p === null) {
          if (cur.length >= 2) lines.push(cur);
          cur = [];
        } else cur.push(p);
      }
    }
  }
  return lines;
}
