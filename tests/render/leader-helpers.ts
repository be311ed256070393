/** Leader checks for the figure tests: leaders against labels, marks and each other. */
import { segmentHitsRect, segmentsIntersect } from '../../src/render/geometry.js';
import { textBox } from '../../src/render/labels.js';
import type { Point, Rect, Scene, ScenePath, SceneText } from '../../src/render/scene-types.js';
import { allItems } from './helpers.js';

export interface Leader {
  a: Point;
  b: Point;
  /** What it leads to (its label and mark share the key), when the scene says. */
  key?: string;
}

export interface Boxed {
  box: Rect;
  what: string;
  key?: string;
}

const shrink = (r: Rect, d: number): Rect => ({ x: r.x + d, y: r.y + d, w: Math.max(0, r.w - 2 * d), h: Math.max(0, r.h - 2 * d) });
const gapTo = (p: Point, r: Rect): number => Math.hypot(Math.max(r.x - p[0], 0, p[0] - (r.x + r.w)), Math.max(r.y - p[1], 0, p[1] - (r.y + r.h)));

/**
 * Problems: a leader through another label's box or through a mark other than its own, and two
 * leaders that cross. A box is the leader's own when the keys match or (no key) the leader's tip
 * ends within 0.6 pt of it.
 */
export function leaderProblems(leaders: readonly Leader[], labels: readonly Boxed[], marks: readonly Boxed[]): string[] {
  const out: string[] = [];
  const own = (l: Leader, b: Boxed): boolean => (l.key !== undefined && b.key === l.key) || (l.key === undefined && gapTo(l.b, b.box) <= 0.6);
  const name = (l: Leader): string => `leader ${l.key ?? ''} (${l.a.map((v) => v.toFixed(1)).join(',')})→(${l.b.map((v) => v.toFixed(1)).join(',')})`;
  for (const l of leaders) {
    for (const b of labels) if (!own(l, b) && segmentHitsRect(l.a, l.b, shrink(b.box, 0.05))) out.push(`${name(l)} strikes label ${b.what}`);
    for (const b of marks) if (!own(l, b) && segmentHitsRect(l.a, l.b, shrink(b.box, 0.05))) out.push(`${name(l)} strikes mark ${b.what}`);
  }
  for (let i = 0; i < leaders.length; i++) for (let j = i + 1; j < leaders.length; j++) {
    const p = leaders[i]!;
    const q = leaders[j]!;
    if (segmentsIntersect(p.a, p.b, q.a, q.b)) out.push(`${name(p)} crosses ${name(q)}`);
  }
  return out;
}

const textOf = (t: SceneText): string => t.runs.map((r) => r.text).join('');

/** Box of a text item: its layout box, else the ink box (turned for text reading upwards). */
export function anyTextBox(t: SceneText): Rect | null {
  if (t.box) return t.box;
  const b = textBox(t.runs, t.size, t.x, t.y, t.anchor);
  if (t.rotate === 0) return b;
  if (t.rotate !== -90) return null;
  // Turned −90° about (x, y): (dx, dy) → (dy, −dx).
  return { x: t.x + (b.y - t.y), y: t.y - (b.x + b.w - t.x), w: b.h, h: b.w };
}

/** Key of what a text, mark or leader belongs to (region species outside, or a mark's label). */
function keyOf(role: string, data: Record<string, string> | undefined): string | undefined {
  if (!data) return undefined;
  if (role === 'region-label') return data.placement === 'outside' ? `region ${data.species}` : undefined;
  if (role === 'leader' && data.species !== undefined) return `region ${data.species}`;
  if (data.label !== undefined) return `mark ${data.label}`;
  return undefined;
}

/** The leaders, labels and marks of a scene, and the problems leaderProblems finds. */
leaderProblems.fromScene = (s: Scene): { problems: string[]; leaders: number } => {
  const items = allItems(s);
  const leaders: Leader[] = items
    .filter((p): p is ScenePath => p.type === 'path' && (p.role === 'leader' || p.role === 'family-tag-leader'))
    .flatMap((p) => p.subpaths.map((sp) => ({ a: sp.points[0]!, b: sp.points[sp.points.length - 1]!, ...(keyOf(p.role, p.data) !== undefined ? { key: keyOf(p.role, p.data)! } : {}) })));
  const labels: Boxed[] = items.flatMap((t) => {
    if (t.type !== 'text') return [];
    const box = anyTextBox(t);
    const key = keyOf(t.role, t.data);
    return box ? [{ box, what: `${t.role} "${textOf(t)}"`, ...(key !== undefined ? { key } : {}) }] : [];
  });
  const marks: Boxed[] = items.flatMap((m): Boxed[] => {
    const key = m.type === 'group' ? undefined : keyOf(m.role, m.data);
    const k = key !== undefined ? { key } : {};
    if (m.type === 'circle' && m.role === 'point') return [{ box: { x: m.cx - m.r, y: m.cy - m.r, w: 2 * m.r, h: 2 * m.r }, what: `point ${m.data?.label}`, ...k }];
    if (m.type === 'path' && (m.role === 'box' || m.role === 'arrow')) {
      const pts = m.subpaths.flatMap((sp) => sp.points);
      const xs = pts.map((p) => p[0]);
      const ys = pts.map((p) => p[1]);
      const x = Math.min(...xs);
      const y = Math.min(...ys);
      return [{ box: { x, y, w: Math.max(...xs) - x, h: Math.max(...ys) - y }, what: `${m.role} ${m.data?.label ?? ''}`, ...k }];
    }
    return [];
  });
  return { problems: leaderProblems(leaders, labels, marks), leaders: leaders.length };
};
