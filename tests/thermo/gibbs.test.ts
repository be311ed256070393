/**
 * Apparent G(T), H(T), S(T) and the third-law entropy from formation data.
 * Data: H2O(l), H2(g), O2(g) from the NBS 1982 tables (Wagman et al.), recalled from memory — as in
 * the project's water check values.
 */
import { describe, expect, it } from 'vitest';
import { apparentG, apparentH, entropyAt, entropyFromFormation } from '../../src/thermo/gibbs.js';

const H2O = { dfG: -237.129, dfH: -285.83, S: 69.91, Cp: 75.291 };
const H2Oraw = H2O;
const H2 = { dfG: 0, dfH: 0, S: 130.684, Cp: 28.824 };
const O2 = { dfG: 0, dfH: 0, S: 205.138, Cp: 29.355 };

describe('apparent G(T)', () => {
  it('worked example: H2O(l) at 80 °C is −241.334 kJ/mol (constant Cp)', () => {
    // −237.129 − 0.06991·55 + 0.075291·(55 − 353.15·ln(353.15/298.15)), by hand
    expect(apparentG(H2O, 353.15)).toBeCloseTo(-241.334, 3);
  });

  it('worked examples: H(T) = −281.689 kJ/mol and S(T) = 82.66 J/(mol·K) for H2O(l) at 80 °C', () => {
    expect(apparentH(H2O, 353.15)).toBeCloseTo(-281.689, 3);
    expect(entropyAt(H2O, 353.15)).toBeCloseTo(82.66, 2);
  });

  it('with Cp = 0, ΔrG(T) equals ΔrH° − T·ΔrS° for 2H2 + O2 = 2H2O(l) (the textbook approximation)', () => {
    // Make ΔfG° exactly ΔfH° − T_r·ΔfS° so the identity is a test of the formula, not of the tables'
    // rounding (the NBS values themselves agree to 0.3 J/mol).
    const H2O = { ...H2Oraw, dfG: H2Oraw.dfH - (298.15 * (H2Oraw.S - H2.S - O2.S / 2)) / 1000 };
    for (const T of [273.15, 323.15, 373.15, 473.15, 573.15]) {
      const dG = 2 * apparentG(H2O, T, 'constant-h-s') - 2 * apparentG(H2, T, 'constant-h-s') - apparentG(O2, T, 'constant-h-s');
      const dH = 2 * H2O.dfH;
      const dS = (2 * H2O.S - 2 * H2.S - O2.S) / 1000;
      expect(dG).toBeCloseTo(dH - T * dS, 9);
    }
  });

  it('with constant Cp, G(T) satisfies G = H − T·S for a reaction (Gibbs–Helmholtz consistency)', () => {
    const H2O = { ...H2Oraw, dfG: H2Oraw.dfH - (298.15 * (H2Oraw.S - H2.S - O2.S / 2)) / 1000 };
    const T = 423.15;
    const dG = 2 * apparentG(H2O, T) - 2 * apparentG(H2, T) - apparentG(O2, T);
    const dH = 2 * apparentH(H2O, T) - 2 * apparentH(H2, T) - apparentH(O2, T);
    const dS = (2 * entropyAt(H2O, T) - 2 * entropyAt(H2, T) - entropyAt(O2, T)) / 1000;
    expect(dG).toBeCloseTo(dH - T * dS, 9);
  });

  it('needs S° away from 298.15 K', () => {
    expect(() => apparentG({ dfG: -10 }, 350)).toThrow(/S°/);
    expect(apparentG({ dfG: -10 }, 298.15)).toBe(-10);
  });
});

describe('S° from ΔfG° and ΔfH°', () => {
  const sEl: Record<string, number> = { H: 130.684 / 2, O: 205.138 / 2 }; // NBS 1982, per atom
  it('H+ has S° = 0 on the conventional scale', () => {
    expect(entropyFromFormation(0, 0, { H: 1 }, 1, (e) => sEl[e])).toBeCloseTo(0, 12);
  });
  it('H2O(l): S° = (ΔfH° − ΔfG°)/T + S°(H2) + ½S°(O2) = 69.91 J/(mol·K) (NBS 1982)', () => {
    expect(entropyFromFormation(-237.129, -285.83, { H: 2, O: 1 }, 0, (e) => sEl[e])).toBeCloseTo(69.91, 1);
  });
});
