/**
 * The safe writer in-process: exact bytes, exclusive temporary files that never follow a planted
 * link, OutputError (exit 3) naming the path and the cause for each I/O failure, removal of temps
 * on failure, and the sweep of stale temps that never touches anyone else's file. Every test
 * checks the exact bytes of each pre-existing file afterwards.
 */
import { existsSync, lstatSync, mkdirSync, readdirSync, readFileSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXIT, OutputError } from '../../src/errors.js';
import { causeOf, toOutputError } from '../../src/io/output-errors.js';
import { commitOutputs, makeOutputDir, writeOutput } from '../../src/io/safe-write.js';
import { liveTemps, sweepStaleTemps, TEMP_PATTERN, tempName } from '../../src/io/temp-files.js';
import { tmpDir } from '../helpers/tmp.js';

/** Snapshot of every file in a directory: name → bytes (links as "link→target"). */
function snapshot(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const n of readdirSync(dir).sort()) {
    const p = join(dir, n);
    const st = lstatSync(p);
    out[n] = st.isSymbolicLink() ? 'link' : st.isDirectory() ? 'dir' : readFileSync(p).toString('base64');
  }
  return out;
}

async function refused(p: Promise<unknown>): Promise<OutputError> {
  const e = await p.then(() => undefined, (x: unknown) => x);
  expect(e).toBeInstanceOf(OutputError);
  expect((e as OutputError).exitStatus).toBe(EXIT.output);
  return e as OutputError;
}

describe('writeOutput', () => {
  it('writes the exact bytes and leaves no temporary file', async () => {
    const dir = tmpDir();
    const bytes = Uint8Array.from([0, 1, 2, 255, 10, 13]);
    await writeOutput(join(dir, 'a.bin'), bytes);
    await writeOutput(join(dir, 'b.txt'), 'Fe²⁺\n');
    expect(readFileSync(join(dir, 'a.bin')).equals(Buffer.from(bytes))).toBe(true);
    expect(readFileSync(join(dir, 'b.txt'), 'utf8')).toBe('Fe²⁺\n');
    expect(readdirSync(dir).sort()).toEqual(['a.bin', 'b.txt']);
    expect(liveTemps()).toEqual([]);
  });

  it('creates missing directories on the way', async () => {
    const dir = tmpDir();
    await writeOutput(join(dir, 'x', 'y', 'f.svg'), '<svg/>');
    expect(readFileSync(join(dir, 'x', 'y', 'f.svg'), 'utf8')).toBe('<svg/>');
  });

  it('temporary names are random and recognisable', () => {
    const a = tempName();
    const b = tempName();
    expect(a).not.toBe(b);
    expect(a).toMatch(TEMP_PATTERN);
    expect(a.startsWith(`.ephmap-${process.pid}-`)).toBe(true);
  });
});

describe('planted links are never followed', () => {
  it('a link at the temporary name: refused (exit 3), the victim and the old output unchanged', async () => {
    const dir = tmpDir();
    const victim = join(tmpDir(), 'victim.txt');
    writeFileSync(victim, 'precious');
    writeFileSync(join(dir, 'out.svg'), 'old');
    const name = `.ephmap-${process.pid}-0000000000000000.tmp`;
    symlinkSync(victim, join(dir, name));
    const before = snapshot(dir);
    const e = await refused(writeOutput(join(dir, 'out.svg'), 'new', { tempName: () => name }));
    expect(e.message).toBe(`cannot write ${join(dir, 'out.svg')}: something already exists at the temporary name ${name} (not followed, not removed)`);
    expect(readFileSync(victim, 'utf8')).toBe('precious');
    expect(snapshot(dir)).toEqual(before);
  });

  it('a dangling link at the temporary name is not created through either', async () => {
    const dir = tmpDir();
    const victim = join(tmpDir(), 'would-be-created.txt');
    const name = `.ephmap-${process.pid}-1111111111111111.tmp`;
    symlinkSync(victim, join(dir, name));
    await refused(writeOutput(join(dir, 'out.svg'), 'new', { tempName: () => name }));
    expect(existsSync(victim)).toBe(false);
  });

  it('links at the old predictable names (.NAME.PID.tmp) are ignored; the victim is unchanged', async () => {
    const dir = tmpDir();
    const victim = join(tmpDir(), 'victim.txt');
    writeFileSync(victim, 'precious');
    for (const pid of [process.pid, process.pid + 1]) symlinkSync(victim, join(dir, `.out.svg.${pid}.tmp`));
    await writeOutput(join(dir, 'out.svg'), 'new');
    expect(readFileSync(victim, 'utf8')).toBe('precious');
    expect(readFileSync(join(dir, 'out.svg'), 'utf8')).toBe('new');
  });

  it('a link at the target is replaced by the file, never written through', async () => {
    const dir = tmpDir();
    const victim = join(tmpDir(), 'victim.txt');
    writeFileSync(victim, 'precious');
    symlinkSync(victim, join(dir, 'out.svg'));
    await writeOutput(join(dir, 'out.svg'), 'new');
    expect(readFileSync(victim, 'utf8')).toBe('precious');
    expect(lstatSync(join(dir, 'out.svg')).isFile()).toBe(true);
    expect(readFileSync(join(dir, 'out.svg'), 'utf8')).toBe('new');
  });
});

describe('I/O failures become OutputError naming the path and the cause', () => {
  it('the output is a directory', async () => {
    const dir = tmpDir();
    mkdirSync(join(dir, 'fig.svg'));
    const e = await refused(writeOutput(join(dir, 'fig.svg'), 'x'));
    expect(e.message).toBe(`cannot write ${join(dir, 'fig.svg')}: it is a directory, not a file`);
    expect(snapshot(dir)).toEqual({ 'fig.svg': 'dir' });
  });

  it('a path through a file', async () => {
    const dir = tmpDir();
    writeFileSync(join(dir, 'file'), 'keep');
    const e = await refused(writeOutput(join(dir, 'file', 'fig.svg'), 'x'));
    expect(e.message).toContain(join(dir, 'file', 'fig.svg'));
    expect(e.reason).toMatch(/a part of the path is a file|a file is in the way/);
    expect(readFileSync(join(dir, 'file'), 'utf8')).toBe('keep');
  });

  it('a name too long for the file system', async () => {
    const dir = tmpDir();
    const e = await refused(writeOutput(join(dir, `${'n'.repeat(300)}.svg`), 'x'));
    expect(e.reason).toBe('the name is too long for the file system');
    expect(readdirSync(dir)).toEqual([]);
  });

  it('a missing directory when directories are not to be made', async () => {
    const dir = tmpDir();
    const e = await refused(writeOutput(join(dir, 'no', 'f.svg'), 'x', { makeDirs: false }));
    expect(e.reason).toBe('a directory on the way does not exist');
  });

  it('an output directory onto an existing file (a demo folder): exit 3, the file unchanged', () => {
    const dir = tmpDir();
    writeFileSync(join(dir, 'plots'), 'a file');
    let e: unknown;
    try {
      makeOutputDir(join(dir, 'plots'));
    } catch (x) {
      e = x;
    }
    expect(e).toBeInstanceOf(OutputError);
    expect((e as OutputError).message).toBe(`cannot write ${join(dir, 'plots')}: a file is in the way where a directory is needed`);
    expect(readFileSync(join(dir, 'plots'), 'utf8')).toBe('a file');
    makeOutputDir(join(dir, 'new', 'plots'));
    expect(lstatSync(join(dir, 'new', 'plots')).isDirectory()).toBe(true);
  });

  it('the same file twice in one set', async () => {
    const dir = tmpDir();
    const p = join(dir, 'a.md');
    await refused(commitOutputs([{ path: p, data: '1' }, { path: join(dir, '.', 'a.md'), data: '2' }]));
    expect(readdirSync(dir)).toEqual([]);
  });

  it('translation keeps the system error as cause and passes defects through', () => {
    const sys = Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC' });
    const e = toOutputError('/x/out.svg', sys) as OutputError;
    expect(e).toBeInstanceOf(OutputError);
    expect(e.message).toBe('cannot write /x/out.svg: no space left on the device');
    expect(e.cause).toBe(sys);
    const bug = new TypeError('x is not a function');
    expect(toOutputError('/x', bug)).toBe(bug);
    expect(causeOf('EROFS')).toBe('the file system is read-only');
    expect(causeOf('EWEIRD')).toBe('the system reported EWEIRD');
  });

  it('a failure while writing the second file of a set leaves both old files unchanged', async () => {
    const dir = tmpDir();
    writeFileSync(join(dir, 'rep.svg'), 'old svg');
    writeFileSync(join(dir, 'rep.md'), 'old md');
    mkdirSync(join(dir, 'blocker'));
    const before = snapshot(dir);
    // the second temp cannot be created: its name is an existing directory
    let k = 0;
    const names = [tempName(), 'blocker'];
    await refused(
      commitOutputs([{ path: join(dir, 'rep.svg'), data: 'new svg' }, { path: join(dir, 'rep.md'), data: 'new md' }], { tempName: () => names[k++]! }),
    );
    expect(snapshot(dir)).toEqual(before);
    expect(liveTemps()).toEqual([]);
  });
});

describe('stale temporary files', () => {
  const old = (p: string, ageMs: number) => utimesSync(p, new Date(Date.now() - ageMs), new Date(Date.now() - ageMs));
  const deadPid = 2 ** 22 + 12345; // above the usual pid_max: no such process

  it('removes only regular files of ours whose writer is dead, or that are a day old', () => {
    const dir = tmpDir();
    const victim = join(tmpDir(), 'victim');
    writeFileSync(victim, 'precious');
    const files = {
      dead: `.ephmap-${deadPid}-aaaaaaaaaaaaaaaa.tmp`,
      deadFresh: `.ephmap-${deadPid}-bbbbbbbbbbbbbbbb.tmp`,
      alive: `.ephmap-1-cccccccccccccccc.tmp`,
      ancient: `.ephmap-1-dddddddddddddddd.tmp`,
      other: `.ephmap-notes.tmp`,
      user: 'results.tmp',
    };
    for (const n of Object.values(files)) writeFileSync(join(dir, n), 'x');
    old(join(dir, files.dead), 120_000);
    old(join(dir, files.alive), 3_600_000);
    old(join(dir, files.ancient), 25 * 3_600_000);
    old(join(dir, files.other), 30 * 3_600_000);
    old(join(dir, files.user), 30 * 3_600_000);
    const link = `.ephmap-${deadPid}-eeeeeeeeeeeeeeee.tmp`;
    symlinkSync(victim, join(dir, link));
    mkdirSync(join(dir, `.ephmap-${deadPid}-ffffffffffffffff.tmp`));
    expect(sweepStaleTemps(dir).sort()).toEqual([files.dead, files.ancient].sort());
    expect(readdirSync(dir).sort()).toEqual(
      [files.deadFresh, files.alive, files.other, files.user, link, `.ephmap-${deadPid}-ffffffffffffffff.tmp`].sort(),
    );
    expect(readFileSync(victim, 'utf8')).toBe('precious');
  });

  it('the next write into the directory sweeps them', async () => {
    const dir = tmpDir();
    const stale = join(dir, `.ephmap-${deadPid}-0123456789abcdef.tmp`);
    writeFileSync(stale, 'left by a killed run');
    old(stale, 120_000);
    await writeOutput(join(dir, 'f.json'), '{}');
    expect(readdirSync(dir)).toEqual(['f.json']);
  });
});
