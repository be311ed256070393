/** Worked examples of the tracing and speciation building blocks (values computed by hand). */
import { describe, expect, test } from 'vitest';
import { contourRings } from '../../src/solve/trace/contour.js';
import { refineCrossing } from '../../src/solve/trace/refine.js';
import { solveDense } from '../../src/solve/linalg.js';
import { speciationIonicStrength } from '../../src/solve/speciation/gamma.js';
import type { SpeciationProblem } from '../../src/solve/speciation/problem.js';

describe('building blocks', () => {
  test('solveDense: [[2, 1], [1, 3]]·x = [3, 5] → x = [0.8, 1.4]; singular refused', () => {
    const b = new Float64Array([3, 5]);
    expect(solveDense(new Float64Array([2, 1, 1, 3]), b, 2)).toBe(true);
    expect(b[0]).toBeCloseTo(0.8, 14);
    expect(b[1]).toBeCloseTo(1.4, 14);
    expect(solveDense(new Float64Array([1, 2, 2, 4]), new Float64Array([1, 1]), 2)).toBe(false);
  });
  test('refineCrossing: a line is found in one step; a curve to the tolerance, with the far side named', () => {
    expect(refineCrossing((t) => t - 0.3, -0.3, 0.7, 1e-12).t).toBeCloseTo(0.3, 12);
    const c = refineCrossing((t) => 0.5 - t * t * t, 0.5, -0.5, 1e-10);
    expect(c.t).toBeCloseTo(Math.cbrt(0.5), 9);
    expect(c.tOut).toBeGreaterThanOrEqual(c.t);
  });
  test('contourRings undoes d3-contour offsets: v = x − 1.3 on a 4×3 grid over [0, 3]×[0, 2] crosses at x = 1.3', () => {
    const v: number[] = [];
    for (let j = 0; j < 3; j++) for (let i = 0; i < 4; i++) v.push(i - 1.3);
    const rings = contourRings({ nx: 4, ny: 3, x: [0, 3], y: [0, 2] }, v, 0);
    const cross = rings[0][0].filter((p) => !p.frame);
    expect(cross.length).toBe(3);
    for (const p of cross) expect(p.x).toBeCloseTo(1.3, 12);
    expect(cross.map((p) => p.y).sort()).toEqual([0, 1, 2]);
    for (const p of rings[0][0].filter((q) => q.frame)) {
      expect(p.x).toBeGreaterThanOrEqual(0);
      expect(p.x).toBeLessThanOrEqual(3);
      expect(p.y).toBeGreaterThanOrEqual(0);
      expect(p.y).toBeLessThanOrEqual(2);
    }
  });
  test('ionic strength of a speciation: 0.2 Ag(CN)2- + 0.2 CN- at pH 12 with K+ counter-ions ≈ 0.41', () => {
    const P = { nAq: 2, charge: new Float64Array([-1, -1]), logKw: -14 } as unknown as SpeciationProblem;
    // ½(0.2 + 0.2 + 1e-12 + 0.01) + ½|−0.4 + 1e-12 − 0.01| = 0.205 + 0.205.
    expect(speciationIonicStrength(P, new Float64Array([0.2, 0.2]), 12, 0)).toBeCloseTo(0.41, 10);
  });
});
