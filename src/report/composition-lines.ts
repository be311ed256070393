/**
 * The `lines` report in composition mode: boundaries here are curves (equal shares of the element
 * between two forms, refined point by point), so each boundary polyline is given with the dominant
 * exchange reaction at its midpoint (actual activities there) and its pH and E span — never a
 * straight-line equation. Computes nothing beyond the spans.
 */
import { formulaForPeople, reactionForPeople } from '../chem/present.js';
import type { DiagramModel } from '../model.js';
import type { DisplayReference } from './lines.js';
import { table } from './table.js';

export interface CompositionLineRow {
  between: [string, string];
  /** Always 'curve': the boundary is a refined polyline, not a line. */
  shape: 'curve';
  /** The dominant exchange reaction at the polyline's midpoint. */
  reaction: string;
  midpoint: { pH: number; E: number };
  pHRange: [number, number];
  ERange: [number, number];
  /** The E span against a reference electrode, when one is asked for. */
  ERangeRef?: [number, number];
  /** Number of refined vertices. */
  vertices: number;
}

/** One row per boundary polyline, in the model's order. */
export function compositionLineRows(model: DiagramModel, ref?: DisplayReference): CompositionLineRow[] {
  return model.boundaries.map((b) => {
    const xs = b.points.map((p) => p[0]);
    const ys = b.points.map((p) => p[1]);
    const mid = b.points[Math.floor(b.points.length / 2)];
    const ERange: [number, number] = [Math.min(...ys), Math.max(...ys)];
    return {
      between: b.between,
      shape: 'curve' as const,
      reaction: b.reaction,
      midpoint: { pH: mid[0], E: mid[1] },
      pHRange: [Math.min(...xs), Math.max(...xs)] as [number, number],
      ERange,
      ...(ref ? { ERangeRef: [ERange[0] - ref.offset, ERange[1] - ref.offset] as [number, number] } : {}),
      vertices: b.points.length,
    };
  });
}

export function compositionLinesText(model: DiagramModel, ref?: DisplayReference): string {
  const rows = compositionLineRows(model, ref);
  const totals = Object.entries(model.composition?.totals ?? {}).map(([c, v]) => `${c} ${Number(v.toPrecision(6))}`).join(', ');
  const head = `${model.element} at ${model.temperature.celsius} °C, the bath as made up (totals ${totals} mol/kg).\n` +
    'Boundaries are curves (equal shares of the element between the two forms, refined point by point): each is given with the exchange reaction at its midpoint and its span, not a line equation.\n' +
    'Potentials in V vs SHE at the diagram temperature.';
  const f = (v: number, d: number) => v.toFixed(d);
  const body = table(
    ['boundary', 'shape', 'reaction at midpoint', 'midpoint (pH, E)', 'pH span', 'E span / V', ...(ref ? [`E span vs ${ref.label}`] : [])],
    rows.map((r) => [
      r.between.map(formulaForPeople).join(' / '),
      r.shape,
      reactionForPeople(r.reaction),
      `${f(r.midpoint.pH, 2)}, ${f(r.midpoint.E, 3)}`,
      `${f(r.pHRange[0], 2)}–${f(r.pHRange[1], 2)}`,
      `${f(r.ERange[0], 3)} … ${f(r.ERange[1], 3)}`,
      ...(ref ? [`${f(r.ERangeRef![0], 3)} … ${f(r.ERangeRef![1], 3)}`] : []),
    ]),
  );
  const water = [model.waterLines.hydrogen, model.waterLines.oxygen].map((w) => `  ${reactionForPeople(w.reaction)}: ${w.equation}`).join('\n');
  return `${head}\n\n${body}\n\nWater lines (H₂ ${model.waterLines.pressures.H2} bar, O₂ ${model.waterLines.pressures.O2} bar):\n${water}\n`;
}
