/**
 * The operating points, boxes and paths of a system file placed on a figure: each potential, given
 * in the file's reference scale, is converted to the SHE scale of the drawing at its own pH
 * (a box at the middle of its pH span), since a pH-dependent reference electrode shifts with pH.
 */
import type { FigureInput } from '../render/scene.js';
import type { Operating } from '../system/operating.js';
import { referenceOffset } from '../thermo/reference.js';

/** Sets input.points / boxes / paths from `op` (only those the file gives), at temperature `celsius` (°C). */
export function placeOperatingMarks(input: FigureInput, op: Operating, celsius: number): void {
  const ref = op.reference;
  const she = (E: number, pH: number) => (ref === undefined ? E : E + referenceOffset(ref, celsius, pH).offset);
  if (op.points.length) input.points = op.points.map((p) => ({ label: p.label, pH: p.pH, E: she(p.E, p.pH) }));
  if (op.boxes.length) {
    input.boxes = op.boxes.map((b) => {
      const mid = (b.pH[0] + b.pH[1]) / 2;
      return { label: b.label, pH: b.pH, E: [she(b.E[0], mid), she(b.E[1], mid)] as [number, number] };
    });
  }
  if (op.paths.length) input.paths = op.paths.map((p) => ({ label: p.label, points: p.points.map(([x, y]) => [x, she(y, x)] as [number, number]) }));
}
