/**
 * Family tags: each family line (a boundary at another activity that moves with it, i.e. with a
 * dissolved species of the element on one side) gets one small tag, its activity exponent log a
 * ("0" for unit activity, "−2", "−4"), at the end where it meets the plot frame, set in the margin
 * outside the plot — never along the line. The layout reserves a tag column on each side that a tag
 * needs (between the frame's tick marks and the tick labels on the left and at the bottom, between
 * the frame and the title at the top, beyond the frame on the right); the tags of one column are
 * spread so that none overlaps another (a short leader joins a moved tag to its line end), and a
 * tag that would move too far is left out (the legend key still lists every activity). Pure: no I/O.
 */
import { clipPolyline } from './clip.js';
import { FONT_SAFETY, runsExtent, runsWidth } from './metrics.js';
import { MIN_FONT_PT } from './options.js';
import type { SceneBase } from './scene-context.js';
import type { Point, Rect, TextRun } from './scene-types.js';
import { minus, plainRuns } from './typeset.js';

/** The sides of the plot a tag can sit on, in order of preference. */
export type TagEdge = 'right' | 'top' | 'left' | 'bottom';
const PREFERENCE: readonly TagEdge[] = ['right', 'top', 'left', 'bottom'];

/** Thickness (pt) of the tag column reserved on each side; 0 where no tag goes. */
export type TagColumns = Record<TagEdge, number>;
export const NO_TAG_COLUMNS: TagColumns = { right: 0, top: 0, left: 0, bottom: 0 };

/** Font size of the tags: 70 % of the base size, at least the floor. */
export const tagSize = (fs: number): number => Math.max(MIN_FONT_PT, 0.7 * fs);

/** Gap between the frame (or its tick marks) and a tag, and between two tags (pt). */
export const tagGap = (fs: number): number => 0.25 * fs;

/** The tag of an activity: log a, "0" for a = 1, "−2" for 10⁻², one decimal when not whole ("−2.5"). */
export function tagRuns(activity: number): TextRun[] {
  const e = Math.log10(activity);
  const r = Math.round(e);
  return plainRuns(minus(Math.abs(e - r) < 1e-6 ? String(r === 0 ? 0 : r) : e.toFixed(1)));
}

/** The species of the element whose lines move with the activity (dissolved, main element). */
export function movingSpecies(model: SceneBase['model']): Set<string> {
  return new Set(model.species.filter((s) => s.role === 'main' && s.class === 'dissolved').map((s) => s.formula));
}

/** Sides of `r` that the point lies on (within `eps`). */
export function edgesAt(p: Point, r: Rect, eps: number, yUp: boolean): TagEdge[] {
  const out: TagEdge[] = [];
  if (Math.abs(p[0] - (r.x + r.w)) <= eps) out.push('right');
  if (Math.abs(p[1] - (yUp ? r.y + r.h : r.y)) <= eps) out.push('top');
  if (Math.abs(p[0] - r.x) <= eps) out.push('left');
  if (Math.abs(p[1] - (yUp ? r.y : r.y + r.h)) <= eps) out.push('bottom');
  return out;
}

/** The preferred side among those given, limited to the allowed ones; null if none. */
export function preferredEdge(edges: readonly TagEdge[], allowed: (e: TagEdge) => boolean): TagEdge | null {
  return PREFERENCE.find((e) => edges.includes(e) && allowed(e)) ?? null;
}

/**
 * Tag columns the figure needs, from the diagram domain alone (so the layout can reserve them
 * before the plot is placed): (1) each tagged family line clipped to the domain, (2) the frame
 * sides its ends touch, (3) the preferred side (right is not used beside a second E axis), (4) a
 * column as thick as the widest tag (left, right) or a tag's height (top, bottom), plus the gap.
 */
export function tagColumns(b: SceneBase): TagColumns {
  const fams = b.input.families ?? [];
  if (!fams.length) return { ...NO_TAG_COLUMNS };
  const [p0, p1] = b.model.domain.pH;
  const [e0, e1] = b.model.domain.E;
  const dom: Rect = { x: p0, y: e0, w: p1 - p0, h: e1 - e0 };
  const eps = 1e-9 * Math.max(1, Math.abs(p1 - p0), Math.abs(e1 - e0));
  const moving = movingSpecies(b.model);
  const allowed = (e: TagEdge): boolean => !(e === 'right' && b.o.secondAxis);
  const size = tagSize(b.fs);
  const gap = tagGap(b.fs);
  const cols: TagColumns = { ...NO_TAG_COLUMNS };
  for (const fam of fams) {
    const runs = tagRuns(fam.activity);
    const w = runsWidth(runs, size) * FONT_SAFETY;
    const { top, bottom } = runsExtent(runs, size);
    for (const bd of fam.boundaries) {
      if (!bd.between.some((f) => moving.has(f))) continue;
      const ends = clipPolyline(bd.points, dom).flatMap((p) => (p.length >= 2 ? [p[0]!, p[p.length - 1]!] : []));
      const edge = preferredEdge(ends.flatMap((p) => edgesAt(p, dom, eps, true)), allowed);
      if (!edge) continue;
      const need = (edge === 'left' || edge === 'right' ? w : bottom - top) + gap;
      cols[edge] = Math.max(cols[edge], need);
    }
  }
  return cols;
}

/** A tag to place in one column: where its line meets the frame (along the column) and its length. */
export interface ColumnTag {
  /** Desired centre along the column (y for left/right, x for top/bottom), pt. */
  at: number;
  /** Length along the column, pt. */
  len: number;
  /** Order of preference when room runs out (lower is kept first). */
  rank: number;
}

/**
 * Spreads tags along a column [lo, hi] so that none overlaps another (gap `gap`), each as near its
 * line end as it can be: (1) sort by desired place, (2) lay them out greedily, merging runs of
 * touching tags into clusters centred on their members' mean desired place, clamped to the column,
 * (3) while a tag would move more than `maxShift` or the column is too short, leave out the
 * worst-placed (largest move; ties: higher rank) and start again. Returns each tag's centre, or
 * null for a tag left out. Deterministic.
 */
export function spreadTags(tags: readonly ColumnTag[], lo: number, hi: number, gap: number, maxShift: number): (number | null)[] {
  const kept = tags.map((_, i) => i);
  for (;;) {
    const pos = layOut(tags, kept, lo, hi, gap);
    let worst = -1;
    let worstMove = maxShift;
    for (const i of kept) {
      const p = pos.get(i)!;
      const move = Math.abs(p - tags[i]!.at);
      const outside = p - tags[i]!.len / 2 < lo - 1e-6 || p + tags[i]!.len / 2 > hi + 1e-6;
      const m = outside ? Infinity : move;
      if (m > worstMove + 1e-9 || (worst >= 0 && m === worstMove && tags[i]!.rank > tags[worst]!.rank)) {
        worst = i;
        worstMove = m;
      }
    }
    if (worst < 0) return tags.map((_, i) => pos.get(i) ?? null);
    kept.splice(kept.indexOf(worst), 1);
    if (!kept.length) return tags.map(() => null);
  }
}

/** Steps (1)–(2) of spreadTags for the kept tags: centre of each. */
function layOut(tags: readonly ColumnTag[], kept: readonly number[], lo: number, hi: number, gap: number): Map<number, number> {
  const order = [...kept].sort((a, b) => tags[a]!.at - tags[b]!.at || tags[a]!.rank - tags[b]!.rank);
  // A cluster: consecutive tags laid end to end from `start`.
  const clusters: { ids: number[]; start: number; total: number }[] = [];
  const place = (c: { ids: number[]; start: number; total: number }): void => {
    // Start such that the mean offset from the desired centres is zero, then clamp into the column.
    let acc = 0;
    let off = 0;
    for (const i of c.ids) {
      acc += tags[i]!.at - (off + tags[i]!.len / 2);
      off += tags[i]!.len + gap;
    }
    c.start = Math.min(Math.max(acc / c.ids.length, lo), Math.max(lo, hi - c.total));
  };
  for (const i of order) {
    const c = { ids: [i], start: 0, total: tags[i]!.len };
    place(c);
    clusters.push(c);
    // Merge with the previous cluster while they overlap.
    while (clusters.length > 1) {
      const b = clusters[clusters.length - 1]!;
      const a = clusters[clusters.length - 2]!;
      if (a.start + a.total + gap <= b.start + 1e-9) break;
      clusters.pop();
      a.ids.push(...b.ids);
      a.total += gap + b.total;
      place(a);
    }
  }
  const pos = new Map<number, number>();
  for (const c of clusters) {
    let off = c.start;
    for (const i of c.ids) {
      pos.set(i, off + tags[i]!.len / 2);
      off += tags[i]!.len + gap;
    }
  }
  return pos;
}
