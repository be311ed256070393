/** The per-condition cache of logged-series answers (analysis/points-answer.ts). */
import { describe, expect, it } from 'vitest';
import { MAX_CONDITIONS, pointsAnswerer } from '../../src/analysis/points-answer.js';
import { probe } from '../../src/analysis/probe.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

const spec = readSpec({ element: 'Fe', activity: 1e-6, E: [-1.2, 1.6] }, 'test');

describe('pointsAnswerer', () => {
  it('computes the diagram once per distinct temperature, not once per row', () => {
    const a = pointsAnswerer(spec, undefined, 'log.csv');
    for (let k = 0; k < 300; k++) a.answer({ line: k + 2, pH: 3 + (k % 9), potential: -0.8 + 0.01 * (k % 50), temperature: [25, 60, 90][k % 3] });
    expect(a.computed()).toBe(3);
  });

  it('keeps at most MAX_CONDITIONS diagrams and gives the same answers as a fresh computation', () => {
    const a = pointsAnswerer(spec, undefined, 'log.csv');
    const temps = Array.from({ length: MAX_CONDITIONS + 6 }, (_, k) => 20 + k);
    for (const T of temps) a.answer({ line: 2, pH: 8, potential: -0.5, temperature: T });
    const again = a.answer({ line: 3, pH: 8, potential: -0.5, temperature: temps[0] });
    expect(a.computed()).toBe(temps.length + 1); // the first was dropped, so computed again
    const fresh = probe(compute({ ...spec, temperature: temps[0] }), 8, -0.5);
    expect('result' in again && again.result).toEqual(fresh);
  });

  it('answers a point outside the diagram on a domain widened for it, as a single probe does', () => {
    const a = pointsAnswerer(spec, undefined, 'log.csv');
    const r = a.answer({ line: 2, pH: 7, potential: -1.5 });
    expect('result' in r && r.result.predominant).toBe('Fe');
  });

  it('an ionic strength per row is the same condition as ionicStrength in the system file', () => {
    const plain = readSpec({ element: 'Fe', E: [-1.2, 1.6] }, 'test');
    const a = pointsAnswerer(plain, undefined, 'log.csv');
    const r0 = a.answer({ line: 2, pH: 6, potential: -0.3 });
    const r1 = a.answer({ line: 3, pH: 6, potential: -0.3, ionicStrength: 0.5 });
    expect(a.computed()).toBe(2);
    const file = probe(compute(readSpec({ element: 'Fe', E: [-1.2, 1.6], ionicStrength: 0.5 }, 'test')), 6, -0.3);
    expect('result' in r1 && r1.result.margin).toEqual(file.margin);
    expect('result' in r0 && r0.result.margin.kJPerMol).not.toBeCloseTo(file.margin.kJPerMol, 1);
  });

  it('rows at their own temperatures (coarser cross-check grid) answer as a single probe at that temperature does, for every library element', () => {
    // Every element of the built-in library, at three temperatures other than the file's own and
    // at four points each: the row's whole ProbeResult, warnings included, equals a fresh probe.
    const ELEMENTS = ['Ag', 'Al', 'Au', 'Co', 'Cr', 'Cu', 'Fe', 'Mn', 'Mo', 'Ni', 'Pb', 'Sn', 'Ti', 'Zn'];
    const POINTS = [
      [2, -0.6],
      [6, 0.1],
      [9, -0.9],
      [12, 0.5],
    ];
    let compared = 0;
    for (const element of ELEMENTS) {
      const s = readSpec({ element, E: [-1.6, 1.6] }, 'test');
      const a = pointsAnswerer(s, undefined, 'log.csv');
      for (const T of [40, 150, 280]) {
        const fresh = compute({ ...s, temperature: T });
        for (const [pH, E] of POINTS) {
          const r = a.answer({ line: 2, pH, potential: E, temperature: T });
          expect('result' in r && r.result, `${element} ${T} °C pH ${pH} E ${E}`).toEqual(probe(fresh, pH, E));
          compared++;
        }
      }
    }
    expect(compared).toBe(14 * 3 * 4);
  });
});
