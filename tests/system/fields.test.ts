/** Field checkers: user maps without prototype keys, numbers typed as text, capped echoes, hidden characters. */
import { describe, expect, it } from 'vitest';
import { capText, InputError } from '../../src/errors.js';
import { Fields } from '../../src/system/fields.js';
import { readSpec } from '../../src/system/spec.js';

const f = new Fields('sys.yaml');

function message(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('Fields.entries', () => {
  it('gives own entries and refuses __proto__, constructor and prototype, naming the field', () => {
    expect(f.entries({ NaCl: 0.1 }, 'background', 'a map')).toEqual([['NaCl', 0.1]]);
    const proto = JSON.parse('{"__proto__": 1}') as unknown;
    expect(message(() => f.entries(proto, 'pick', 'a map'))).toBe('sys.yaml: pick.__proto__: expected keys other than __proto__, constructor, prototype, got the key "__proto__"');
    expect(message(() => f.entries({ constructor: 1 }, 'classes', 'a map'))).toContain('classes.constructor');
    expect(message(() => f.entries([1], 'classes', 'a map of formula → verdict'))).toContain('expected a map of formula → verdict');
  });

  it('readSpec builds user maps without a prototype', () => {
    const spec = readSpec({ element: 'Fe', ligands: { S: 1e-3 }, pick: { 'Fe+2': 'x' }, classes: { Fe: 'immunity' } }, 'sys.yaml');
    for (const m of [spec.ligands, spec.ligandGroups, spec.ligandAmounts, spec.ligandSpecies, spec.pick, spec.operating.classes]) {
      expect(Object.getPrototypeOf(m)).toBe(null);
    }
    expect('toString' in spec.pick).toBe(false);
  });
});

describe('Fields.numberText (command-line numbers)', () => {
  it('reads decimal numbers', () => {
    expect(f.numberText('25', '--temperature')).toBe(25);
    expect(f.numberText('-1.5e-3', '--x')).toBe(-0.0015);
    expect(f.numberText('.5', '--x')).toBe(0.5);
  });

  it.each(['', ' ', '0x7', 'Infinity', '1e', '7 ', 'NaN', '1,5'])('refuses %j (Number() would read "" as 0)', (t) => {
    expect(message(() => f.numberText(t, '--temperature'))).toContain('--temperature: expected a decimal number');
  });

  it('applies the range of number()', () => {
    expect(message(() => f.numberText('1e300', '--ph', { min: -3, max: 17 }))).toContain('from -3 to 17');
  });
});

describe('echoed text is capped', () => {
  it('capText keeps at most n characters and marks the cut', () => {
    expect(capText('abc', 3)).toBe('abc');
    expect(capText('abcd', 3)).toBe('abc…');
  });

  it('an InputError with a huge field and value stays short', () => {
    const e = new InputError('f.yaml', 'k'.repeat(200_000), 'a known key', 'v'.repeat(200_000));
    expect(e.message.length).toBeLessThan(300);
    expect(e.field.length).toBe(200_000);
  });
});

describe('hidden characters in text', () => {
  it.each([
    ['\u202e', '202E'],
    ['\u2066', '2066'],
    ['\u200b', '200B'],
    ['\u200f', '200F'],
    ['\ufeff', 'FEFF'],
  ])('refuses %j, naming the code point and the field', (ch, code) => {
    expect(message(() => f.string(`a${ch}b`, 'title', 'a title text'))).toBe(`sys.yaml: title: expected a title text without invisible or text-direction characters, got U+${code} at character 2`);
  });

  it('keeps joiners that scripts and emoji need', () => {
    expect(f.string('👩\u200d🔬 lab', 'title')).toBe('👩\u200d🔬 lab');
  });
});
