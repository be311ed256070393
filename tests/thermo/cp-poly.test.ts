import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/data/library.js';
import { cpAt, polynomialG } from '../../src/thermo/cp-poly.js';

describe('Maier–Kelley polynomial G', () => {
  it('worked example: a = 50, b = 0.01, c = −1e6, ΔfG° = −300, S° = 40 at 473.15 K equals G by numerical integration', () => {
    const p = { a: 50, b: 0.01, c: -1e6 };
    // Independent route: G(T) = ΔfG° − ∫_{Tr}^{T} S(T') dT', S(T') = S° + ∫ Cp/T, midpoint rule.
    const Tr = 298.15, T = 473.15, n = 20000, h = (T - Tr) / n;
    let S = 40, G = -300 * 1000;
    for (let i = 0; i < n; i++) {
      const t = Tr + (i + 0.5) * h;
      const Smid = S + (cpAt(p, t - h / 4) / (t - h / 4)) * (h / 2);
      G -= Smid * h;
      S += (cpAt(p, t) / t) * h;
    }
    expect(polynomialG(-300, 40, p, T)).toBeCloseTo(G / 1000, 3);
  });
  it('library polynomials (Kelley 1960, recalled) give the library Cp° at 25 °C within 3 % (copying check)', () => {
    const withPoly = loadLibrary().filter((s) => s.cpPolynomial);
    expect(withPoly.length).toBeGreaterThanOrEqual(6);
    for (const s of withPoly) {
      expect(s.Cp, s.formula).toBeDefined();
      expect(Math.abs(cpAt(s.cpPolynomial!, 298.15) / s.Cp! - 1), s.formula).toBeLessThan(0.03);
    }
  });
});
