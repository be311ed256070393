/**
 * `probe --points` on a long file answered in pieces by the main thread and a worker thread
 * (cli/points-pool.ts): the output bytes, the messages, the exit statuses and the line numbers
 * are those of the single-thread run. The worker path is forced for a small input with the
 * internal setting EPHMAP_POINTS_WORKERS_FROM=0 (DEVELOPERS.md). Both bundles (the command line
 * and dist/cli/points-worker.mjs's twin) are built at test time; the worker's bundle leaves a mark
 * when it starts, so the test knows the worker path ran. The log is our own made-up series.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bundleCli } from '../helpers/bundle.js';
import { tmpDir } from '../helpers/tmp.js';

const root = fileURLToPath(new URL('../..', import.meta.url));
// Two levels below the repository, as dist/cli/ephmap.mjs is, so that species/ is found; the
// worker bundle next to it under the name the pool looks for.
const bundles = join(root, 'node_modules', '.ephmap-test');
const cli = join(bundles, `workers-${process.pid}.mjs`);
const workerBundle = join(bundles, 'points-worker.mjs');
let dir = '';
let fe = '';
let log = '';
let mark = '';
/** Lines (1-based) of the rows with pH "abc", in input order, counted while writing the log. */
const badLines: number[] = [];


/** A made-up log: `;`, decimal commas, mV, two temperatures, quoted notes with line breaks, bad rows. */
function writeLog(path: string): void {
  const parts = ['# made-up test log\n\ntime;pH;potential_mV;temperature;note\n'];
  let line = 4;
  let seed = 3;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  for (let k = 1; k <= 40_000; k++) {
    const pH = (2 + 10 * rnd()).toFixed(3).replace('.', ',');
    const E = (-900 + 1800 * rnd()).toFixed(1).replace('.', ',');
    const T = k < 20_000 ? '25' : '60';
    let row = `${k};${pH};${E};${T};${k % 97 === 0 ? '"tank ""B""\nrefilled"' : 'ok'}\n`;
    if (k % 3001 === 0) {
      row = `${k};abc;${E};${T};bad\n`;
      badLines.push(line);
    } else if (k % 4001 === 0) row = `${k};${pH};${E}\n`;
    else if (k % 5003 === 0) row = `${k};${pH};"open"x;${T};q\n`;
    parts.push(row);
    line += row.split('\n').length - 1;
  }
  writeFileSync(path, parts.join(''));
}

function run(args: string[], workersFrom: string) {
  rmSync(mark, { force: true });
  const r = spawnSync(process.execPath, [cli, 'probe', fe, '--points', log, ...args], {
    encoding: 'buffer',
    maxBuffer: 1 << 28,
    env: { ...process.env, EPHMAP_POINTS_WORKERS_FROM: workersFrom, EPHMAP_TEST_WORKER_MARK: mark },
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr.toString('utf8'), worker: existsSync(mark) };
}
const single = (args: string[]) => run(args, '999999999999');
const pieces = (args: string[]) => run(args, '0');

beforeAll(() => {
  dir = tmpDir();
  mkdirSync(bundles, { recursive: true });
  bundleCli(cli);
  bundleCli(workerBundle, 'points-worker.ts', "\nif (process.env.EPHMAP_TEST_WORKER_MARK) require('node:fs').writeFileSync(process.env.EPHMAP_TEST_WORKER_MARK, 'started');");
  fe = join(dir, 'fe.yaml');
  writeFileSync(fe, 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');
  log = join(dir, 'log.csv');
  writeLog(log);
  mark = join(dir, 'worker-started');
}, 120_000);

afterAll(() => {
  rmSync(cli, { force: true });
  rmSync(workerBundle, { force: true });
});

describe('probe --points in pieces (main thread + worker)', () => {
  it('writes the same bytes, messages and exit status as the single-thread run (--ref sce, mV, ;, temperatures)', () => {
    const args = ['--ref', 'sce', '--unit', 'mV'];
    const a = single(args);
    const b = pieces(args);
    expect(a.worker).toBe(false);
    expect(b.worker).toBe(true);
    expect(a.status).toBe(4);
    expect(b.status).toBe(4);
    expect(b.stderr).toBe(a.stderr);
    expect(b.stdout.length).toBeGreaterThan(1_000_000);
    expect(Buffer.compare(b.stdout, a.stdout)).toBe(0);
  }, 60_000);

  it('names each bad row by its input line (quoted line breaks counted), as the single-thread run', () => {
    const b = pieces(['-o', '-']).stdout.toString('utf8');
    expect(badLines.length).toBe(13);
    // Each "abc" row's error cell names its line, counted independently while writing the log.
    for (const n of badLines) expect(b).toContain(`line ${n}, column 2 (pH)`);
    expect(Buffer.compare(Buffer.from(b), single(['-o', '-']).stdout)).toBe(0);
  }, 60_000);

  it('writes an output file equal to the single-thread one and reports the same counts', () => {
    const a = single(['-o', join(dir, 'a.csv')]);
    const b = pieces(['-o', join(dir, 'b.csv')]);
    expect(b.worker).toBe(true);
    expect(b.stdout.toString()).toBe(a.stdout.toString().replace('a.csv', 'b.csv'));
    expect(Buffer.compare(readFileSync(join(dir, 'b.csv')), readFileSync(join(dir, 'a.csv')))).toBe(0);
  }, 60_000);

  it('runs when the command is imported from `node -e` (the bench does so): a worker does not inherit the script', () => {
    const out = join(dir, 'e.csv');
    const script = `process.argv=[process.argv[0],${JSON.stringify(cli)},'probe',${JSON.stringify(fe)},'--points',${JSON.stringify(log)},'-o',${JSON.stringify(out)}];await import(${JSON.stringify(`file://${cli}`)});`;
    rmSync(mark, { force: true });
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', env: { ...process.env, EPHMAP_POINTS_WORKERS_FROM: '0', EPHMAP_TEST_WORKER_MARK: mark } });
    expect(r.stderr).not.toContain('cannot be read');
    expect(r.status).toBe(4);
    expect(existsSync(mark)).toBe(true);
    expect(Buffer.compare(readFileSync(out), single(['-o', '-']).stdout)).toBe(0);
  }, 60_000);

  it('--strict stops at the first bad row in input order: exit status 2, its line named, no output file', () => {
    const a = single(['--strict', '-o', join(dir, 'sa.csv')]);
    const b = pieces(['--strict', '-o', join(dir, 'sb.csv')]);
    expect(b.worker).toBe(true);
    expect(b.status).toBe(2);
    expect(b.stderr).toBe(a.stderr);
    expect(b.stderr).toContain(`line ${badLines[0]}, column 2 (pH)`);
    expect(existsSync(join(dir, 'sb.csv'))).toBe(false);
  }, 60_000);
});
