/**
 * The printed fields of a logged-series row (analysis/probe-row.ts) against the full probe at the
 * same point (analysis/probe.ts): equal bit for bit, for every element of the library (one file per
 * element in species/), on a sweep of points across the diagram, at 25 °C and at 150 °C, and on a
 * system with ligands.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { probe, type ProbeResult } from '../../src/analysis/probe.js';
import { adviceOf, newRowProbe, probeRow, type RowProbe } from '../../src/analysis/probe-row.js';
import { compute, type Computed } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const ELEMENTS = readdirSync(join(__dirname, '..', '..', 'species'))
  .filter((f) => /^[A-Z][a-z]?\.json$/.test(f))
  .map((f) => f.replace('.json', ''));

/** What a row prints, from the full probe. */
function printed(r: ProbeResult): Omit<RowProbe, 'advice'> & { advice: string } {
  return {
    predominant: r.predominant,
    verdict: r.verdict,
    runnerUp: r.runnerUp,
    marginKJ: r.margin.kJPerMol,
    distanceMV: r.distance.mV,
    distancePH: r.distance.pH,
    nearestReaction: r.nearestBoundary?.reaction ?? null,
    advice: r.advice,
    warnings: r.warnings,
    celsius: r.temperature.celsius,
  };
}

/** Every point of an n×n sweep (cell centres, plus points on the grid lines) agrees. */
function sweep(c: Computed, n: number): number {
  const out = newRowProbe();
  const [p0, p1] = c.spec.pH;
  const [e0, e1] = c.spec.E;
  let checked = 0;
  for (let i = 0; i <= n; i++) {
    for (let j = 0; j <= n; j++) {
      const pH = p0 + ((p1 - p0) * (i + 0.37)) / (n + 1);
      const E = e0 + ((e1 - e0) * (j + (j % 2 ? 0.5 : 0.11))) / (n + 1);
      const full = printed(probe(c, pH, E));
      const row = probeRow(c, pH, E, out);
      expect({ ...row, advice: adviceOf(row.advice), warnings: [...row.warnings] }).toEqual(full);
      checked++;
    }
  }
  return checked;
}

describe('probeRow (the printed fields of probe)', () => {
  it('reads the library elements', () => {
    expect(ELEMENTS).toEqual(expect.arrayContaining(['Fe', 'Cu', 'Zn', 'Ni', 'Cr', 'Al']));
  });

  for (const el of ELEMENTS) {
    it(`equals probe() on a sweep of the ${el} diagram at 25 °C and 150 °C`, () => {
      let computed = 0;
      for (const temperature of [25, 150]) {
        let c: Computed;
        try {
          c = compute(readSpec({ element: el, activity: 1e-6, temperature, E: [-1.6, 1.8], pH: [-1, 15] }, 'test'));
        } catch {
          continue; // an element the library cannot draw alone (e.g. a ligand) or at this temperature
        }
        computed++;
        expect(sweep(c, 24)).toBe(625);
      }
      if (['Fe', 'Cu', 'Zn', 'Ni', 'Cr', 'Al'].includes(el)) expect(computed).toBe(2);
    });
  }

  it('equals probe() on a system with a ligand (copper with ammonia)', () => {
    const c = compute(readSpec({ element: 'Cu', activity: 1e-4, ligands: { N: 0.5 } }, 'test'));
    expect(sweep(c, 6)).toBe(49);
  });

  it('names the undetermined predominant species in its first warning, as probe() does', () => {
    // An inline species with only ΔfG° cannot be carried to 150 °C (a test input only: the HZnO2-
    // value −464.0 kJ/mol, NBS tables, Wagman et al. 1982, recalled, as tests/system/undetermined-species).
    const c = compute(readSpec({ element: 'Zn', temperature: 150, species: ['Zn', 'Zn+2', 'ZnO', { formula: 'HZnO2-', phase: 'aq', dfG: -464.0 }] }, 'test'));
    const out = newRowProbe();
    let unknown = 0;
    for (let i = 0; i <= 40; i++) {
      for (let j = 0; j <= 40; j++) {
        const pH = 2 + i * 0.3;
        const E = -1 + j * 0.05;
        const row = probeRow(c, pH, E, out);
        expect({ ...row, advice: adviceOf(row.advice), warnings: [...row.warnings] }).toEqual(printed(probe(c, pH, E)));
        if (row.verdict === 'unknown') unknown++;
      }
    }
    expect(unknown).toBeGreaterThan(0);
  });
});
