import { describe, expect, test } from 'vitest';
import { luFactor, luSolve, luSolveT } from '../../src/solve/linalg.js';

// Values worked by hand (two-by-two systems solved by substitution).
describe('shared LU kernel (src/solve/linalg.ts)', () => {
  test('A = [[0, 1], [2, 3]] needs a row swap: A x = [1, 8] → x = [2.5, 1]; Aᵀ y = [4, 5] → y = [−1, 2]', () => {
    const a = new Float64Array([0, 1, 2, 3]);
    const perm = new Int32Array(2);
    expect(luFactor(a, 2, perm, { tol: 1e-12 })).toBe(true);
    expect([...perm]).toEqual([1, 0]);
    const x = new Float64Array(2);
    luSolve(a, 2, perm, [1, 8], x);
    expect([...x]).toEqual([2.5, 1]);
    const y = new Float64Array(2);
    luSolveT(a, 2, perm, [4, 5], y, new Float64Array(2));
    expect([...y]).toEqual([-1, 2]);
  });
  test('the pivot test: relative to a fixed scale when given, else to the column (at least 1)', () => {
    const perm = new Int32Array(2);
    // [[1e-13, 0], [0, 1e-13]]: pivots 1e-13 ≤ 1e-12·max(1, 1e-13) → singular under the column test.
    expect(luFactor(new Float64Array([1e-13, 0, 0, 1e-13]), 2, perm, { tol: 1e-12 })).toBe(false);
    // Same matrix against its own scale (1e-13): 1e-13 > 1e-12·1e-13 → regular.
    expect(luFactor(new Float64Array([1e-13, 0, 0, 1e-13]), 2, perm, { tol: 1e-12, scale: 1e-13 })).toBe(true);
    expect(luFactor(new Float64Array([1, 2, 2, 4]), 2, perm, { tol: 1e-12 })).toBe(false);
  });
});
