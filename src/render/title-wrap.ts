/**
 * Fitting the figure title to the width above the plot: (1) wrap at spaces into at most
 * `maxLines` lines, (2) shrink the size step by step down to a floor, (3) at the floor, cut the
 * last line with an ellipsis. Pure text layout with the bundled font's metrics; no drawing.
 */
import { FONT_SAFETY, runsWidth } from './metrics.js';
import type { TextRun } from './scene-types.js';

/** Words of a run list: runs split at spaces, each word a list of runs (attributes kept). */
function words(runs: readonly TextRun[]): TextRun[][] {
  const out: TextRun[][] = [[]];
  for (const r of runs) {
    const parts = r.text.split(' ');
    parts.forEach((p, i) => {
      if (i > 0) out.push([]);
      if (p !== '') out[out.length - 1]!.push({ ...r, text: p });
    });
  }
  return out.filter((w) => w.length > 0);
}

const join = (ws: TextRun[][]): TextRun[] => ws.flatMap((w, i) => (i ? [{ text: ' ', shift: 'normal' as const }, ...w] : w));
const width = (runs: readonly TextRun[], size: number): number => runsWidth(runs, size, true) * FONT_SAFETY; // titles are bold

/** Greedy wrap of words into lines no wider than `maxW` at `size` (a lone long word gets its own line). */
export function wrapRuns(runs: readonly TextRun[], size: number, maxW: number): TextRun[][] {
  const lines: TextRun[][][] = [];
  let cur: TextRun[][] = [];
  for (const w of words(runs)) {
    if (cur.length && width(join([...cur, w]), size) > maxW) {
      lines.push(cur);
      cur = [];
    }
    cur.push(w);
  }
  if (cur.length) lines.push(cur);
  return lines.map(join);
}

/** Cuts runs to fit `maxW` at `size`, ending with "…". */
function ellipsize(runs: readonly TextRun[], size: number, maxW: number): TextRun[] {
  const out: TextRun[] = runs.map((r) => ({ ...r }));
  const dots: TextRun = { text: '\u2026', shift: 'normal' };
  while (out.length && width([...out, dots], size) > maxW) {
    const last = out[out.length - 1]!;
    last.text = [...last.text].slice(0, -1).join('');
    if (last.text === '') out.pop();
  }
  return [...out, dots];
}

export interface FittedTitle {
  lines: TextRun[][];
  size: number;
  /** What was done, for the figure's notes (empty when the title fitted as given). */
  steps: ('wrapped' | 'shrunk' | 'cut')[];
}

/**
 * Fits the title into `maxW` pt: wrapped to at most `maxLines` lines at `size`, else at smaller
 * sizes (0.5 pt steps) down to `floor`, else cut with an ellipsis at the floor.
 * Example: a 120-character title at 8.8 pt in 230 pt wraps into 3 lines.
 */
export function fitTitle(runs: readonly TextRun[], size: number, maxW: number, floor: number, maxLines = 3): FittedTitle {
  const fits = (ls: TextRun[][], s: number): boolean => ls.length <= maxLines && ls.every((l) => width(l, s) <= maxW);
  const first = wrapRuns(runs, size, maxW);
  if (fits(first, size)) return { lines: first, size, steps: first.length > 1 ? ['wrapped'] : [] };
  for (let s = size - 0.5; s >= floor - 1e-9; s -= 0.5) {
    const ls = wrapRuns(runs, s, maxW);
    if (fits(ls, s)) return { lines: ls, size: s, steps: ls.length > 1 ? ['wrapped', 'shrunk'] : ['shrunk'] };
  }
  const ls = wrapRuns(runs, floor, maxW).slice(0, maxLines).map((l) => (width(l, floor) > maxW ? ellipsize(l, floor, maxW) : l));
  const all = wrapRuns(runs, floor, maxW);
  if (all.length > maxLines) ls[maxLines - 1] = ellipsize([...ls[maxLines - 1]!, { text: ' ', shift: 'normal' }, ...all[maxLines]!], floor, maxW);
  return { lines: ls, size: floor, steps: ['wrapped', 'shrunk', 'cut'] };
}
