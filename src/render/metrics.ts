/**
 * Text measurement with the advance widths of the bundled font, DejaVu Sans (font-widths.ts,
 * generated from the TTF files the PDF embeds and the PNG rasteriser loads), so that layout is
 * deterministic and matches the PDF and PNG exactly. An SVG viewer without DejaVu Sans falls back
 * to a narrower sans serif; `FONT_SAFETY` keeps a little room for bold and for kerning.
 */
import { BOLD, CAP, DESC, REGULAR, XH } from './font-widths.js';
import type { TextRun } from './scene-types.js';

/** Decodes the "codepoint:width" base-36 table of font-widths.ts. */
function decode(table: string): Map<number, number> {
  const m = new Map<number, number>();
  for (const pair of table.split(',')) {
    const [c, w] = pair.split(':');
    m.set(parseInt(c!, 36), parseInt(w!, 36));
  }
  return m;
}
const REG_W = decode(REGULAR);
const BOLD_W = decode(BOLD);

/** Cap height, x-height, descender of DejaVu Sans (em). */
export const CAP_HEIGHT = CAP;
export const X_HEIGHT = XH;
export const DESCENT = DESC;

/** Sub/superscript size factor and baseline shifts (em of the base size). */
export const SCRIPT_SCALE = 0.7;
export const SUP_RISE = 0.36;
export const SUB_DROP = 0.16;

/** Widening applied by layout: room for bold runs measured as regular and for viewers' kerning. */
export const FONT_SAFETY = 1.06;

/**
 * Advance width of one character in em (DejaVu Sans; bold when asked). Characters outside the
 * table count as 0.6 em. Example: "H" is 0.752 em regular, 0.837 em bold.
 */
export function charWidth(ch: string, bold = false): number {
  const w = (bold ? BOLD_W : REG_W).get(ch.codePointAt(0)!);
  return w === undefined ? 0.6 : w / 1000;
}

/** Width of a plain string in pt at `size` pt (no kerning). */
export function stringWidth(text: string, size: number, bold = false): number {
  let w = 0;
  for (const ch of text) w += charWidth(ch, bold);
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

/** Width in pt of a list of runs at base size `size` (bold: the whole text set in bold). */
export function runsWidth(runs: readonly TextRun[], size: number, bold = false): number {
  let w = 0;
  for (const r of runs) w += stringWidth(r.text, runSize(r, size), bold);
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
