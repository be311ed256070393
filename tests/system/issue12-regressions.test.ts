/**
 * Regressions from issue 12 (each failed before the temperature model): library species with only
 * ΔfG° were dropped as soon as T ≠ 25 °C, which flipped verdicts between 25 and 26 °C, and the ions
 * were carried with constant ΔH/ΔS. Expected values: the 25 °C answer ("common practice": a
 * diagram cannot change its verdict over 1 K) and the issue's own observations.
 */
import { describe, expect, it } from 'vitest';
import { solve } from '../../src/solve/solve.js';
import { psiAt } from '../../src/solve/point.js';
import { buildSystem } from '../../src/system/build.js';
import { readSpec } from '../../src/system/spec.js';

function winner(element: string, t: number, pH: number, E: number): string {
  const b = buildSystem(readSpec({ element, temperature: t }, `issue12 ${element}`));
  const { psi } = psiAt(b.input, pH, E);
  let k = 0;
  psi.forEach((v, i) => {
    if (v < psi[k]!) k = i;
  });
  return b.input.species[k]!.formula;
}

describe('issue 12 regressions', () => {
  it('zinc at pH 13, −0.5 V stays zincate (corrosion) from 25 to 26 °C', () => {
    expect(winner('Zn', 25, 13, -0.5)).toBe('ZnO2^2-');
    expect(winner('Zn', 26, 13, -0.5)).toBe('ZnO2^2-');
  });
  it('chromium at pH 1, −0.3 V keeps its 25 °C species at 26 °C', () => {
    expect(winner('Cr', 26, 1, -0.3)).toBe(winner('Cr', 25, 1, -0.3));
  });
  it('gold at 30 °C has boundaries', () => {
    const b = buildSystem(readSpec({ element: 'Au', temperature: 30 }, 'issue12 Au'));
    expect(solve(b.input).boundaries.length).toBeGreaterThan(0);
  });
  it('no "left out" warning for any library metal at 26, 150 and 300 °C', () => {
    for (const el of ['Fe', 'Cu', 'Zn', 'Ni', 'Cr', 'Al', 'Co', 'Sn', 'Pb', 'Ag', 'Au', 'Ti', 'Mn', 'Mo']) {
      for (const t of [26, 150, 300]) {
        const b = buildSystem(readSpec({ element: el, temperature: t }, 'x'));
        expect(b.warnings.join(' '), `${el} ${t} °C`).not.toMatch(/left out/);
      }
    }
  });
});
