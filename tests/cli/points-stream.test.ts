/**
 * `probe --points -`: rows come out while the input is still open (a pipe), in order; a file
 * output appears only when the run succeeded. The CLI is bundled at test time and run as a child.
 */
import { spawn } from 'node:child_process';
import { readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testCli } from '../helpers/bundle.js';
import { tmpDir } from '../helpers/tmp.js';

let cli = '';
let dir = '';
let fe = '';

beforeAll(() => {
  dir = tmpDir();
  cli = testCli('points');
  fe = join(dir, 'fe.yaml');
  writeFileSync(fe, 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');
}, 60_000);

afterAll(() => rmSync(cli, { force: true }));

describe('probe --points - (a pipe)', () => {
  it('writes each row before the input ends', async () => {
    const p = spawn(process.execPath, [cli, 'probe', fe, '--points', '-'], { stdio: ['pipe', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    p.stderr.on('data', (d: Buffer) => (err += d.toString()));
    const waitFor = (re: RegExp) =>
      new Promise<void>((res, rej) => {
        const t = setTimeout(() => rej(new Error(`timed out waiting for ${re}; got ${out} ${err}`)), 20_000);
        const check = () => {
          if (re.test(out)) {
            clearTimeout(t);
            p.stdout.off('data', on);
            res();
          }
        };
        const on = (d: Buffer) => {
          out += d.toString();
          check();
        };
        p.stdout.on('data', on);
        check();
      });
    p.stdin.write('stamp,pH,potential\nfirst,4,-0.3\n');
    await waitFor(/^first,2,4,-0\.3,SHE,.*\n/m);
    expect(p.exitCode).toBe(null); // still running: the input is open
    p.stdin.write('second,12,0.4\n');
    await waitFor(/^second,3,12,0\.4,/m);
    p.stdin.end();
    const code = await new Promise<number | null>((res) => p.on('close', (c) => res(c)));
    expect(code).toBe(0);
    expect(out.split('\n')[0]).toMatch(/^stamp,line,pH,potential,/);
  }, 60_000);

  it('reads standard input and writes a file (-o) only when done; no temporary left', async () => {
    const out = join(dir, 'res.csv');
    const p = spawn(process.execPath, [cli, 'probe', fe, '--points', '-', '-o', out], { stdio: ['pipe', 'pipe', 'pipe'] });
    p.stdin.end('pH,potential\n7,0\n8,-0.5\n');
    const code = await new Promise<number | null>((res) => p.on('close', (c) => res(c)));
    expect(code).toBe(0);
    expect(readdirSync(dir).filter((n) => n.startsWith('.ephmap-'))).toEqual([]);
    expect(readdirSync(dir)).toContain('res.csv');
  }, 60_000);
});
