/**
 * Text measurement with the advance widths of the standard PDF font Helvetica (Adobe AFM,
 * units of 1/1000 em), so that layout is deterministic and matches the PDF exactly. SVG viewers
 * may substitute a wider sans serif (DejaVu Sans is 3–18 % wider), so layout adds
 * `FONT_SAFETY` to every measured width.
 */
import type { TextRun } from './scene-types.js';

/** Helvetica advance widths for U+0020 … U+007E. */
const ASCII = [
  278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556, 556, 556, 556, 556, 556,
  556, 556, 278, 278, 584, 584, 584, 556, 1015, 667, 667, 722, 722, 667, 611, 778, 722, 278, 500, 667, 556, 833, 722, 778,
  667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469, 556, 333, 556, 556, 500, 556, 556, 278, 556,
  556, 222, 222, 500, 222, 833, 556, 556, 556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584,
];

/** Non-ASCII characters the figure uses (Helvetica widths; U+2212 minus is drawn as an en dash in PDF). */
const EXTRA: Record<string, number> = {
  '\u2212': 556, // minus sign
  '\u2013': 556, // en dash
  '\u2014': 1000, // em dash
  '\u00b7': 278, // middle dot
  '\u00b0': 400, // degree
  '\u00d7': 584, // multiplication sign
  '\u2018': 222,
  '\u2019': 222,
  '\u201c': 333,
  '\u201d': 333,
  '\u00b1': 584,
  '\u00b5': 556,
  '\u2026': 1000,
  '\u00e9': 556,
};

/** Cap height, x-height, descender of Helvetica (em). */
export const CAP_HEIGHT = 0.718;
export const X_HEIGHT = 0.523;
export const DESCENT = 0.207;

/** Sub/superscript size factor and baseline shifts (em of the base size). */
export const SCRIPT_SCALE = 0.7;
export const SUP_RISE = 0.36;
export const SUB_DROP = 0.16;

/** Widening applied by layout to cover font substitution in SVG viewers. */
export const FONT_SAFETY = 1.15;

/** Advance width of one character in em. Unknown characters count as 0.6 em. */
export function charWidth(ch: string): number {
  const c = ch.codePointAt(0)!;
  if (c >= 32 && c <= 126) return ASCII[c - 32]! / 1000;
  const w = EXTRA[ch];
  return w === undefined ? 0.6 : w / 1000;
}

/** Width of a plain string in pt at `size` pt (no kerning). */
export function stringWidth(text: string, size: number): number {
  let w = 0;
  for (const ch of text) w += charWidth(ch);
  return w * size;
}

/**
 * Font size of a run for a base size. Sub/superscripts are 70 % of the base but kept at 6 pt
 * when that is still at most 85 % of the base (so scripts stay readable in print): 8 pt → 6 pt,
 * 10 pt → 7 pt, 6.8 pt → 5.78 pt.
 */
export function runSize(run: TextRun, size: number): number {
  if (run.shift === 'normal') return size;
  return Math.max(size * SCRIPT_SCALE, Math.min(6, size * 0.85));
}

/** Baseline offset of a run (pt, positive = up) for a base size. */
export function runRise(run: TextRun, size: number): number {
  return run.shift === 'sup' ? SUP_RISE * size : run.shift === 'sub' ? -SUB_DROP * size : 0;
}

/** Width in pt of a list of runs at base size `size`. */
export function runsWidth(runs: readonly TextRun[], size: number): number {
  let w = 0;
  for (const r of runs) w += stringWidth(r.text, runSize(r, size));
  return w;
}

const DESCENDERS = /[gjpqyQ(),;[\]{}|µ]/;

/**
 * Vertical extent of runs relative to the baseline (pt, y down): `top` is negative (ink above the
 * baseline, cap height or superscript top), `bottom` positive (descenders or subscript bottom).
 */
export function runsExtent(runs: readonly TextRun[], size: number): { top: number; bottom: number } {
  let top = 0;
  let bottom = 0;
  for (const r of runs) {
    const s = runSize(r, size);
    const rise = runRise(r, size);
    top = Math.min(top, -(rise + CAP_HEIGHT * s));
    const desc = DESCENDERS.test(r.text) ? DESCENT * s : 0.02 * s;
    bottom = Math.max(bottom, desc - rise);
  }
  return { top, bottom };
}
