/**
 * The alloy grid's shortcuts (issue 18 speed target) must not change any answer:
 *  - discoverAssemblages reuses a neighbour's basis where its reduced costs all stay above
 *    WARM_MARGIN_KJ: at every node of Fe–Cr–Ni (with S and C ligands) and Cu–Zn (with S) grids the
 *    node's assemblage equals the plain LP's (supportAt, cold start) — no node is skipped;
 *  - speciesPsiInto memoises the ligand planes: its ψ' equal, bit for bit, those computed afresh
 *    with ligandPotentialsAt (src/solve/point.ts) and the formation planes.
 * Data: the built-in library (sources in species/); the checks are of the algorithms, not the data.
 */
import { describe, expect, it } from 'vitest';
import { discoverAssemblages } from '../../../src/diagram/alloy-field.js';
import { supportAt, warmBasis, warmStillOptimal } from '../../../src/solve/alloy/assemblage.js';
import { alloyWater, speciesPsiInto } from '../../../src/solve/alloy/psi.js';
import type { AlloyInput } from '../../../src/solve/alloy/types.js';
import { planeAt } from '../../../src/solve/plane.js';
import { ligandPotentialsAt } from '../../../src/solve/point.js';
import { formationPlane } from '../../../src/solve/potentials.js';
import { gridX, gridY } from '../../../src/solve/trace/grid.js';
import { buildAlloySystem } from '../../../src/system/alloy-build.js';
import { readAlloySpec } from '../../../src/system/alloy-spec.js';

const systems: [string, Record<string, unknown>][] = [
  ['Fe–Cr–Ni 70/18/12, S and C 1e-3', { elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 }, activity: 1e-6, ligands: { S: 1e-3, C: 1e-3 } }],
  ['Cu–Zn 63/37, S 1e-4, 60 °C', { elements: { Cu: 0.63, Zn: 0.37 }, activity: 1e-6, temperature: 60, ligands: { S: 1e-4 } }],
];

function inputOf(data: Record<string, unknown>): AlloyInput {
  return buildAlloySystem(readAlloySpec(data, 'warm.yaml')).input;
}

/** ψ' recomputed the plain way: ligand μ planes afresh at the point, then Φ − Σ k·μ, in kJ. */
function plainPsi(input: AlloyInput, pH: number, E: number): number[] {
  const w = alloyWater(input);
  const { mu } = ligandPotentialsAt(input.ligands, w, pH, E);
  const muAt = mu.map((pl) => planeAt(pl, pH, E));
  return input.species.map((sp) => {
    let v = planeAt(formationPlane(sp, w), pH, E);
    input.ligands.forEach((L, m) => {
      const k = sp.elements[L.element] ?? 0;
      if (k) v -= k * muAt[m];
    });
    return v / 1000;
  });
}

describe.each(systems)('%s', (_name, data) => {
  const input = inputOf(data);
  const n = 71;

  it(`warm-started grid (${n}×${n}) = plain LP at every node`, () => {
    const { labels, at } = discoverAssemblages(input, input.pH, input.E, n);
    const g = { nx: n, ny: n, x: input.pH, y: input.E };
    let mismatches = 0;
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < n; i++) {
        const cold = supportAt(input, gridX(g, i), gridY(g, j)).indices.join(',');
        if (labels[at[i + j * n]].key !== cold) mismatches++;
      }
    }
    expect(mismatches).toBe(0);
    expect(labels.length).toBeGreaterThan(4);
  });

  it('ψ\' with memoised ligand planes = ψ\' computed afresh, bit for bit, at 300 points', () => {
    let s = 12345;
    const r = () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32);
    const out = new Array<number>(input.species.length);
    for (let k = 0; k < 300; k++) {
      const pH = input.pH[0] + (input.pH[1] - input.pH[0]) * r();
      const E = input.E[0] + (input.E[1] - input.E[0]) * r();
      speciesPsiInto(input, pH, E, out);
      expect(out).toEqual(plainPsi(input, pH, E));
    }
  });
});

describe('the warm check itself', () => {
  const input = inputOf(systems[0][1]);
  it('accepts the optimum inside its region and refuses it where another assemblage wins', () => {
    // Scan a row at E = −0.2 V for two neighbouring points with different assemblages.
    const xs = Array.from({ length: 200 }, (_, k) => input.pH[0] + ((input.pH[1] - input.pH[0]) * k) / 199);
    const sup = xs.map((x) => supportAt(input, x, -0.2));
    const k = sup.findIndex((s, i) => i > 0 && s.indices.join() !== sup[i - 1].indices.join() && s.indices.length === 3 && sup[i - 1].indices.length === 3);
    expect(k).toBeGreaterThan(0);
    const w = warmBasis(input, sup[k - 1].indices)!;
    expect(w).not.toBeNull();
    expect(warmStillOptimal(input, w, sup[k - 1].psi)).toBe(true);
    expect(warmStillOptimal(input, w, sup[k].psi)).toBe(false);
  });
  it('a support with fewer phases than elements (degenerate vertex) gives no warm basis', () => {
    expect(warmBasis(input, [0, 1])).toBeNull();
  });
});
