/**
 * Region fills: each region's polygons clipped to the plot, a tint per region (neighbouring regions
 * of one tint group differ; palette.assignFills) and the fill items under everything else.
 */
import type { DiagramModel } from '../model.js';
import { clipRing } from './clip.js';
import { insideRings, ringArea, simplifyCollinear } from './geometry.js';
import { assignFills, fillGroup, UNDETERMINED_FILL } from './palette.js';
import type { SceneContext } from './scene-context.js';
import type { Point, SceneItem } from './scene-types.js';

export interface RegionFills {
  /** Per region, per polygon, its rings (outer and holes) in figure points, clipped to the plot. */
  polys: Point[][][][];
  /** Per region, all its rings. */
  rings: Point[][][];
  /** Per region, its fill (null: no fill in the 'lines' style). */
  fills: (string | null)[];
  items: SceneItem[];
}

/** Area (pt²) of a polygon given as rings (outer and holes, all counted positive). */
export const polyArea = (rings: Point[][]): number => rings.reduce((s, ring) => s + Math.abs(ringArea(ring)), 0);

/** A region polygon set in figure points, clipped to the plot, degenerate rings and polygons dropped. */
export function clipPolygons(ctx: SceneContext, polygons: readonly (readonly (readonly [number, number])[])[][]): Point[][][] {
  return polygons
    .map((poly) => poly.map((ring) => simplifyCollinear(clipRing(ring.map((p) => ctx.fr.toFig(p)), ctx.plot), true)).filter((ring) => ring.length >= 3))
    .filter((rings) => rings.length > 0);
}

/** Indices of the regions that share a boundary with each region (by species on either side). */
function neighbours(model: DiagramModel): Set<number>[] {
  const speciesIndex = new Map<string, number[]>();
  model.regions.forEach((r, i) => speciesIndex.set(r.species, [...(speciesIndex.get(r.species) ?? []), i]));
  const out: Set<number>[] = model.regions.map(() => new Set());
  for (const b of model.boundaries) {
    for (const i of speciesIndex.get(b.between[0]) ?? [])
      for (const j of speciesIndex.get(b.between[1]) ?? []) {
        if (i !== j) {
          out[i]!.add(j);
          out[j]!.add(i);
        }
      }
  }
  return out;
}

/** (1) clip every region, (2) find neighbours, (3) assign tints, (4) one even-odd path per region. */
export function buildFills(ctx: SceneContext): RegionFills {
  const { model, o } = ctx;
  const polys = model.regions.map((r) => clipPolygons(ctx, r.polygons));
  const rings = polys.map((p) => p.flat());
  const nb = neighbours(model);
  const fills = assignFills(
    model.regions.map((r, i) => ({ species: r.species, class: fillGroup(r.class, r.verdict), neighbours: [...nb[i]!].sort((a, b) => a - b), area: polys[i]!.flat().reduce((sum, ring) => sum + Math.abs(ringArea(ring)), 0) })),
    o.style,
    o.colors,
  );
  // Undetermined regions (no G at T, no verdict) take their own neutral fill in the tinted styles.
  if (o.style !== 'lines') model.regions.forEach((r, i) => r.undetermined && (fills[i] = UNDETERMINED_FILL));
  const items: SceneItem[] = [];
  model.regions.forEach((r, i) => {
    if (rings[i]!.length === 0) return;
    items.push({
      type: 'path',
      role: 'region',
      subpaths: rings[i]!.map((points) => ({ points, closed: true })),
      fill: fills[i] ?? (o.style === 'lines' ? null : '#ffffff'),
      fillRule: 'evenodd',
      stroke: null,
      strokeWidth: 0,
      dash: null,
      data: { species: r.species, class: r.class },
    });
  });
  return { polys, rings, fills, items };
}

/** Fill of the region under a point (for knock-outs), white where there is none. */
export function fillAt(f: RegionFills, p: Point): string {
  for (let i = 0; i < f.rings.length; i++) if (insideRings(p, f.rings[i]!)) return f.fills[i] ?? '#ffffff';
  return '#ffffff';
}
