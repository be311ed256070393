/**
 * Continuity of every library element's diagram over 25–300 °C in 1 K steps with the default
 * temperature model (the design promise of 0–300 °C; issue 12): between T and T + 1 no field
 * appears or vanishes unless it is a sliver under 2 mV wide (width ≈ 2·area/perimeter, measured at the
 * temperature of its birth, bisected to 0.01 K: a field born at a triple point grows with ΔT, a jump
 * does not) — a solid replaced by another over the same field is a phase change and allowed — and no
 * boundary moves more than 5 mV per kelvin beyond the exact RT/F scaling of its Nernst terms (E
 * lines, at the middle pH of the segment), or 0.085 pH per kelvin (pH lines: 5 mV at the Nernst
 * slope), and no boundary's rate of motion changes by more than 1 mV/K from one kelvin to the next.
 * Solver used directly (no rendering) to keep this fast.
 * Physical expectation ("common practice"): standard-state properties are smooth in T between
 * 25 and 300 °C at saturation, so diagrams must change smoothly.
 */
import { describe, expect, it } from 'vitest';
import type { Polygon } from '../../src/model.js';
import { loadLibrary } from '../../src/data/library.js';
import { solve } from '../../src/solve/solve.js';
import { buildSystem } from '../../src/system/build.js';
import { readSpec } from '../../src/system/spec.js';

/**
 * Boundaries allowed a steady move up to 5.5–6 mV/K: anion-forming reactions whose ΔrS°/nF at high T
 * (the Born entropy of the new anions, HKF) passes 5 mV/K near 270–300 °C — smooth, no jump.
 */
const STEEP: Record<string, number> = { 'Fe3O4|HFeO2^-|': 0.006, 'Co3O4|HCoO2^-|': 0.0055, 'Cu2O|CuO2^2-|': 0.0055 };

/**
 * The library's phase choices by temperature (stableBelow/stableAbove, e.g. gibbsite → boehmite at
 * 100 °C; species/Al.json): the species that leave or enter at t. Such a swap is documented and its
 * boundaries may shift at t (the values do not put the crossing there); nothing else may.
 */
function phaseChoiceAt(t: number): Set<string> {
  return new Set(loadLibrary().filter((s) => s.stableBelow === t || s.stableAbove === t).map((s) => s.formula));
}

const ELEMENTS = ['Fe', 'Cu', 'Zn', 'Ni', 'Cr', 'Al', 'Co', 'Sn', 'Pb', 'Ag', 'Au', 'Ti', 'Mn', 'Mo'];

function ringMeasure(poly: Polygon): { area: number; perimeter: number } {
  let area = 0;
  let perimeter = 0;
  poly.forEach((ring, k) => {
    let a = 0;
    for (let i = 0; i < ring.length; i++) {
      const [x1, y1] = ring[i]!;
      const [x2, y2] = ring[(i + 1) % ring.length]!;
      a += x1 * y2 - x2 * y1;
      perimeter += Math.hypot(x2 - x1, y2 - y1);
    }
    area += k === 0 ? Math.abs(a) / 2 : -Math.abs(a) / 2;
  });
  return { area, perimeter };
}

interface Snapshot {
  fields: Map<string, number>; // species → width estimate
  lines: Map<string, { kind: 'E' | 'pH'; at: (pH: number) => number; e0: number; nernst: (pH: number) => number; midPH: number }>;
}

function snapshot(element: string, celsius: number): Snapshot {
  const built = buildSystem(readSpec({ element, temperature: celsius }, `sweep ${element}`));
  const sol = solve(built.input);
  const fields = new Map<string, number>();
  for (const r of sol.regions) {
    let A = 0;
    let P = 0;
    for (const poly of r.polygons) {
      const m = ringMeasure(poly);
      A += m.area;
      P += m.perimeter;
    }
    const name = built.input.species[r.index]!.formula;
    fields.set(name, Math.max(fields.get(name) ?? 0, P > 0 ? (2 * A) / P : 0));
  }
  const lines: Snapshot['lines'] = new Map();
  for (const b of sol.boundaries) {
    const key = `${[...b.between].sort().join('|')}|${[...b.ligandSpecies].sort().join(',')}`;
    const pts = b.points;
    const midPH = (pts[0]![0] + pts[pts.length - 1]![0]) / 2;
    const l = b.line;
    // nernst(pH): the part of E proportional to T (RT/F ln10 times activity and pH terms).
    const e0 = l.E0 ?? 0;
    lines.set(key, { kind: l.kind, at: (pH) => (l.kind === 'E' ? l.intercept! + l.slope! * pH : l.value!), e0, nernst: (pH) => (l.kind === 'E' ? l.intercept! - e0 + l.slope! * pH : 0), midPH });
  }
  return { fields, lines };
}

/** Width of a field at T (0 where absent). */
const widthAt = (el: string, t: number, sp: string): number => snapshot(el, t).fields.get(sp) ?? 0;

/**
 * Where a field appears or vanishes between t0 and t0 + 1: the temperature nearest its birth (or
 * death), bisected to 0.01 K, and its width there. A field born at a triple point grows in
 * proportion to ΔT, so its width at the refined step is a sliver; a jump stays wide.
 */
function widthAtBirth(el: string, t0: number, sp: string): number {
  let lo = t0;
  let hi = t0 + 1;
  const presentLo = widthAt(el, lo, sp) > 0;
  for (let k = 0; k < 7; k++) {
    const mid = (lo + hi) / 2;
    if (widthAt(el, mid, sp) > 0 === presentLo) lo = mid;
    else hi = mid;
  }
  return Math.max(widthAt(el, lo, sp), widthAt(el, hi, sp));
}

describe('diagrams change smoothly with temperature (25–300 °C, 1 K steps)', () => {
  it.each(ELEMENTS)('%s', (el) => {
    let prev = snapshot(el, 25);
    let prevMoves = new Map<string, number>();
    const problems: string[] = [];
    for (let t = 26; t <= 300; t++) {
      const cur = snapshot(el, t);
      const gone = [...prev.fields].filter(([sp]) => !cur.fields.has(sp));
      const born = [...cur.fields].filter(([sp]) => !prev.fields.has(sp));
      for (const [sp, w] of [...gone, ...born]) {
        if (w < 0.002) continue;
        // A solid replaced by another solid over the same field (e.g. hydroxide → oxide on heating)
        // is a phase change, not a discontinuity of the diagram.
        const swap = [...gone, ...born].some(([o, wo]) => o !== sp && Math.abs(wo - w) < 0.02 * w && /[A-Z]/.test(o) && !/[+-]/.test(o) && !/[+-]/.test(sp));
        if (swap || phaseChoiceAt(t).has(sp)) continue;
        const wb = widthAtBirth(el, t - 1, sp);
        if (wb >= 0.002) problems.push(`${t} °C: ${sp} ${prev.fields.has(sp) ? 'vanished' : 'appeared'} (width ${(wb * 1000).toFixed(1)} mV at birth)`);
      }
      const moves = new Map<string, number>();
      for (const [k, a] of prev.lines) {
        const b = cur.lines.get(k);
        if (!b || b.kind !== a.kind) continue;
        if (a.kind === 'pH') {
          const d = Math.abs(b.at(a.midPH) - a.at(a.midPH));
          if (d > 0.085) problems.push(`${t} °C: ${k} moved ${d.toFixed(3)} pH`);
          continue;
        }
        // E lines: the move after taking out the exact RT/F scaling of the Nernst terms (activity and
        // pH terms ∝ T: a line of slope 4·RT ln10/F moves 11 mV/K at pH 14 from that alone).
        const T = t - 1 + 273.15;
        const d = b.e0 - a.e0 + b.nernst(a.midPH) * (T / (T + 1)) - a.nernst(a.midPH);
        moves.set(k, d);
        if (Math.abs(d) > (STEEP[k] ?? 0.005)) problems.push(`${t} °C: ${k} moved ${(d * 1000).toFixed(1)} mV`);
        const p = prevMoves.get(k);
        if (p !== undefined && Math.abs(d - p) > 0.001) problems.push(`${t} °C: ${k} jumped (${(p * 1000).toFixed(2)} then ${(d * 1000).toFixed(2)} mV/K)`);
      }
      prevMoves = moves;
      prev = cur;
    }
    expect(problems.slice(0, 8)).toEqual([]);
  });
});
