/** The output-path checks and the CSV-cell neutraliser. */
import { linkSync, mkdirSync, symlinkSync, writeFileSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXIT, InputError } from '../../src/errors.js';
import { neutraliseCsvCell } from '../../src/io/csv-cell.js';
import { refuseInputsAsOutputs, requireExtension } from '../../src/io/path-safety.js';
import { tmpDir } from '../helpers/tmp.js';

function thrown(f: () => void): InputError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).exitStatus).toBe(EXIT.input);
    return e as InputError;
  }
  throw new Error('expected a refusal');
}

describe('refuseInputsAsOutputs', () => {
  const setup = () => {
    const dir = tmpDir();
    const sys = join(dir, 's.json');
    const points = join(dir, 'log.csv');
    writeFileSync(sys, '{"element":"Fe"}');
    writeFileSync(points, 'pH,E\n7,0\n');
    return { dir, sys, points, inputs: [{ path: sys, option: '<file>' }, { path: points, option: '--points' }] };
  };

  it('refuses the system file as the output, naming option, output and input; the file is unchanged', () => {
    const { sys, inputs } = setup();
    const e = thrown(() => refuseInputsAsOutputs([{ path: sys, option: '--output' }], inputs));
    expect(e.field).toBe('--output');
    expect(e.message).toContain('not an input of the run');
    expect(e.message).toContain(`the <file> input ${JSON.stringify(sys)}`);
    expect(readFileSync(sys, 'utf8')).toBe('{"element":"Fe"}');
  });

  it('refuses the points file, also through a relative path, a symlink and a hard link', () => {
    const { dir, points, inputs } = setup();
    symlinkSync(points, join(dir, 'via-link.csv'));
    linkSync(points, join(dir, 'hard.csv'));
    mkdirSync(join(dir, 'sub'));
    for (const p of [relative(process.cwd(), points), join(dir, 'via-link.csv'), join(dir, 'hard.csv'), join(dir, 'sub', '..', 'log.csv')]) {
      const e = thrown(() => refuseInputsAsOutputs([{ path: p, option: '--output' }], inputs));
      expect(e.message).toContain('--points input');
    }
  });

  it('allows a new file and an existing unrelated file', () => {
    const { dir, inputs } = setup();
    writeFileSync(join(dir, 'old.svg'), 'x');
    expect(() => refuseInputsAsOutputs([{ path: join(dir, 'new.svg'), option: '--output' }, { path: join(dir, 'old.svg'), option: '--figure' }], inputs)).not.toThrow();
  });

  it('refuses two outputs that are one file', () => {
    const { dir, inputs } = setup();
    writeFileSync(join(dir, 'a.svg'), 'x');
    symlinkSync(join(dir, 'a.svg'), join(dir, 'b.svg'));
    const e = thrown(() => refuseInputsAsOutputs([{ path: join(dir, 'a.svg'), option: '--output' }, { path: join(dir, 'b.svg'), option: '--figure' }], inputs));
    expect(e.field).toBe('--figure');
  });
});

describe('requireExtension', () => {
  it('accepts a listed extension in any case and refuses another, naming the option', () => {
    expect(requireExtension('out.CSV', ['.csv'], '--output')).toBe('.csv');
    const e = thrown(() => requireExtension('out.svg', ['.csv'], '--output'));
    expect(e.message).toBe('command line: --output: expected a file name ending in .csv, got "out.svg"');
    thrown(() => requireExtension('out', ['.csv', '.json'], '--output'));
  });
});

describe('neutraliseCsvCell (common practice: spreadsheet formula injection)', () => {
  it('prefixes a quote to text a spreadsheet would run as a formula', () => {
    for (const s of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx', '\rx', '  =x', '\uff1dx']) {
      expect(neutraliseCsvCell(s)).toBe(`'${s}`);
    }
  });

  it('leaves a plain number alone, signed or with a decimal comma (a number is never run as a formula)', () => {
    for (const s of ['-12.5', '-12,5', '+3', '-7', '-1e-5', '-.5', '+0,25E+3']) expect(neutraliseCsvCell(s)).toBe(s);
    for (const s of ['-2+3', '-1e5+cmd', '- 5', '-12,5,0', '-', '+', '-0x1F', '-Infinity']) expect(neutraliseCsvCell(s)).toBe(`'${s}`);
  });

  it('leaves ordinary text alone', () => {
    for (const s of ['Fe+2', 'Fe(OH)3', 'magnetite', '', 'a=b', 'x-y']) expect(neutraliseCsvCell(s)).toBe(s);
  });
});
