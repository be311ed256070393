/**
 * Bench figure for the alloy kind (issue 18): Fe–Cr–Ni (70/18/12) with sulfur and carbonate ligands,
 * every species of the library for those elements plus the mixed compounds, as a full diagram on a
 * 300×300 grid (assemblages discovered by the LP at every node, boundaries refined, triple points
 * joined). Target ≤ 2 s. Run alone with `node dist/bench/alloy.js [n]`.
 */
import { fileURLToPath } from 'node:url';
import { computeAlloy } from '../diagram/alloy.js';
import { readAlloySpec } from '../system/alloy-spec.js';

export interface AlloyBench {
  ms: number;
  cpuMs: number;
  species: number;
  regions: number;
}

export function benchAlloy(n = 300, reps = 2): AlloyBench {
  const spec = readAlloySpec({ elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 }, activity: 1e-6, ligands: { S: 1e-3, C: 1e-3 } }, 'bench Fe-Cr-Ni');
  let best: AlloyBench | undefined;
  for (let r = 0; r < reps; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const c = computeAlloy(spec, { grid: n });
    const ms = performance.now() - t0;
    const cu = process.cpuUsage(c0);
    const species = c.built.input.species.length + c.built.input.ligands.reduce((s, L) => s + L.species.length, 0);
    if (!best || ms < best.ms) best = { ms, cpuMs: (cu.user + cu.system) / 1000, species, regions: c.model.regions.length };
  }
  return best!;
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const n = Number(process.argv[2] ?? 300);
  const b = benchAlloy(n, 1);
  console.log(`alloy ${n}x${n} ms: ${b.ms.toFixed(0)}`);
  console.log(`alloy species: ${b.species}, regions: ${b.regions} (CPU ${b.cpuMs.toFixed(0)} ms)`);
}
