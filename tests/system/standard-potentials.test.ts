/**
 * E° of couples computed by the program from inline handbook data, against the handbook series
 * (tests/fixtures/standard-potentials.csv: CRC Handbook "Electrochemical Series", P. Vanysek, Table 1,
 * values recalled from memory). Inline ΔfG° values: NBS 1982 tables (Wagman et al.), recalled from
 * memory. Fe+2 is a documented data-set difference (NBS 1982 gives −0.409 V for Fe+2/Fe, the
 * handbook −0.447 V); Fe+3/Fe+2 depends only on the difference of the two ions and agrees.
 * Also the water lines at 25 and 80 °C (water-facts: 1.229 V; ≈ 1.18 V at 80 °C with ΔH − TΔS).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const csv = readFileSync(join(__dirname, '..', 'fixtures', 'standard-potentials.csv'), 'utf8');
const handbook = new Map(
  csv
    .split('\n')
    .filter((l) => l && !l.startsWith('#') && !l.startsWith('reaction'))
    .map((l) => {
      const [r, e] = l.split(',');
      return [r, Number(e)] as const;
    }),
);

function e0(element: string, species: object[], a: string, b: string): number {
  const c = compute(readSpec({ element, activity: 1, species, E: [-2, 2] }, `${element}.json`));
  const bd = c.model.boundaries.find((x) => x.between.includes(a) && x.between.includes(b));
  if (!bd) throw new Error(`no ${a}/${b} boundary`);
  return bd.line.E0!;
}

describe('E° from inline data vs the handbook electrochemical series', () => {
  it('Cu+2/Cu: ΔfG°(Cu+2) = 65.49 kJ/mol → 0.3394 V (handbook 0.3419 V)', () => {
    const E = e0('Cu', [{ formula: 'Cu', phase: 's', dfG: 0 }, { formula: 'Cu+2', phase: 'aq', dfG: 65.49 }], 'Cu', 'Cu+2');
    expect(Math.abs(E - handbook.get('Cu+2 + 2e- = Cu(s)')!)).toBeLessThan(0.01);
  });

  it('Zn+2/Zn: ΔfG°(Zn+2) = −147.06 kJ/mol → −0.7621 V (handbook −0.7618 V)', () => {
    const E = e0('Zn', [{ formula: 'Zn', phase: 's', dfG: 0 }, { formula: 'Zn+2', phase: 'aq', dfG: -147.06 }], 'Zn', 'Zn+2');
    expect(Math.abs(E - handbook.get('Zn+2 + 2e- = Zn(s)')!)).toBeLessThan(0.005);
  });

  it('Fe+3/Fe+2: ΔfG° −4.7 and −78.90 kJ/mol → 0.769 V (handbook 0.771 V)', () => {
    const E = e0(
      'Fe',
      [
        { formula: 'Fe', phase: 's', dfG: 0 },
        { formula: 'Fe+2', phase: 'aq', dfG: -78.9 },
        { formula: 'Fe+3', phase: 'aq', dfG: -4.7 },
      ],
      'Fe+2',
      'Fe+3',
    );
    expect(Math.abs(E - handbook.get('Fe+3 + e- = Fe+2')!)).toBeLessThan(0.005);
  });
});

describe('water lines in the diagram', () => {
  it('25 °C: O2/H2O E° = 1.229 V, slope −59.16 mV/pH (water-facts.md)', () => {
    const c = compute(readSpec({ element: 'Fe' }, 'fe.yaml'));
    expect(c.model.waterLines.oxygen.line.E0!).toBeCloseTo(1.229, 3);
    expect(c.model.waterLines.oxygen.line.slope! * 1000).toBeCloseTo(-59.16, 2);
    expect(c.model.waterLines.hydrogen.line.intercept!).toBeCloseTo(0, 12);
  });

  it('80 °C: O2/H2O E° ≈ 1.18 V (water-facts: 1.182–1.183 V with ΔH − TΔS)', () => {
    const c = compute(readSpec({ element: 'Fe', temperature: 80, extrapolation: 'constant-h-s' }, 'fe80.yaml'));
    const E = c.model.waterLines.oxygen.line.E0!;
    expect(E).toBeGreaterThan(1.182);
    expect(E).toBeLessThan(1.1835);
  });

  it('gas pressures move the lines by (s/2)·log p(H2) and (s/4)·log p(O2)', () => {
    const c = compute(readSpec({ element: 'Fe', gases: { H2: 0.01, O2: 0.21 } }, 'g.yaml'));
    const s = 0.0591593; // ln10·RT/F at 25 °C, CODATA 2018
    expect(c.model.waterLines.hydrogen.line.intercept!).toBeCloseTo(-(s / 2) * -2, 6);
    expect(c.model.waterLines.oxygen.line.intercept! - 1.2288).toBeCloseTo((s / 4) * Math.log10(0.21), 3);
  });
});
