/**
 * Corrosion-workflow keys of a system file: the reference electrode potentials are given in,
 * verdict reclassifications, and operating points, envelopes (boxes) and paths.
 *   reference: sce | {name: "my probe", potential: 0.205, dEdT: -0.0007}   (V vs SHE at 25 °C, V/K)
 *   classes:   {FeCO3: corrosion}
 *   points:    [{label: "loop outlet", pH: 9.2, E: -0.45}]           (E in the reference scale)
 *   boxes:     [{label: "normal operation", pH: [8.8, 9.6], E: [-0.55, -0.35]}]
 *   paths:     [{label: "start-up", points: [[7, -0.2], [8.5, -0.4], [9.2, -0.45]]}]
 */
import { VERDICTS, type Verdict } from '../diagram/verdict.js';
import { type CustomReference, findReference } from '../thermo/reference.js';
import type { Fields } from './fields.js';

export interface OperatingPoint {
  label: string;
  pH: number;
  /** As given, in the reference scale. */
  E: number;
}

export interface Operating {
  reference?: string | CustomReference;
  classes: Record<string, Verdict>;
  points: OperatingPoint[];
  boxes: { label: string; pH: [number, number]; E: [number, number] }[];
  paths: { label: string; points: [number, number][] }[];
}

export function readReference(f: Fields, v: unknown, field: string): string | CustomReference {
  if (typeof v === 'string') {
    try {
      return findReference(v).id;
    } catch (e) {
      f.fail(field, (e as Error).message.replace(/^[^:]*:\s*/, ''), v);
    }
  }
  const o = f.object(v, field, ['name', 'potential', 'dEdT']);
  const ref: CustomReference = {
    name: f.string(o.name, `${field}.name`, 'a name for the electrode', 60).replace(/[<>&"]/g, ''),
    potential: f.number(o.potential, `${field}.potential`, { min: -3, max: 3 }),
  };
  if (o.dEdT !== undefined) ref.dEdT = f.number(o.dEdT, `${field}.dEdT`, { min: -0.01, max: 0.01 });
  return ref;
}

export function readOperating(f: Fields, extra: Record<string, unknown>): Operating {
  const op: Operating = { classes: Object.create(null), points: [], boxes: [], paths: [] };
  if (extra.reference !== undefined) op.reference = readReference(f, extra.reference, 'reference');
  if (extra.classes !== undefined) {
    for (const [k, v] of f.entries(extra.classes, 'classes', 'a map of formula → immunity, passivation or corrosion')) op.classes[k] = f.oneOf(v, `classes.${k}`, VERDICTS);
  }
  const label = (v: unknown, field: string, k: number, kind: string) => (v === undefined ? `${kind} ${k + 1}` : f.string(v, field, 'a label text', 80));
  if (extra.points !== undefined) {
    op.points = f.list(extra.points, 'points', 1000).map((p, k) => {
      const o = f.object(p, `points[${k}]`, ['label', 'pH', 'E']);
      return { label: label(o.label, `points[${k}].label`, k, 'point'), pH: f.number(o.pH, `points[${k}].pH`, { min: -3, max: 17 }), E: f.number(o.E, `points[${k}].E`, { min: -5, max: 5 }) };
    });
  }
  if (extra.boxes !== undefined) {
    op.boxes = f.list(extra.boxes, 'boxes', 100).map((b, k) => {
      const o = f.object(b, `boxes[${k}]`, ['label', 'pH', 'E']);
      return {
        label: label(o.label, `boxes[${k}].label`, k, 'envelope'),
        pH: f.range(o.pH, `boxes[${k}].pH`, [0, 0], { min: -3, max: 17, unit: 'pH' }),
        E: f.range(o.E, `boxes[${k}].E`, [0, 0], { min: -5, max: 5, unit: 'V' }),
      };
    });
    for (const [k, b] of op.boxes.entries()) if (b.pH[0] === b.pH[1]) f.fail(`boxes[${k}].pH`, '[min, max]');
  }
  if (extra.paths !== undefined) {
    op.paths = f.list(extra.paths, 'paths', 100).map((p, k) => {
      const o = f.object(p, `paths[${k}]`, ['label', 'points']);
      const pts = f.list(o.points, `paths[${k}].points`, 10000).map((q, m) => {
        const field = `paths[${k}].points[${m}]`;
        if (!Array.isArray(q) || q.length !== 2) f.fail(field, '[pH, E]', q);
        return [f.number(q[0], `${field}[0]`, { min: -3, max: 17 }), f.number(q[1], `${field}[1]`, { min: -5, max: 5 })] as [number, number];
      });
      if (pts.length < 2) f.fail(`paths[${k}].points`, 'at least two [pH, E] points');
      return { label: label(o.label, `paths[${k}].label`, k, 'path'), points: pts };
    });
  }
  return op;
}
