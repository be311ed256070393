/**
 * File safety of the command line as a user runs it: the CLI bundled from src/ by this test (one
 * ES module, as scripts/bundle.mjs does; never a stale dist/) is run as a separate process. Each
 * case asserts the exit status, the message and the exact bytes of every pre-existing file
 * afterwards (README "Bad input": 2 = input refused, 3 = output not writable, nothing written).
 */
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, cpSync, linkSync, lstatSync, mkdirSync, readdirSync, readFileSync, readlinkSync, symlinkSync, utimesSync, watch, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { bundleCli } from '../helpers/bundle.js';
import { tmpDir } from '../helpers/tmp.js';

const root = resolve(fileURLToPath(new URL('.', import.meta.url)), '..', '..');
let bin = '';

// The bundle finds the species library two folders up from itself (<dir>/dist/cli → <dir>/species).
beforeAll(() => {
  const dir = tmpDir();
  chmodSync(dir, 0o755);
  bin = join(dir, 'dist', 'cli', 'ephmap.mjs');
  bundleCli(bin);
  // A copy, not a link: the checkout may sit in a folder other users cannot enter (CI's clean clone),
  // and the unprivileged-user case below must still read the library.
  cpSync(join(root, 'species'), join(dir, 'species'), { recursive: true });
  for (const f of readdirSync(join(dir, 'species'))) chmodSync(join(dir, 'species', f), 0o644);
  chmodSync(join(dir, 'species'), 0o755);
  chmodSync(join(dir, 'dist'), 0o755);
  chmodSync(join(dir, 'dist', 'cli'), 0o755);
}, 60_000);

interface Run {
  code: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

/** Runs the bundled CLI; `onSpawn` gets the child (to signal it). */
function cli(args: string[], opts: { prefix?: string[]; onSpawn?: (p: ReturnType<typeof spawn>) => void } = {}): Promise<Run> {
  const [cmd, ...pre] = [...(opts.prefix ?? []), process.execPath];
  const p = spawn(cmd!, [...pre, bin, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  p.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
  p.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  opts.onSpawn?.(p);
  return new Promise((res) => p.on('close', (code, signal) => res({ code, signal, stdout, stderr })));
}

/** Every entry of a folder: file bytes (base64), link targets, or "dir". */
function snapshot(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const n of readdirSync(dir).sort()) {
    const p = join(dir, n);
    const st = lstatSync(p);
    out[n] = st.isSymbolicLink() ? `link:${readlinkSync(p)}` : st.isFile() ? readFileSync(p).toString('base64') : 'dir';
  }
  return out;
}

const SYSTEM = '{"element": "Fe", "activity": 1e-6, "title": "Run A"}\n';

/** A fresh folder (world-readable, for the unprivileged case) holding s.json. */
function setup(): { dir: string; sys: string } {
  const dir = tmpDir();
  chmodSync(dir, 0o755);
  const sys = join(dir, 's.json');
  writeFileSync(sys, SYSTEM);
  chmodSync(sys, 0o644);
  return { dir, sys };
}

const temps = (dir: string) => readdirSync(dir).filter((n) => /^\.ephmap-.*\.tmp$|^\.ephmap-commit\.lock$/.test(n));

describe('an output that is an input of the run: exit 2, the input byte-identical', () => {
  it('draw s.json -o s.json', async () => {
    const { dir, sys } = setup();
    const before = snapshot(dir);
    const r = await cli(['draw', sys, '-o', sys]);
    expect(r.code, r.stderr).toBe(2);
    expect(r.stderr).toBe(`ephmap: command line: --output: expected an output file that is not an input of the run, got ${JSON.stringify(sys)}, which is the <file> input ${JSON.stringify(sys)}\n`);
    expect(r.stdout).toBe('');
    expect(snapshot(dir)).toEqual(before);
  });

  it('through a symbolic link and through a hard link', async () => {
    const { dir, sys } = setup();
    symlinkSync('s.json', join(dir, 'soft.json'));
    linkSync(sys, join(dir, 'hard.json'));
    const before = snapshot(dir);
    for (const out of ['soft.json', 'hard.json']) {
      const r = await cli(['draw', sys, '-o', join(dir, out)]);
      expect(r.code, r.stderr).toBe(2);
      expect(r.stderr).toContain(`--output: expected an output file that is not an input of the run, got ${JSON.stringify(join(dir, out))}`);
      expect(snapshot(dir)).toEqual(before);
    }
  });

  it('probe -o onto the --points file, onto the system file, or with the wrong extension', async () => {
    const { dir, sys } = setup();
    const log = join(dir, 'log.csv');
    writeFileSync(log, 'pH,potential\n7,0\n');
    const before = snapshot(dir);
    const onLog = await cli(['probe', sys, '--points', log, '-o', log]);
    expect(onLog.code, onLog.stderr).toBe(2);
    expect(onLog.stderr).toContain(`which is the --points input ${JSON.stringify(log)}`);
    const svg = await cli(['probe', sys, '--points', log, '-o', join(dir, 'out.svg')]);
    expect(svg.code, svg.stderr).toBe(2);
    expect(svg.stderr).toBe(`ephmap: command line: --output: expected a file name ending in .csv, got ${JSON.stringify(join(dir, 'out.svg'))}\n`);
    const onSys = await cli(['probe', sys, '--ph', '7', '--potential', '0', '-o', sys]);
    expect(onSys.code, onSys.stderr).toBe(2);
    expect(onSys.stderr).toContain('which is the <file> input');
    expect(snapshot(dir)).toEqual(before);
  });
});

describe('planted links', () => {
  it('a link at a temp-looking name is neither followed nor removed; an output that is a link is replaced, its target untouched', async () => {
    const { dir, sys } = setup();
    const victim = join(dir, 'victim.txt');
    writeFileSync(victim, 'precious');
    // A stale-looking temp name of ours (dead pid, two days old) that is a link to the victim.
    const planted = join(dir, '.ephmap-1-0123456789abcdef.tmp');
    symlinkSync(victim, planted);
    symlinkSync(victim, join(dir, 'fig.svg'));
    const r = await cli(['draw', sys, '-o', join(dir, 'fig.svg')]);
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(victim, 'utf8')).toBe('precious');
    expect(lstatSync(planted).isSymbolicLink()).toBe(true);
    expect(lstatSync(join(dir, 'fig.svg')).isFile()).toBe(true);
    expect(readFileSync(join(dir, 'fig.svg'), 'utf8')).toContain('<svg');
    expect(temps(dir)).toEqual(['.ephmap-1-0123456789abcdef.tmp']);
  });

  it('a stale temp file of ours (dead writer, old) is swept on the next run into the folder', async () => {
    const { dir, sys } = setup();
    const stale = join(dir, '.ephmap-4194303-00000000deadbeef.tmp');
    writeFileSync(stale, 'half a figure');
    const old = Date.now() / 1000 - 3600;
    utimesSync(stale, old, old);
    const r = await cli(['draw', sys, '-o', join(dir, 'fig.svg')]);
    expect(r.code, r.stderr).toBe(0);
    expect(temps(dir)).toEqual([]);
  });
});

describe('outputs that cannot be written: exit 3, "cannot write PATH: cause", nothing changed', () => {
  it('an output that is a directory', async () => {
    const { dir, sys } = setup();
    mkdirSync(join(dir, 'fig.svg'));
    const before = snapshot(dir);
    const r = await cli(['draw', sys, '-o', join(dir, 'fig.svg')]);
    expect(r.code, r.stderr).toBe(3);
    expect(r.stderr).toBe(`ephmap: cannot write ${join(dir, 'fig.svg')}: it is a directory, not a file\n`);
    expect(r.stdout).toBe('');
    expect(snapshot(dir)).toEqual(before);
  });

  it('a path through a file', async () => {
    const { dir, sys } = setup();
    writeFileSync(join(dir, 'notes.txt'), 'a file');
    const before = snapshot(dir);
    const out = join(dir, 'notes.txt', 'fig.svg');
    const r = await cli(['draw', sys, '-o', out]);
    expect(r.code, r.stderr).toBe(3);
    expect(r.stderr).toBe(`ephmap: cannot write ${out}: a part of the path is a file, not a directory\n`);
    expect(snapshot(dir)).toEqual(before);
  });

  it('a missing directory is refused, not created (every verb alike)', async () => {
    const { dir, sys } = setup();
    const before = snapshot(dir);
    const missing = join(dir, 'nope');
    const cases: [string[], string][] = [
      [['draw', sys, '-o', join(missing, 'fig.svg')], join(missing, 'fig.svg')],
      [['report', sys, '-o', join(missing, 'rep.md')], join(missing, 'rep.svg')],
      [['window', sys, '-o', join(missing, 'w.svg')], join(missing, 'w.svg')],
      [['probe', sys, '--ph', '7', '--potential', '0', '-o', join(missing, 'p.json')], join(missing, 'p.json')],
      [['overlay', sys, '--temperatures', '25,90', '-o', join(missing, 'o.svg')], join(missing, 'o.svg')],
    ];
    for (const [args, path] of cases) {
      const r = await cli(args);
      expect(r.code, `${args[0]}: ${r.stderr}`).toBe(3);
      const errors = r.stderr.split('\n').filter((l) => l !== '' && !l.startsWith('warning: '));
      expect(errors.join('\n')).toBe(`ephmap: cannot write ${path}: the directory ${missing} does not exist (create it first: ephmap does not create directories)`);
      expect(snapshot(dir)).toEqual(before);
    }
  });

  it('an input error and a missing directory together: the input error (exit 2) wins, nothing written', async () => {
    const { dir } = setup();
    const bad = join(dir, 'bad.json');
    writeFileSync(bad, '{"element": "Fe", "colour": "red"}\n');
    const before = snapshot(dir);
    const r = await cli(['draw', bad, '-o', join(dir, 'nope', 'fig.svg')]);
    expect(r.code, r.stderr).toBe(2);
    expect(r.stderr).toMatch(/^ephmap: .*bad\.json: colour: expected one of the known keys/);
    expect(snapshot(dir)).toEqual(before);
  });

  it('demo --out onto a file', async () => {
    const { dir } = setup();
    writeFileSync(join(dir, 'out'), 'a file');
    const before = snapshot(dir);
    const r = await cli(['demo', '--out', join(dir, 'out')]);
    expect(r.code, r.stderr).toBe(3);
    expect(r.stderr).toBe(`ephmap: cannot write ${join(dir, 'out')}: it is a file, not a folder (--out names the folder the diagrams go into)\n`);
    expect(snapshot(dir)).toEqual(before);
  });

  const nobody = process.getuid?.() === 0 && spawnSync('setpriv', ['--reuid=65534', '--regid=65534', '--clear-groups', 'true']).status === 0;
  it.skipIf(!nobody)('a directory the user cannot write to (run as an unprivileged user)', async () => {
    const { dir, sys } = setup();
    writeFileSync(join(dir, 'fig.svg'), 'old figure');
    chmodSync(join(dir, 'fig.svg'), 0o644);
    const before = snapshot(dir);
    const r = await cli(['draw', sys, '-o', join(dir, 'fig.svg')], { prefix: ['setpriv', '--reuid=65534', '--regid=65534', '--clear-groups'] });
    expect(r.code, r.stderr).toBe(3);
    expect(r.stderr).toBe(`ephmap: cannot write ${join(dir, 'fig.svg')}: permission denied\n`);
    expect(snapshot(dir)).toEqual(before);
  });
});

describe('probe -o for one point', () => {
  it('writes the JSON answer, the same bytes as --json prints', async () => {
    const { dir, sys } = setup();
    const out = join(dir, 'p.json');
    const w = await cli(['probe', sys, '--ph', '7', '--potential', '0', '-o', out]);
    expect(w.code, w.stderr).toBe(0);
    expect(w.stdout).toBe(`wrote ${out}\n`);
    const j = await cli(['probe', sys, '--ph', '7', '--potential', '0', '--json']);
    expect(readFileSync(out, 'utf8')).toBe(j.stdout);
    const csv = await cli(['probe', sys, '--ph', '7', '--potential', '0', '-o', join(dir, 'p.csv')]);
    expect(csv.code).toBe(2);
    expect(csv.stderr).toBe(`ephmap: command line: --output: expected a file name ending in .json, got ${JSON.stringify(join(dir, 'p.csv'))}\n`);
  });
});

describe('report: the document and its figure are one set', () => {
  it('two concurrent runs to the same path leave md and svg from the same run (5 trials)', async () => {
    const { dir } = setup();
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    writeFileSync(a, '{"element": "Fe", "activity": 1e-6, "title": "Run A"}\n');
    writeFileSync(b, '{"element": "Fe", "activity": 1e-6, "title": "Run B"}\n');
    const md = join(dir, 'rep.md');
    for (let trial = 0; trial < 5; trial++) {
      const [ra, rb] = await Promise.all([cli(['report', a, '-o', md]), cli(['report', b, '-o', md])]);
      expect(ra.code, ra.stderr).toBe(0);
      expect(rb.code, rb.stderr).toBe(0);
      const text = readFileSync(md, 'utf8');
      const svg = readFileSync(join(dir, 'rep.svg'), 'utf8');
      const run = text.includes('Run A') ? 'Run A' : 'Run B';
      const other = run === 'Run A' ? 'Run B' : 'Run A';
      expect(text).not.toContain(other);
      expect(svg).toContain(run);
      expect(svg).not.toContain(other);
      expect(temps(dir)).toEqual([]);
    }
  });
});

describe('signals', () => {
  it('SIGTERM during a draw: no temporary file left, the old output either unchanged or wholly new', async () => {
    const { dir, sys } = setup();
    const out = join(dir, 'fig.svg');
    const fresh = await cli(['draw', sys, '-o', join(dir, 'ref.svg')]);
    expect(fresh.code, fresh.stderr).toBe(0);
    const full = readFileSync(join(dir, 'ref.svg'), 'utf8');
    let killedMidWrite = 0;
    // The watcher's event races the writer (write, fsync, rename take about a millisecond), so
    // trials repeat until two kills have landed while a temporary file existed (at most 25).
    for (let trial = 0; trial < 25 && killedMidWrite < 2; trial++) {
      writeFileSync(out, 'old figure');
      // Kill the moment a temporary file appears (or after a staggered delay, whichever is first).
      const r = await cli(['draw', sys, '-o', out], {
        onSpawn: (p) => {
          const w = watch(dir, (_ev, name) => {
            if (name && /^\.ephmap-.*\.tmp$/.test(String(name)) && lstatSync(join(dir, String(name)), { throwIfNoEntry: false })) {
              killedMidWrite++;
              p.kill('SIGTERM');
              w.close();
            }
          });
          p.on('close', () => w.close());
          setTimeout(() => p.kill('SIGTERM'), 150 + 40 * trial);
        },
      });
      expect(r.code === 0 || r.signal === 'SIGTERM', `${r.code} ${r.signal} ${r.stderr}`).toBe(true);
      expect(temps(dir)).toEqual([]);
      expect(['old figure', full]).toContain(readFileSync(out, 'utf8'));
    }
    // Kills landed while a temporary file existed (the watcher saw it, and it was still there).
    expect(killedMidWrite).toBeGreaterThan(0);
  }, 120_000);
});
