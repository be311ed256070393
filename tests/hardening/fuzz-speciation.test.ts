/**
 * Property-based invariants of the composition point solver (fast-check): wherever it reports 'ok',
 * the mass balances close, solids present have non-negative amounts, absent solids are not
 * supersaturated, and shares of the element sum to 1; otherwise it says 'failed' with a reason.
 */
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { describePoint } from '../../src/solve/speciation/index.js';
import { readSpec } from '../../src/system/spec.js';

const cases = [
  { element: 'Ag', lig: 'CN' },
  { element: 'Cu', lig: 'N' },
  { element: 'Zn', lig: 'CN' },
  { element: 'Ni', lig: 'N' },
];

describe('speciation invariants', () => {
  test('mass balance, phase rule and saturation hold at random points and totals', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...cases),
        fc.double({ min: -6, max: 0, noNaN: true }),
        fc.double({ min: -6, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 14, noNaN: true }),
        fc.double({ min: -1.5, max: 1.5, noNaN: true }),
        fc.boolean(),
        (c, lm, ll, pH, E, auto) => {
          const spec = readSpec({ element: c.element, composition: { [c.element]: 10 ** lm, [c.lig]: 10 ** ll }, ...(auto ? { ionicStrength: 'auto' } : {}) }, 'fuzz.yaml');
          const S = compositionSetup(spec);
          const P = S.solver.problem;
          const sol = S.solver.solve(pH, E);
          if (sol.status !== 'ok') {
            expect(sol.reason).toBeTruthy();
            return;
          }
          const nc = P.components.length;
          expect(sol.active.length).toBeLessThanOrEqual(nc);
          for (let c2 = 0; c2 < nc; c2++) {
            let t = 0;
            for (let i = 0; i < P.nAq; i++) t += P.A[i * nc + c2] * sol.m[i];
            sol.active.forEach((k, q) => (t += P.A[k * nc + c2] * sol.lambda[q]));
            expect(Math.abs(t / P.totals[c2] - 1)).toBeLessThan(1e-8);
          }
          const r = describePoint(P, sol);
          for (const s of r.solids) expect(s.amount).toBeGreaterThanOrEqual(0);
          for (const s of r.saturation) expect(s.logSI).toBeLessThanOrEqual(1e-8);
          const sum = r.shares[c.element].reduce((a, x) => a + x.share, 0);
          expect(Math.abs(sum - 1)).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 300, seed: 13 },
    );
  });
});
