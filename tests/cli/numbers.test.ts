/**
 * Numbers typed on the command line are read strictly (src/cli/args.ts, Fields.numberText): an
 * empty or blank value (which Number() reads as 0), hex ("0x7" → 7), "Infinity", overflow
 * ("1e999") and values outside the ranges of the matching file keys are refused with exit 2 and a
 * message naming the option — never answered. Nothing is written.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\nactivity: 1.0e-6\n');

async function refused(args: string[], option: string): Promise<void> {
  const r = await runCli(args);
  expect(r.code, r.stderr).toBe(2);
  expect(r.stderr).toMatch(new RegExp(`^ephmap: command line: ${option.replace(/[-/\\^$*+?.()|[\]{}]/g, '\\$&')}: expected `));
  expect(r.stderr.trim().split('\n')).toHaveLength(1);
  expect(r.stdout).toBe('');
}

describe('what-if options of every verb that reads a system file', () => {
  const out = join(dir, 'x.svg');
  it.each([
    ['--temperature', ''],
    ['--temperature', ' '],
    ['--temperature', '0x7'],
    ['--temperature', 'Infinity'],
    ['--temperature', '400'],
    ['--activity', ''],
    ['--activity', '1e999'],
    ['--activity', '0'],
    ['--activity', '1e300'],
  ])('draw %s %j', async (option, value) => {
    await refused(['draw', fe, '-o', out, option, value], option);
    expect(existsSync(out)).toBe(false);
  });

  it('lines, window, probe and report read them the same way', async () => {
    await refused(['lines', fe, '--temperature', ''], '--temperature');
    await refused(['window', fe, '--activity', ''], '--activity');
    await refused(['probe', fe, '--ph', '7', '--potential', '0', '--temperature', ''], '--temperature');
    await refused(['report', fe, '-o', join(dir, 'r.md'), '--temperature', '0x7'], '--temperature');
    expect(existsSync(join(dir, 'r.md'))).toBe(false);
  });
});

describe('probe at one point: pH from -3 to 17 and E from -5 to 5 V, as the file keys', () => {
  it.each([
    ['--ph', '1e300'],
    ['--ph', ''],
    ['--ph', '100'],
    ['--ph', '0x7'],
    ['--potential', '1e9'],
    ['--potential', ' '],
    ['--potential', '-6'],
  ])('%s %j', async (option, value) => {
    const args = ['probe', fe, '--ph', '7', '--potential', '0'];
    args[args.indexOf(option) + 1] = value;
    await refused(args, option);
  });

  it('a valid point still answers (pH 7, 0 V: the iron–water diagram has a field there)', async () => {
    const r = await runCli(['probe', fe, '--ph', '7', '--potential', '0', '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout)).toHaveProperty('pH', 7);
  });
});

describe('cell and overlay', () => {
  it('cell --ph, --temperature, --electrons and --range refuse loose numbers', async () => {
    const rxn = 'Cu+2 + 2e- = Cu(s)';
    await refused(['cell', rxn, '--reference', 'rhe', '--ph', '1e300'], '--ph');
    await refused(['cell', rxn, '--temperature', ''], '--temperature');
    await refused(['cell', rxn, '--temperature', '0x19'], '--temperature');
    await refused(['cell', rxn, '--electrons', '0x2'], '--electrons');
    await refused(['cell', rxn, '--range', '0x19:100:25'], '--range');
  });

  it('overlay --temperatures and --activities refuse hex and blanks', async () => {
    await refused(['overlay', fe, '--temperatures', '25,0x5A', '-o', join(dir, 'o.svg')], '--temperatures');
    await refused(['overlay', fe, '--activities', '1e-6, ', '-o', join(dir, 'o.svg')], '--activities');
    expect(existsSync(join(dir, 'o.svg'))).toBe(false);
  });
});
