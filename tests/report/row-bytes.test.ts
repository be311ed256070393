/**
 * The byte writer of streamed rows (report/row-bytes.ts): its numbers are the text of
 * String(Number(v.toPrecision(8))) — the definition of num8 (report/points-csv.ts) — for a million
 * pseudo-random doubles over every magnitude and for the edge cases (halves, powers of ten, the
 * ends of plain notation, subnormals, ±0, NaN, ±Infinity); text is written as UTF-8.
 */
import { describe, expect, it } from 'vitest';
import { adviceText } from '../../src/analysis/probe.js';
import { csvField } from '../../src/io/csv-records.js';
import { CellText, num8, pointsRowLine, writeAdvice, writePointsRow } from '../../src/report/points-csv.js';
import { RowBytes } from '../../src/report/row-bytes.js';

const reference = (v: number) => String(Number(v.toPrecision(8)));

function bytesOf(v: number | null | undefined): string {
  const w = new RowBytes(16); // small, so that growing is exercised too
  w.text('<');
  w.num8(v);
  w.text('>');
  return w.take().toString('utf8');
}

describe('RowBytes.num8', () => {
  it('writes the text of num8 for 10⁶ pseudo-random doubles of every magnitude', () => {
    const view = new DataView(new ArrayBuffer(8));
    let seed = 12345;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const w = new RowBytes(1 << 16);
    let bad = 0;
    let first = '';
    for (let i = 0; i < 1_000_000; i++) {
      let v: number;
      if (i % 4 === 0) {
        // Any bit pattern: every exponent, subnormals, NaN and infinities included.
        view.setUint32(0, Math.floor(rnd() * 2 ** 32));
        view.setUint32(4, Math.floor(rnd() * 2 ** 32));
        v = view.getFloat64(0);
      } else if (i % 4 === 1) v = (rnd() - 0.5) * 10 ** Math.floor(rnd() * 30 - 12);
      else if (i % 4 === 2) v = Math.round((rnd() - 0.5) * 2e8) / 10 ** Math.floor(rnd() * 12); // short decimals, ties near halves
      else v = (rnd() - 0.5) * 2000; // the range of margins and distances
      w.num8(v);
      const got = w.take().toString('latin1');
      if (got !== reference(v)) {
        bad++;
        first ||= `${v}: ${got} vs ${reference(v)}`;
      }
    }
    expect(first).toBe('');
    expect(bad).toBe(0);
  });

  it('writes the edge cases as num8 does', () => {
    const cases = [0, -0, 1, -1, 0.5, 1.5, 2.5, 123456785, 12345678.5, 1.00000005, 0.1, 0.2 + 0.1, 1e-6, 9.9999999e-7, 1e-7, 1.234e-7, 1e-15, 9.99999999e-16, 1e-300, 5e-324,
      1e20, 1e21, 9.99999995e20, 99999999.5, 99999999.4, 0.999999995, 4.6349387, -72.29315, -0.000012345678, 2 ** 53, Number.MAX_VALUE, Number.MIN_VALUE, NaN, Infinity, -Infinity, 123.45, 1e-5 / 3];
    for (const v of cases) {
      expect(bytesOf(v)).toBe(`<${reference(v)}>`);
      expect(bytesOf(v)).toBe(`<${num8(v)}>`);
    }
    expect(bytesOf(null)).toBe('<>');
    expect(bytesOf(undefined)).toBe('<>');
  });

  it('the module example: 4.6349387 and −0.000012345678', () => {
    expect(bytesOf(4.6349387)).toBe('<4.6349387>');
    expect(bytesOf(-0.000012345678)).toBe('<-0.000012345678>');
  });
});

describe('RowBytes.text and int', () => {
  it('writes ASCII and any other text as UTF-8, growing as needed', () => {
    const w = new RowBytes(4);
    const parts = ['line,', 'Fe²⁺ ⇌ Fe³⁺ + e⁻', ',25 °C,', '𝛙 (astral)', 'x'.repeat(1000)];
    for (const p of parts) w.text(p);
    w.int(0);
    w.int(1234567890);
    expect(w.take().toString('utf8')).toBe(parts.join('') + '01234567890');
    expect(w.length).toBe(0);
  });
});

describe('a points row written as bytes', () => {
  it('is the UTF-8 of the same row written as text (pointsRowLine)', () => {
    const f = { predominant: 'Fe+2', verdict: 'corrosion' as const, runnerUp: 'Fe(OH)2', marginKJ: 4.634939, distanceMV: -72.29315, distancePH: null, nearestReaction: 'Fe(s) = Fe+2 + 2e-', advice: { k: 3, shift: 0.3055018, to: 'Fe(OH)2', verdict: 'passivation' as const }, warnings: ['undetermined away from 25 °C: a, b'], celsius: 60.5 };
    const rows = [
      { line: 7, pH: 6.25, potential: -0.4, extra: ['=cmd', 'a "quoted", cell'], given: { pH: '6.25' }, unit: 'mV' as const },
      { line: 123456, pH: 1 / 3, potential: 2 / 3, extra: [], given: {}, unit: 'V' as const },
    ];
    for (const sep of [',', ';', '\t']) {
      for (const row of rows) {
        for (const more of [[], ['vs SCE: 0.244 V at 25 °C']]) {
          const w = new RowBytes(8);
          writePointsRow(w, row, 'SCE', -0.1234, f, more, sep);
          expect(w.take().toString('utf8')).toBe(pointsRowLine(row, 'SCE', -0.1234, f, more, sep));
        }
      }
    }
  });
});

describe('the advice cell written part by part (points-csv.ts writeAdvice)', () => {
  it('is csvField of the whole sentence (probe.ts adviceText) for every choice and separator', () => {
    // Worked example: adviceText(2, −0.3055, "Fe^2+", "corrosion") → "Nearest change: lowering the
    // pH by 0.31 reaches Fe^2+ (corrosion)." (the sentence probe prints).
    expect(adviceText(2, -0.3055, 'Fe^2+', 'corrosion')).toBe('Nearest change: lowering the pH by 0.31 reaches Fe^2+ (corrosion).');
    let n = 0;
    for (const sep of [',', ';', '\t']) {
      for (const k of [-1, 0, 1, 2, 3]) {
        for (const shift of [0.0004, -0.0004, 0.125, -0.125, 1.005, -2.5e-7, 12.345678]) {
          // The second name cannot be a formula; it checks the quoted fallback all the same.
          for (const to of ['Fe^2+', 'Cu(NH3)2^+', 'odd, "name"; x\ty']) {
            const w = new CellText();
            writeAdvice(w, { k, shift, to, verdict: 'passivation' }, sep);
            expect(w.s).toBe(csvField(adviceText(k, shift, to, 'passivation'), sep));
            const b = new RowBytes(8);
            writeAdvice(b, { k, shift, to, verdict: 'passivation' }, sep);
            expect(b.take().toString('utf8')).toBe(w.s);
            n++;
          }
        }
      }
    }
    expect(n).toBe(3 * 5 * 7 * 3);
  });
});

describe('RowBytes.toFixed', () => {
  it('writes the text of Number.prototype.toFixed for 0 and 2 digits (the definition it speeds up)', () => {
    // Worked examples: −0.3055018 to 2 digits is "-0.31"; 249.65151 to 0 digits is "250".
    const one = (v: number, d: 0 | 2) => {
      const w = new RowBytes(4);
      w.toFixed(v, d);
      return w.take().toString('utf8');
    };
    expect(one(-0.3055018, 2)).toBe('-0.31');
    expect(one(249.65151, 0)).toBe('250');
    let seed = 99;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const values = [0, -0, 0.5, -0.5, 1.5, 2.5, 0.005, 0.015, 0.125, -0.125, 1.005, 1.045, 0.0004, -0.0004, -0.004, 19999999.995, 2e7, -2e7, 1e21, NaN, Infinity, -Infinity, 1234.5678];
    for (let k = 0; k < 20000; k++) values.push((rnd() - 0.5) * 10 ** Math.floor(rnd() * 10 - 4));
    for (let k = 0; k < 20000; k++) values.push(Math.round((rnd() - 0.5) * 1e6) / 1000); // many exact or near halves
    for (const v of values) for (const d of [0, 2] as const) expect(one(v, d), `${v} to ${d}`).toBe(v.toFixed(d));
  });
});

describe('RowBytes.recurring', () => {
  it('writes the same bytes as text, for short, long and non-ASCII texts, before and after its store is emptied', () => {
    const w = new RowBytes(8);
    let expected = '';
    const parts = ['Fe', ',', 'Fe3O4(s) + 8H^+ + 8e^- <=> 3Fe(s) + 4H2O(l),', 'Nearest change: lowering the pH by ', 'undetermined away from 25 °C: Fe²⁺ ⇌ Fe³⁺,', '𝛙 astral text of some length'];
    for (let k = 0; k < 3; k++) {
      for (const p of parts) {
        w.recurring(p);
        w.text('|');
        expected += `${p}|`;
      }
    }
    for (let n = 0; n < 5000; n++) {
      const p = `a recurring text number ${n}`;
      w.recurring(p);
      expected += p;
    }
    for (const p of parts) w.recurring(p);
    expected += parts.join('');
    expect(w.take().toString('utf8')).toBe(expected);
  });
});
