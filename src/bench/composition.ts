/**
 * Bench figure for composition mode: the silver cyanide bath (0.2 mol/kg Ag, 0.6 mol/kg CN) as a
 * full diagram on a 300×300 grid with refined boundaries and iso-solubility lines. Target ≤ 1.5 s.
 * Run alone with `node dist/bench/composition.js`.
 */
import { fileURLToPath } from 'node:url';
import { computeComposition } from '../diagram/composition.js';
import { readSpec } from '../system/spec.js';

export interface CompositionBench {
  ms: number;
  /** CPU time of the same run (user + system), ms: steadier than wall time on a shared machine. */
  cpuMs: number;
  solves: number;
  pointsPerSecond: number;
}

export function benchComposition(n = 300, reps = 3): CompositionBench {
  const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'bench Ag-CN');
  let best: CompositionBench | undefined;
  for (let r = 0; r < reps; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const c = computeComposition(spec, { grid: n });
    const ms = performance.now() - t0;
    const cu = process.cpuUsage(c0);
    const solves = c.setup.solver.solves;
    if (!best || ms < best.ms) best = { ms, cpuMs: (cu.user + cu.system) / 1000, solves, pointsPerSecond: solves / (ms / 1000) };
  }
  return best!;
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const b = benchComposition(Number(process.argv[2] ?? 300));
  console.log(`composition ${process.argv[2] ?? 300}x${process.argv[2] ?? 300} ms: ${b.ms.toFixed(0)}`);
  console.log(`composition points solved per second: ${b.pointsPerSecond.toExponential(3)} (${b.solves} solves; CPU ${b.cpuMs.toFixed(0)} ms)`);
}
