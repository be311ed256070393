/**
 * Issue 15, defect 4: `lines` lists each disjoint segment of a reaction with its own span. With
 * ammonia (N activity 1e-2) the Cu(NH3)2+ field lies between Cu and Cu2O over part of the pH range,
 * so the Cu/Cu2O line is two segments, not one from pH 6 to 13.
 */
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { lineRows, linesText } from '../../src/report/lines.js';

describe('lines: disjoint segments', () => {
  const c = compute(readSpec({ element: 'Cu', ligands: { N: 1e-2 }, pH: [6, 13] }, 'cu.yaml'));
  const complex = c.model.regions.find((r) => r.species === 'Cu(NH3)2^+')!;
  const xs = complex.polygons.flat(2).map((p) => p[0]);
  const [lo, hi] = [Math.min(...xs), Math.max(...xs)];
  it('gives Cu/Cu2O as separate rows that skip the pH span where Cu(NH3)2+ borders Cu', () => {
    const rows = lineRows(c.model).filter((r) => r.between.includes('Cu') && r.between.includes('Cu2O'));
    expect(rows.length).toBeGreaterThan(1);
    for (const r of rows) {
      // No segment crosses the interior of the complex's pH span.
      expect(r.pHRange[1] <= lo + 1e-6 || r.pHRange[0] >= hi - 1e-6).toBe(true);
    }
    expect(rows[0].pHRange[0]).toBeCloseTo(6, 6);
    expect(rows[rows.length - 1].pHRange[1]).toBeCloseTo(13, 6);
  });
  it('prints one line per segment', () => {
    const t = linesText(c.model).split('\n').filter((l) => /^Cu \/ Cu₂O /.test(l));
    expect(t.length).toBeGreaterThan(1);
    expect(t.join('\n')).not.toContain('6.00–13.00');
  });
});
