/** The work budget grid² × species × (1 + families) ≤ 1e9 (src/system/budget.ts). */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { checkWorkBudget, familiesRequested, largestGrid, WORK_BUDGET, workUnits } from '../../src/system/budget.js';

describe('work budget', () => {
  it('worked example: 200² × 50 × 1 = 2e6 units, well within', () => {
    expect(workUnits({ grid: 200, species: 50, families: 0 })).toBe(2e6);
    expect(() => checkWorkBudget({ grid: 200, species: 50, families: 0 }, 'f.yaml')).not.toThrow();
  });

  it('the largest grid fits and one more does not', () => {
    const g = largestGrid(2000, 8);
    expect(g).toBe(235); // √(1e9 / 18000) = 235.7
    expect(workUnits({ grid: g, species: 2000, families: 8 })).toBeLessThanOrEqual(WORK_BUDGET);
    expect(workUnits({ grid: g + 1, species: 2000, families: 8 })).toBeGreaterThan(WORK_BUDGET);
    expect(() => checkWorkBudget({ grid: g + 1, species: 2000, families: 8 }, 'f.yaml')).toThrow(InputError);
  });

  it('the default grid with the largest families and a large library system fits', () => {
    expect(() => checkWorkBudget({ grid: 200, species: 2000, families: 8 }, 'f.yaml')).not.toThrow();
  });

  it('families are counted from figure.families, else families', () => {
    expect(familiesRequested({ figure: { families: [1, 0.1] } })).toBe(2);
    expect(familiesRequested({ families: [1, 0.1, 0.01] })).toBe(3);
    expect(familiesRequested({ figure: {} })).toBe(0);
    expect(familiesRequested({})).toBe(0);
  });
});
