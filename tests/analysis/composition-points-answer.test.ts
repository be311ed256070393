/**
 * The composition-mode row answerer (src/analysis/composition-points-answer.ts): one point solver
 * per distinct temperature, a temperature that cannot be set up remembered as a per-row error, and
 * a failed solve returned as status failed, verdict unknown (not an error).
 */
import { describe, expect, test } from 'vitest';
import { compositionPointsAnswerer } from '../../src/analysis/composition-points-answer.js';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { InputError } from '../../src/errors.js';
import { readSpec, type SystemSpec } from '../../src/system/spec.js';

const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'ag.yaml');
const row = (line: number, temperature?: number) => ({ line, pH: 12, potential: 0, ...(temperature === undefined ? {} : { temperature }) });

describe('compositionPointsAnswerer', () => {
  test('builds the point solver once per distinct temperature', () => {
    const seen: number[] = [];
    const make = (s: SystemSpec) => (seen.push(s.temperature), compositionSetup(s));
    const a = compositionPointsAnswerer(spec, undefined, 'log.csv', make);
    for (const [k, T] of [25, undefined, 60, 25, 60].entries()) {
      const r = a.answer(row(k + 2, T));
      if ('error' in r) throw new Error(r.error);
      // All 0.2 mol/kg Ag dissolved at pH 12, 0 V (mass balance; Ag(CN)2- holds the silver).
      expect(r.result.status).toBe('ok');
      expect(r.result.temperature.celsius).toBe(T ?? 25);
    }
    expect(seen).toEqual([25, 60]);
  });

  test('a temperature that cannot be set up: an error for every row at it, tried once', () => {
    let calls = 0;
    const make = (s: SystemSpec) => {
      if (s.temperature === 90) {
        calls++;
        throw new InputError('ag.yaml', 'temperature', 'data reaching 90 °C');
      }
      return compositionSetup(s);
    };
    const a = compositionPointsAnswerer(spec, undefined, 'log.csv', make);
    const r1 = a.answer(row(2, 90));
    const r2 = a.answer(row(3, 90));
    expect('error' in r1 && r1.error).toMatch(/^line 2: .*data reaching 90 °C/);
    expect('error' in r2 && r2.error).toMatch(/^line 3: /);
    expect(calls).toBe(1);
    expect('result' in a.answer(row(4))).toBe(true);
  });

  test('a failed solve is an answer with status failed and verdict unknown', () => {
    const starved = (s: SystemSpec) => compositionSetup(s, { newton: { maxIterations: 1, tol: 1e-11, maxStep: 2 }, noFallback: true });
    const r = compositionPointsAnswerer(spec, undefined, 'log.csv', starved).answer(row(2));
    if ('error' in r) throw new Error(r.error);
    expect(r.result.status).toBe('failed');
    expect(r.result.verdict).toBe('unknown');
    expect(r.result.dissolved).toBeNull();
  });
});
