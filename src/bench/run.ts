/**
 * `npm run bench`: speed and memory figures, measured in one run (not a test; nothing here fails).
 *
 * Prints:
 *   file-to-JSON ms: T                  — demo iron diagram, system file → diagram model JSON, in-process
 *   grid throughput: N points×species/s  — grid minimum-Gibbs map
 *   draw/node-startup ratio: R          — wall time of `ephmap draw` (iron, SVG) over bare `node -e 0`; target ≤ 3
 *   solver/bare-loop ratio: R           — grid solver throughput over a bare typed-array min-of-planes loop; target ≥ 0.5
 *   Cu-S 500x500 ms: T                  — copper–sulfur map with ligand recursion on a 500×500 grid; target ≤ 200
 *   alloy points 300x300 ms: T          — Fe–Cr–Ni assemblage LP at every node of a 300×300 grid (point
 *                                         solver only, no tracing yet; issue 18's traced map: ≤ 2000)
 *   peak RSS MB: M                      — a 1000×1000 grid map in a fresh process; target ≤ 150
 *   composition 300x300 ms: T           — silver cyanide bath, composition mode, refined; target ≤ 1500
 *   composition points solved per second — point solutions (grid, refinement, iso-lines) per second
 *   alloy 300x300 ms: T                 — Fe–Cr–Ni with S and C ligands (43 species), the traced alloy
 *                                         diagram (src/bench/alloy.ts); target ≤ 2000
 *   points 1e6 s: T                     — `probe --points` over 10⁶ rows in a child process; target ≤ 3
 *   points peak RSS MB: M               — that child's peak RSS; target ≤ 120
 *   points 2000 temperatures s: T       — 2,000 rows at 2,000 distinct temperatures (bench/points.ts)
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { computeFile, compute } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { supportAt } from '../solve/alloy/assemblage.js';
import { gridMap } from '../solve/grid.js';
import { buildAlloySystem } from '../system/alloy-build.js';
import { readAlloySpec } from '../system/alloy-spec.js';
import { benchAlloy } from './alloy.js';
import { benchComposition } from './composition.js';
import { benchPoints } from './points.js';
import { readSpec } from '../system/spec.js';

const here = dirname(fileURLToPath(import.meta.url));
const cli = join(here, '..', 'cli', 'ephmap.mjs');

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function timeIt(fn: () => void, reps: number): number {
  const t: number[] = [];
  for (let k = 0; k < reps; k++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  return median(t);
}

/** The bare reference: min over N planes at every node, typed arrays, nothing else. */
function bareLoop(g: Float64Array, p: Float64Array, e: Float64Array, nx: number, ny: number, out: Uint16Array): void {
  const N = g.length;
  for (let j = 0; j < ny; j++) {
    const E = -2 + (4 * j) / (ny - 1);
    for (let i = 0; i < nx; i++) {
      const pH = (14 * i) / (nx - 1);
      let best = Infinity;
      let arg = 0;
      for (let k = 0; k < N; k++) {
        const v = g[k] + p[k] * pH + e[k] * E;
        if (v < best) {
          best = v;
          arg = k;
        }
      }
      out[j * nx + i] = arg;
    }
  }
}

async function main(): Promise<void> {
  if (process.argv[2] === '--rss-child') {
    const spec = readSpec({ element: 'Cu', ligands: { S: 1e-3 } }, 'bench');
    const c = compute(spec);
    gridMap(c.built.input, 1000, 1000);
    process.stdout.write(String(process.resourceUsage().maxRSS / 1024));
    return;
  }
  const dir = mkdtempSync(join(tmpdir(), 'ephmap-bench-'));
  try {
    const fe = join(dir, 'iron.yaml');
    writeFileSync(fe, 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');
    // 1. file → JSON.
    computeFile(fe);
    const tJson = timeIt(() => stableJson(computeFile(fe).model), 20);
    console.log(`file-to-JSON ms: ${tJson.toFixed(2)}`);

    // 2. grid throughput and the bare loop on the same grid.
    const c = computeFile(fe);
    const input = c.built.input;
    const n = 1000;
    const N = input.species.length;
    const tGrid = timeIt(() => gridMap(input, n, n), 5);
    const rate = (n * n * N) / (tGrid / 1000);
    console.log(`grid throughput: ${rate.toExponential(3)} points×species/s (${N} species, ${n}×${n})`);
    const g = new Float64Array(N).map((_, k) => k * 1000);
    const p = new Float64Array(N).map((_, k) => -k * 5708);
    const e = new Float64Array(N).map((_, k) => -k * 96485);
    const out = new Uint16Array(n * n);
    const tBare = timeIt(() => bareLoop(g, p, e, n, n, out), 5);

    // 3. CLI draw vs bare node start-up.
    const svg = join(dir, 'iron.svg');
    // Interleaved runs after a warm-up, medians of 15 each, so that machine load affects both alike.
    execFileSync(process.execPath, [cli, 'draw', fe, '-o', svg]);
    const nodeRuns: number[] = [];
    const drawRuns: number[] = [];
    for (let k = 0; k < 15; k++) {
      nodeRuns.push(timeIt(() => execFileSync(process.execPath, ['-e', '0']), 1));
      drawRuns.push(timeIt(() => execFileSync(process.execPath, [cli, 'draw', fe, '-o', svg]), 1));
    }
    const tNode = median(nodeRuns);
    const tDraw = median(drawRuns);
    console.log(`draw/node-startup ratio: ${(tDraw / tNode).toFixed(2)}`);
    console.log(`solver/bare-loop ratio: ${(tBare / tGrid).toFixed(2)}`);

    // 4. Cu–S with ligand recursion, 500×500.
    const cus = compute(readSpec({ element: 'Cu', ligands: { S: 1e-3 } }, 'bench Cu-S'));
    gridMap(cus.built.input, 500, 500);
    const tCuS = timeIt(() => {
      const cc = compute(readSpec({ element: 'Cu', ligands: { S: 1e-3 } }, 'bench Cu-S'));
      gridMap(cc.built.input, 500, 500);
    }, 7);
    console.log(`Cu-S 500x500 ms: ${tCuS.toFixed(1)}`);

    // 5. Alloy point solver on every node of a 300×300 grid.
    const alloy = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 }, ligands: { S: 1e-3 } }, 'bench Fe-Cr-Ni')).input;
    const alloyGrid = (): void => {
      for (let i = 0; i < 300; i++) for (let j = 0; j < 300; j++) supportAt(alloy, (14 * i) / 299, -2 + (4 * j) / 299);
    };
    alloyGrid();
    console.log(`alloy points 300x300 ms: ${timeIt(alloyGrid, 3).toFixed(1)}`);

    // 6. Peak RSS of a 1000×1000 map in a fresh process.
    const r = spawnSync(process.execPath, [fileURLToPath(import.meta.url), '--rss-child'], { encoding: 'utf8' });
    console.log(`peak RSS MB: ${Number(r.stdout).toFixed(1)}`);

    // 6. Composition mode: Ag–CN bath, 300×300, refined boundaries and iso-solubility lines.
    const cb = benchComposition(300, 3);
    console.log(`composition 300x300 ms: ${cb.ms.toFixed(0)}`);
    console.log(`composition points solved per second: ${cb.pointsPerSecond.toExponential(3)} (${cb.solves} solves; CPU ${cb.cpuMs.toFixed(0)} ms)`);

    // 7a. Alloy kind: Fe–Cr–Ni traced diagram, 300×300 with refinement.
    const ab = benchAlloy(300, 2);
    console.log(`alloy 300x300 ms: ${ab.ms.toFixed(0)}`);
    console.log(`alloy species: ${ab.species}, regions: ${ab.regions} (CPU ${ab.cpuMs.toFixed(0)} ms)`);
    // 7b. Logged series: the real command in a child process.
    const pts = await benchPoints(cli, dir);
    console.log(`points 1e6 s: ${pts.million.seconds.toFixed(2)} (CPU ${pts.million.cpuSeconds.toFixed(2)} s)`);
    console.log(`points peak RSS MB: ${pts.million.peakRssMB.toFixed(1)}`);
    console.log(`points 2000 temperatures s: ${pts.temps.seconds.toFixed(2)} (CPU ${pts.temps.cpuSeconds.toFixed(2)} s)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((e) => {
  console.error(`bench failed: ${(e as Error).message}`);
  process.exitCode = 1;
});
