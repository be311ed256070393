/**
 * The plating window: pH ranges where a dissolved form of the metal lies directly above the metal
 * (so the bath holds the metal in solution and deposits it on the cathode), with the deposition
 * potential (the metal/dissolved boundary) and its margin to the hydrogen line.
 *
 * Steps: 1. breakpoints: every polygon vertex pH (topology along a vertical line is constant between
 *           them); 2. at each interval's midpoint, the E intervals of every region on the vertical line,
 *           sorted: the region directly above the metal's; 3. runs of intervals where that region is
 *           dissolved form a window; 4. along a window, E_dep(pH) is the metal's upper edge (exact,
 *           piecewise linear), margin = E_dep − E_H2(pH); 5. the solid that takes over at each end;
 *        6. notes true of the result (window-notes.ts): the sign of each margin, or why there is none.
 */
import type { DiagramModel, RegionModel } from '../model.js';
import { type AboveRun, marginNote, marginZeros, noWindowNote, WINDOW_DEFINITION } from './window-notes.js';

export interface WindowResult {
  element: string;
  temperature: { celsius: number };
  windows: PlatingWindow[];
  /** pH where a solid first replaces the dissolved form above the metal, rising from the window. */
  firstSolid: { pH: number; species: string } | null;
  notes: string[];
  /** The diagram's warnings, led by a caveat when a window is bounded by an undetermined species. */
  warnings: string[];
}

export interface PlatingWindow {
  pH: [number, number];
  /** Dissolved species above the metal across the window (in pH order). */
  dissolved: string[];
  /** Deposition potential E_dep (V vs SHE) at the window's breakpoints. */
  deposition: { pH: number; E: number }[];
  /** E_dep − E(H2/H+) in V: positive where the metal deposits before hydrogen evolves. */
  marginToHydrogen: { min: number; max: number; atLowPH: number; atHighPH: number };
  /** The species that bound the window below and above (null at the diagram edge). */
  boundedBy: { low: string | null; high: string | null };
}

/** E intervals of a region on the vertical line pH = x (union over its polygons, holes removed). */
function intervalsAt(r: RegionModel, x: number): [number, number][] {
  const out: [number, number][] = [];
  for (const poly of r.polygons) {
    const ys: number[] = [];
    for (const ring of poly) {
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        const [x1, y1] = ring[j];
        const [x2, y2] = ring[i];
        if ((x1 <= x && x < x2) || (x2 <= x && x < x1)) ys.push(y1 + ((x - x1) / (x2 - x1)) * (y2 - y1));
      }
    }
    ys.sort((a, b) => a - b);
    for (let k = 0; k + 1 < ys.length; k += 2) out.push([ys[k], ys[k + 1]]);
  }
  return out;
}

interface Column {
  /** Region above the metal (its index), or -1 when no metal region or nothing above it. */
  above: number;
  /** Top of the metal's interval. */
  top: number | null;
}

function column(model: DiagramModel, x: number, tol: number): Column {
  const spans: { k: number; lo: number; hi: number }[] = [];
  model.regions.forEach((r, k) => {
    for (const [lo, hi] of intervalsAt(r, x)) spans.push({ k, lo, hi });
  });
  spans.sort((a, b) => a.lo - b.lo);
  // The lowest metal interval: deposition happens at its top.
  const metal = spans.find((s) => model.regions[s.k].class === 'element');
  if (!metal) return { above: -1, top: null };
  // The region whose lower edge meets the metal's top (the closest within tol).
  const touching = spans.filter((s) => Math.abs(s.lo - metal.hi) < tol && s.k !== metal.k);
  const next = touching.sort((a, b) => Math.abs(a.lo - metal.hi) - Math.abs(b.lo - metal.hi))[0];
  return { above: next ? next.k : -1, top: metal.hi };
}

/**
 * `tol` (V): how far apart the metal's top and the next region's lower edge may lie on a vertical
 * line — 1e-9 for the exact fixed-activity polygons; composition mode passes two grid cells
 * (analysis/composition-window.ts).
 */
export function platingWindow(model: DiagramModel, tol = 1e-9): WindowResult {
  const [p0, p1] = model.domain.pH;
  // Step 1: breakpoints.
  const xs = new Set<number>([p0, p1]);
  for (const r of model.regions) for (const poly of r.polygons) for (const ring of poly) for (const [x] of ring) if (x > p0 && x < p1) xs.add(x);
  const bps = [...xs].sort((a, b) => a - b).filter((x, k, a) => k === 0 || x - a[k - 1] > 1e-9);
  // Step 2: classify each interval.
  const cols = bps.slice(0, -1).map((a, k) => ({ a, b: bps[k + 1], col: column(model, (a + bps[k + 1]) / 2, tol) }));
  const isWin = (c: Column) => c.above >= 0 && model.regions[c.above].class === 'dissolved';
  const sH = model.waterLines.hydrogen.line;
  const eH2 = (x: number) => sH.intercept! + sH.slope! * x;
  // Step 4: deposition potential at a pH inside or at the edge of a window interval.
  const dep = (x: number, inside: number) => {
    const c = column(model, x === inside ? x : x + (inside - x) * 1e-9, tol);
    return c.top!;
  };
  const windows: PlatingWindow[] = [];
  let k = 0;
  while (k < cols.length) {
    if (!isWin(cols[k].col)) {
      k++;
      continue;
    }
    // Step 3: a run of window intervals.
    let j = k;
    while (j + 1 < cols.length && isWin(cols[j + 1].col)) j++;
    const a = cols[k].a;
    const b = cols[j].b;
    const points: { pH: number; E: number }[] = [];
    for (let m = k; m <= j; m++) {
      const mid = (cols[m].a + cols[m].b) / 2;
      if (m === k) points.push({ pH: a, E: dep(a, mid) });
      points.push({ pH: cols[m].b, E: dep(cols[m].b, mid) });
    }
    const margins = points.map((p) => p.E - eH2(p.pH));
    const dissolved: string[] = [];
    for (let m = k; m <= j; m++) {
      const sp = model.regions[cols[m].col.above].species;
      if (!dissolved.includes(sp)) dissolved.push(sp);
    }
    // Step 5: what bounds it.
    const nameOf = (c: Column | undefined) => (c && c.above >= 0 ? model.regions[c.above].species : null);
    windows.push({
      pH: [a, b],
      dissolved,
      deposition: points,
      marginToHydrogen: { min: Math.min(...margins), max: Math.max(...margins), atLowPH: margins[0], atHighPH: margins[margins.length - 1] },
      boundedBy: { low: k > 0 ? nameOf(cols[k - 1].col) : null, high: j + 1 < cols.length ? nameOf(cols[j + 1].col) : null },
    });
    k = j + 1;
  }
  let firstSolid: WindowResult['firstSolid'] = null;
  if (windows.length) {
    const w = windows[0];
    const after = cols.find((c) => c.a >= w.pH[1] - 1e-12 && c.col.above >= 0 && model.regions[c.col.above].class === 'solid');
    if (after) firstSolid = { pH: after.a, species: model.regions[after.col.above].species };
  }
  // Step 6: notes that are true of this result.
  const notes = [WINDOW_DEFINITION, ...windows.map((w) => marginNote(w, marginZeros(w, eH2)))];
  if (!windows.length) notes.push(noWindowNote(model.element, aboveRuns(model, cols)));
  const warnings = [...model.warnings];
  const und = new Set(model.regions.filter((r) => r.undetermined).map((r) => r.species));
  const touched = windows.flatMap((w) => [...w.dissolved, w.boundedBy.low, w.boundedBy.high]).filter((x): x is string => x !== null && und.has(x));
  const metalUnd = model.regions.some((r) => r.undetermined && r.class === 'element');
  if (touched.length || metalUnd) {
    warnings.unshift(`window edges undetermined at ${model.temperature.celsius} °C: ${[...new Set(touched)].join(', ') || 'the metal'} has only ΔfG° (placed with its 25 °C value)`);
  }
  return { element: model.element, temperature: { celsius: model.temperature.celsius }, windows, firstSolid, notes, warnings };
}

/** Runs of what lies directly above the metal, over the pH intervals where the metal has a field. */
function aboveRuns(model: DiagramModel, cols: { a: number; b: number; col: Column }[]): AboveRun[] {
  const runs: AboveRun[] = [];
  for (const c of cols) {
    if (c.col.top === null) continue;
    const r = c.col.above >= 0 ? model.regions[c.col.above] : null;
    const last = runs[runs.length - 1];
    if (last && last.species === (r?.species ?? null) && Math.abs(last.pH[1] - c.a) < 1e-9) last.pH[1] = c.b;
    else runs.push({ pH: [c.a, c.b], species: r?.species ?? null, class: r?.class ?? null });
  }
  return runs;
}
