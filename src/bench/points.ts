/**
 * Bench figures for logged series (`probe --points`), each run as the real command in a fresh
 * child process (the bundled CLI, dist/cli/ephmap.mjs) so that start-up, reading, answering and
 * writing are all counted and the peak RSS is the child's own:
 *   points 1e6 s: T           — 10⁶ rows (pH, potential, a time stamp) of the demo iron system at
 *                               one temperature, file in, file out; target ≤ 3 s wall
 *   points peak RSS MB: M     — the same run's peak resident memory (VmHWM of the child, threads included);
 *                               target ≤ 120 MB
 *   points 2000 temperatures s: T — 2,000 rows, each at its own temperature (one diagram each)
 * Run alone with `node dist/bench/points.js`. The rows are our own made-up plant log (a deterministic pseudo-random walk), not measured data.
 */
import { spawnSync } from 'node:child_process';
import { createWriteStream, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export interface PointsBench {
  seconds: number;
  cpuSeconds: number;
  peakRssMB: number;
}

/** A made-up log of `rows` rows (deterministic), optionally one temperature per row. */
export async function writeLog(path: string, rows: number, temperatures: boolean): Promise<void> {
  const out = createWriteStream(path);
  let seed = 7;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  out.write(temperatures ? 'time_s,pH,potential,temperature\n' : 'time_s,pH,potential\n');
  let chunk = '';
  for (let k = 0; k < rows; k++) {
    const pH = (2 + 10 * rnd()).toFixed(3);
    const E = (-1 + 2 * rnd()).toFixed(4);
    chunk += temperatures ? `${k * 30},${pH},${E},${(20 + (160 * k) / rows).toFixed(3)}\n` : `${k * 30},${pH},${E}\n`;
    if (chunk.length > 1 << 16) {
      if (!out.write(chunk)) await new Promise<void>((r) => out.once('drain', () => r()));
      chunk = '';
    }
  }
  out.write(chunk);
  await new Promise<void>((r, j) => out.end((e?: Error | null) => (e ? j(e) : r())));
}

/**
 * Runs `probe SYSTEM --points LOG -o OUT` in a child that reports its own CPU time and peak RSS.
 * The peak is VmHWM of /proc/self/status (the child's own memory, worker threads included): on
 * Linux getrusage's maxrss survives exec, so a child of a large parent (run.ts after the other
 * benches) would report the parent's size instead; maxrss is the fallback elsewhere.
 */
export function runPointsChild(cli: string, system: string, log: string, out: string): PointsBench {
  const probe = `import {readFileSync as __rf} from 'node:fs';const t=process.hrtime.bigint();process.on('exit',()=>{const u=process.resourceUsage();let hwm=u.maxRSS;try{const m=/VmHWM:\\s*(\\d+)/.exec(__rf('/proc/self/status','utf8'));if(m)hwm=Number(m[1])}catch{}process.stderr.write('\\nBENCH '+JSON.stringify({cpu:(u.userCPUTime+u.systemCPUTime)/1e6,rss:hwm/1024})+'\\n')});process.argv=[process.argv[0],${JSON.stringify(cli)},'probe',${JSON.stringify(system)},'--points',${JSON.stringify(log)},'-o',${JSON.stringify(out)}];await import(${JSON.stringify(`file://${cli}`)});`;
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', probe], { encoding: 'utf8' });
  const seconds = (performance.now() - t0) / 1000;
  const m = /BENCH (\{.*\})/.exec(r.stderr);
  if (r.status !== 0 || !m) throw new Error(`points bench child failed (status ${r.status}): ${r.stderr.slice(0, 300)}`);
  const b = JSON.parse(m[1]) as { cpu: number; rss: number };
  return { seconds, cpuSeconds: b.cpu, peakRssMB: b.rss };
}

/** Both figures (see the module comment), in `dir`. */
export async function benchPoints(cli: string, dir: string): Promise<{ million: PointsBench; temps: PointsBench }> {
  const system = join(dir, 'points-iron.yaml');
  writeFileSync(system, 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');
  const big = join(dir, 'log-1e6.csv');
  await writeLog(big, 1_000_000, false);
  const million = runPointsChild(cli, system, big, join(dir, 'out-1e6.csv'));
  const hot = join(dir, 'log-temps.csv');
  await writeLog(hot, 2000, true);
  const temps = runPointsChild(cli, system, hot, join(dir, 'out-temps.csv'));
  return { million, temps };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const dir = mkdtempSync(join(tmpdir(), 'ephmap-bench-points-'));
  const cli = join(dirname(fileURLToPath(import.meta.url)), '..', 'cli', 'ephmap.mjs');
  benchPoints(cli, dir)
    .then(({ million, temps }) => {
      console.log(`points 1e6 s: ${million.seconds.toFixed(2)} (CPU ${million.cpuSeconds.toFixed(2)} s)`);
      console.log(`points peak RSS MB: ${million.peakRssMB.toFixed(1)}`);
      console.log(`points 2000 temperatures s: ${temps.seconds.toFixed(2)} (CPU ${temps.cpuSeconds.toFixed(2)} s)`);
    })
    .finally(() => rmSync(dir, { recursive: true, force: true }));
}
