import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/chem/formula.js';
import { formulaMatches } from '../../src/chem/match.js';
import { pointInRing } from '../../src/solve/merge.js';
import { psiAt } from '../../src/solve/point.js';
import { solve } from '../../src/solve/solve.js';
import { nernstSlope } from '../../src/thermo/constants.js';
import type { SolverInput } from '../../src/solve/types.js';
import { IRON, WATER } from './iron-inline.js';

const F = 96485.33212; // CODATA 2018
const R = 8.314462618; // CODATA 2018
const s25 = (Math.LN10 * R * 298.15) / F; // Nernst slope ln10·RT/F, 0.059159 V (CODATA 2018 constants)

function ironInput(a = 1e-6): SolverInput {
  return {
    element: 'Fe',
    kelvin: 298.15,
    species: IRON.map((d) => {
      const f = parseFormula(d.formula);
      return { formula: d.formula, phase: d.phase, elements: f.elements, charge: f.charge, G: d.dfG, logActivity: d.phase === 'aq' ? Math.log10(a) : 0, activity: a };
    }),
    ligands: [],
    water: { H2O: WATER.H2O.dfG, H2: 0, O2: 0 },
    pressures: { H2: 1, O2: 1 },
    pH: [0, 14],
    E: [-1.2, 1.6],
  };
}

describe('iron at 25 °C, dissolved activity 1e-6 (NBS 1982 data, recalled from memory)', () => {
  const input = ironInput();
  const sol = solve(input);
  // The inline iron species are written in the older notation (Fe+2): name them in any notation.
  const is = (x: string, y: string) => formulaMatches(y, x);
  const find = (a: string, b: string) => sol.boundaries.filter((x) => (is(x.between[0], a) && is(x.between[1], b)) || (is(x.between[0], b) && is(x.between[1], a)));

  it('Nernst slope is 59.16 mV per pH at 25 °C (ln10·RT/F, CODATA 2018 constants), in thermo and in the solved water line', () => {
    // 59.16 mV: ln10·RT/F with R = 8.314462618 J/(mol·K), F = 96485.33212 C/mol (CODATA 2018).
    expect(nernstSlope(298.15) * 1000).toBeCloseTo(59.16, 2);
    expect(nernstSlope(298.15)).toBeCloseTo(s25, 12);
    // The hydrogen line E = −s·pH at p(H2) = 1 bar: its slope is −s (common practice).
    expect(sol.waterLines.hydrogen.line.slope).toBeCloseTo(-s25, 9);
  });

  it('Fe+2/Fe: E = ΔfG°(Fe+2)/(2F) + (s/2)·log a, horizontal', () => {
    const [b] = find('Fe', 'Fe^2+');
    expect(b).toBeDefined();
    const expected = (-78.9e3) / (2 * F) + (s25 / 2) * -6; // −0.58635 V by hand
    expect(b.line.kind).toBe('E');
    expect(b.line.intercept!).toBeCloseTo(expected, 9);
    expect(b.line.slope!).toBeCloseTo(0, 12);
    expect(b.line.n).toBe(2);
    expect(b.reaction).toBe('Fe^2+ + 2e^- <=> Fe(s)'); // JSON's canonical form, whatever the input spelling
    for (const [, E] of b.points) expect(Math.abs(E - expected)).toBeLessThan(1e-7);
  });

  it('Fe3O4/Fe: slope −(8/8)·s, E° from ΔrG° = 4ΔfG°(H2O) − ΔfG°(Fe3O4)', () => {
    const [b] = find('Fe', 'Fe3O4');
    const E0 = -(4 * -237.129 - -1015.4) * 1000 / (8 * F); // −0.08665 V
    expect(b.line.slope!).toBeCloseTo(-s25, 12);
    expect(b.line.intercept!).toBeCloseTo(E0, 9);
    expect(b.line.E0!).toBeCloseTo(E0, 9);
    expect(b.reaction).toBe('Fe3O4(s) + 8H^+ + 8e^- <=> 3Fe(s) + 4H2O(l)');
  });

  it('Fe2O3/Fe3O4: slope −(2/2)·s, E° = −[2ΔfG°(Fe3O4) + ΔfG°(H2O) − 3ΔfG°(Fe2O3)]/(2F)', () => {
    const [b] = find('Fe3O4', 'Fe2O3');
    const E0 = -(2 * -1015.4 + -237.129 - 3 * -742.2) * 1000 / (2 * F); // +0.21417 V
    expect(b.line.slope!).toBeCloseTo(-s25, 12);
    expect(b.line.intercept!).toBeCloseTo(E0, 9);
    expect(b.reaction).toBe('3Fe2O3(s) + 2H^+ + 2e^- <=> 2Fe3O4(s) + H2O(l)');
    // Every vertex lies on the exact line.
    for (const [pH, E] of b.points) expect(Math.abs(E - (E0 - s25 * pH))).toBeLessThan(1e-7);
  });

  it('Fe+3/Fe+2 is horizontal at E° + 0 (equal activities), E° = (ΔfG°(Fe+3) − ΔfG°(Fe+2))/F', () => {
    const bs = find('Fe^2+', 'Fe^3+');
    const E0 = (-4.7 - -78.9) * 1000 / F; // 0.769 V
    expect(bs.length).toBeGreaterThan(0);
    expect(bs[0].line.intercept!).toBeCloseTo(E0, 9);
  });

  it('regions tile the domain: areas add up to the rectangle', () => {
    const total = sol.regions.reduce((s, r) => s + r.area, 0);
    expect(Math.abs(total - 14 * 2.8)).toBeLessThan(1e-9 * 14 * 2.8);
  });

  it('triple points are exact three-line intersections (Fe, Fe+2, Fe3O4)', () => {
    const tp = sol.triplePoints.find((t) => ['Fe', 'Fe^2+', 'Fe3O4'].every((x) => t.species.some((y) => is(y, x))));
    expect(tp).toBeDefined();
    const E = -78.9e3 / (2 * F) + (s25 / 2) * -6;
    const E0 = -(4 * -237.129 - -1015.4) * 1000 / (8 * F);
    expect(tp!.E).toBeCloseTo(E, 10);
    expect(tp!.pH).toBeCloseTo((E0 - E) / s25, 9);
  });

  it('water lines at 25 °C: 0 − s·pH and 1.2288 − s·pH (water-facts: E°(O2/H2O) = 1.229 V)', () => {
    expect(sol.waterLines.hydrogen.line.intercept!).toBeCloseTo(0, 12);
    expect(sol.waterLines.oxygen.line.intercept!).toBeCloseTo(1.229, 3);
    expect(sol.waterLines.oxygen.line.slope!).toBeCloseTo(-s25, 12);
  });

  it('the exact ψ argmin agrees with the polygons on a point grid', () => {
    let checked = 0;
    for (let i = 0; i <= 40; i++) {
      for (let j = 0; j <= 40; j++) {
        const pH = 0.01 + (13.98 * i) / 40;
        const E = -1.19 + (2.78 * j) / 40;
        const { psi } = psiAt(input, pH, E);
        const order = psi.map((v, k) => [v, k]).sort((a, b) => a[0] - b[0]);
        if (order[1][0] - order[0][0] < 0.05) continue; // within ~0.5 mV of a boundary
        const winner = input.species[order[0][1]].formula;
        const region = sol.regions.find((r) => r.polygons.some((p) => pointInRing(p[0], pH, E) && !p.slice(1).some((h) => pointInRing(h, pH, E))));
        expect(region && input.species[region.index].formula).toBe(winner);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(1500);
  });
});
