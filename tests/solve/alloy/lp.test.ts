import { describe, expect, it } from 'vitest';
import { LpError, solveLp } from '../../../src/solve/alloy/lp.js';

describe('dense simplex (Bland rule), the LP of the alloy assemblage', () => {
  it('worked example of the module comment: n = [0, 0, 1], objective −1', () => {
    const s = solveLp({ A: [[1, 0, 1], [0, 1, 2]], b: [1, 2], c: [0, 0, -1], basis: [0, 1] });
    expect(s.basis).toContain(2);
    expect(s.objective).toBeCloseTo(-1, 12);
    expect(s.ties).toEqual([]);
  });

  it('a textbook LP: min −x − y, x + 2y + s1 = 4, 3x + y + s2 = 6 → x = 1.6, y = 1.2 (vertex by hand)', () => {
    // Vertex of x + 2y = 4 and 3x + y = 6: y = 6/5, x = 8/5; objective −14/5.
    const s = solveLp({ A: [[1, 2, 1, 0], [3, 1, 0, 1]], b: [4, 6], c: [-1, -1, 0, 0], basis: [2, 3] });
    const val = (j: number) => s.values[s.basis.indexOf(j)] ?? 0;
    expect(val(0)).toBeCloseTo(1.6, 12);
    expect(val(1)).toBeCloseTo(1.2, 12);
    expect(s.objective).toBeCloseTo(-2.8, 12);
  });

  it('reports alternative optima (a tie) instead of picking silently', () => {
    // Column 2 = ½(col 0 + col 1) with cost ½(c0 + c1): equal objective along the edge.
    const s = solveLp({ A: [[1, 0, 0.5], [0, 1, 0.5]], b: [0.5, 0.5], c: [-1, -3, -2], basis: [0, 1] });
    expect(s.objective).toBeCloseTo(-2, 12);
    expect(s.ties.length).toBe(1);
  });

  it('terminates on a degenerate vertex (b on a column: a basic variable at zero)', () => {
    const s = solveLp({ A: [[1, 0, 1, 2], [0, 1, 1, 1]], b: [1, 1], c: [0, 0, -1, -1.5], basis: [0, 1] });
    // n2 = 1 alone holds b exactly (objective −1); n3 = 0.5 with n1 = 0.5 gives −0.75.
    expect(s.objective).toBeCloseTo(-1, 12);
  });

  it('refuses an infeasible or malformed start', () => {
    expect(() => solveLp({ A: [[1, 1], [0, 1]], b: [1, 2], c: [0, 0], basis: [0, 1] })).toThrow(LpError);
    expect(() => solveLp({ A: [[1, 1]], b: [1], c: [0], basis: [0] })).toThrow(LpError);
  });

});
