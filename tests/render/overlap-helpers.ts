/** Text boxes of a scene and their overlaps, for the figure-fit tests. */
import { textBox } from '../../src/render/labels.js';
import type { Rect, Scene, SceneText } from '../../src/render/scene-types.js';
import { allItems } from './helpers.js';

/** Boxes of upright text (the layout's own box where it kept one). */
export function textBoxes(scene: Scene): { role: string; box: Rect; text: string }[] {
  return allItems(scene)
    .filter((t): t is SceneText => t.type === 'text' && t.rotate === 0)
    .map((t) => ({ role: t.role, box: t.box ?? textBox(t.runs, t.size, t.x, t.y, t.anchor), text: t.runs.map((r) => r.text).join('') }));
}

const overlap = (a: Rect, b: Rect, tol: number): boolean => a.x + tol < b.x + b.w && b.x + tol < a.x + a.w && a.y + tol < b.y + b.h && b.y + tol < a.y + a.h;

/** Pairs of text boxes that overlap by more than `tol` pt. */
export function overlaps(scene: Scene, tol = 0.25): string[] {
  const bs = textBoxes(scene);
  const out: string[] = [];
  for (let i = 0; i < bs.length; i++) for (let j = i + 1; j < bs.length; j++) {
    if (overlap(bs[i]!.box, bs[j]!.box, tol)) out.push(`${bs[i]!.role} "${bs[i]!.text}" × ${bs[j]!.role} "${bs[j]!.text}"`);
  }
  for (const b of bs) {
    if (b.box.x < -tol || b.box.y < -tol || b.box.x + b.box.w > scene.widthPt + tol || b.box.y + b.box.h > scene.heightPt + tol) out.push(`${b.role} "${b.text}" outside the figure`);
  }
  return out;
}

