/**
 * Every boundary reaction the program writes is balanced in every element and in charge, uses
 * smallest integer coefficients, and is a reduction when electrons take part (e- on the left).
 * The check parses the printed reaction text independently of the solver.
 */
import { describe, expect, it } from 'vitest';
import { parseFormula, splitPhase } from '../../src/chem/formula.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';

function side(text: string): { counts: Map<string, number>; coefs: number[]; electrons: number } {
  const counts = new Map<string, number>();
  const coefs: number[] = [];
  let electrons = 0;
  for (const term of text.split(' + ')) {
    const m = /^(\d*)(.+)$/.exec(term.trim())!;
    const k = m[1] ? Number(m[1]) : 1;
    coefs.push(k);
    if (m[2] === 'e^-') {
      electrons += k;
      counts.set('charge', (counts.get('charge') ?? 0) - k);
      continue;
    }
    const f = parseFormula(splitPhase(m[2]).formula);
    for (const [el, n] of Object.entries(f.elements)) counts.set(el, (counts.get(el) ?? 0) + k * n);
    counts.set('charge', (counts.get('charge') ?? 0) + k * f.charge);
  }
  return { counts, coefs, electrons };
}

const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

const SYSTEMS: Record<string, unknown>[] = [
  { element: 'Fe' },
  { element: 'Fe', temperature: 150, ligands: { S: 1e-2 } },
  { element: 'Cu', ligands: { S: 1e-3, Cl: 0.5, N: 0.1 } },
  { element: 'Ag', ligands: { CN: 0.1 } },
  { element: 'Fe', ligands: { C: 1e-2 } },
  { element: 'Cr' },
  { element: 'Mn' },
];

describe.each(SYSTEMS)('reactions of %o', (sys) => {
  const c = compute(readSpec(sys, 'balance.yaml'));
  it('are balanced, reduced to smallest integers, and written as reductions', () => {
    expect(c.model.boundaries.length).toBeGreaterThan(2);
    for (const b of c.model.boundaries) {
      const [l, r] = b.reaction.split(' <=> ');
      const L = side(l);
      const Rt = side(r);
      const keys = new Set([...L.counts.keys(), ...Rt.counts.keys()]);
      for (const k of keys) expect(L.counts.get(k) ?? 0, `${b.reaction}: ${k}`).toBeCloseTo(Rt.counts.get(k) ?? 0, 9);
      expect([...L.coefs, ...Rt.coefs].reduce(gcd), b.reaction).toBe(1);
      expect(Rt.electrons, `${b.reaction}: electrons on the right`).toBe(0);
      expect(b.line.n).toBe(L.electrons);
    }
  });
});
