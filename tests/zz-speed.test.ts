import { it } from 'vitest';
import { speciesPotentialsAt } from '../src/solve/alloy/psi.js';
import { solveLp } from '../src/solve/alloy/lp.js';
import { buildAlloySystem } from '../src/system/alloy-build.js';
import { readAlloySpec } from '../src/system/alloy-spec.js';
it('speed', () => {
  const input = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 } }, 'x.yaml')).input;
  const els = Object.keys(input.composition);
  const A = els.map((e) => input.species.map((sp) => sp.elements[e] ?? 0));
  const b = els.map((e) => input.composition[e]);
  let piv = 0, n = 0;
  const t = performance.now();
  for (let i = 0; i < 100; i++) for (let j = 0; j < 100; j++) {
    const { psi } = speciesPotentialsAt(input, i * 0.14, -2 + j * 0.04);
    const basis = els.map((e) => input.species.findIndex((s) => s.formula === e));
    piv += solveLp({ A, b, c: psi, basis }).pivots; n++;
  }
  console.log('pivots avg', piv / n, 'us', ((performance.now() - t) * 1000 / n).toFixed(1));
});
