/** Writing and reading logged-series rows (report/points-csv.ts). */
import { describe, expect, it } from 'vitest';
import { newPointRow, num8, plainDecimal, readPointRow, readPointsHeader } from '../../src/report/points-csv.js';

describe('num8', () => {
  it('prints the same text as String(Number(v.toPrecision(8))) (the definition it speeds up)', () => {
    let seed = 12345;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const values = [0, -0, 1, -1, 0.1, 1e-7, 123456785, 0.123456785, 99999999.5, 9.99999995, 1e21, 1e-16, 5e-324, 1.7976931348623157e308, 12000000000, 275.366745, -1.55155385];
    for (let k = 0; k < 20000; k++) values.push((rnd() - 0.5) * 10 ** Math.floor(rnd() * 30 - 12));
    for (let k = 0; k < 2000; k++) values.push(Math.round(rnd() * 1e9) / 10 ** Math.floor(rnd() * 12)); // exact halves in decimal
    for (const v of values) expect(num8(v)).toBe(String(Number(v.toPrecision(8))));
  });
});

describe('plainDecimal', () => {
  it('reads what /^-?\\d{1,9}(?:\\.\\d{1,8})?$/ accepts exactly as Number() does, and gives NaN for the rest', () => {
    // The definition it replaces: the regular expression, then Number(); −0 kept apart from 0.
    const PLAIN = /^-?\d{1,9}(?:\.\d{1,8})?$/;
    const ref = (c: string) => (PLAIN.test(c) ? Number(c) : NaN);
    let seed = 4242;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const cells = ['', '-', '.', '7.', '.5', '-0', '-0.0', '0', '007.250', '123456789', '1234567890', '1.12345678', '1.123456789', '123456789.12345678', '999999999.99999999', '1e3', '+1', ' 1', '1 ', '1,5', '0x7', 'Infinity', '--1', '1.2.3'];
    const alphabet = '0123456789-.e+, ';
    for (let k = 0; k < 20000; k++) {
      let c = '';
      const len = 1 + Math.floor(rnd() * 19);
      for (let j = 0; j < len; j++) c += rnd() < 0.8 ? String(Math.floor(rnd() * 10)) : alphabet[Math.floor(rnd() * alphabet.length)];
      cells.push(c);
    }
    for (let k = 0; k < 20000; k++) cells.push(((rnd() - 0.5) * 10 ** Math.floor(rnd() * 12 - 3)).toFixed(Math.floor(rnd() * 9)));
    let plain = 0;
    for (const c of cells) {
      expect(Object.is(plainDecimal(c), ref(c)), JSON.stringify(c)).toBe(true);
      if (PLAIN.test(c)) plain++;
    }
    expect(plain).toBeGreaterThan(20000); // the sweep reaches the fast path, not only refusals
  });
});

describe('readPointRow', () => {
  const h = readPointsHeader(['pH', 'E', 'T'], 'log.csv', undefined);
  it('refuses hexadecimal, infinity, thousands separators and blanks (issue 16 item 7: 0x7 was read as pH 7)', () => {
    for (const cell of ['0x7', 'Infinity', '1,000', '', ' ', '7 8', '1e400x']) {
      const r = readPointRow([cell, '0', '25'], 5, h, false);
      expect('field' in r && r.field).toBe('line 5, column 1 (pH)');
    }
  });
  it('reads a decimal comma only when the separator is not a comma', () => {
    expect(readPointRow(['7,5', '0', ''], 2, h, true)).toMatchObject({ pH: 7.5 });
    expect('field' in readPointRow(['7,5', '0', ''], 2, h, false)).toBe(true);
  });
  it('refuses pH outside −2…16, |E| > 5 V and temperatures outside 0…350 °C (issue 16 item 7)', () => {
    expect(readPointRow(['100', '0', ''], 2, h, false)).toMatchObject({ expected: '-2 to 16' });
    expect(readPointRow(['7', '1000', ''], 2, h, false)).toMatchObject({ expected: '|E| ≤ 5 V' });
    expect(readPointRow(['7', '0', '400'], 2, h, false)).toMatchObject({ expected: '0 to 350 °C' });
    expect(readPointRow(['16', '-5', '0'], 2, h, false)).toMatchObject({ pH: 16, potential: -5, temperature: 0 });
  });
  it('a reused row (newPointRow) reads each row as a fresh one does: nothing left over from the row before', () => {
    const hx = readPointsHeader(['label', 'pH', 'potential_mV', 'temperature', 'ionic_strength'], 'log.csv', undefined);
    const rows = [
      ['a', '7.25', '-350', '60', '0.1'],
      ['b', '7,5', '-350,5', '', ''], // no temperature or ionic strength: the file's own, not the row before's
      ['c', '8', '12.5', '', '0.2'],
      ['d', 'x', '0', '25', ''], // refused: the reused row is not handed out
      ['e', '9', '+100', '90', ''],
    ];
    const into = newPointRow();
    for (const [k, cells] of rows.entries()) {
      const fresh = readPointRow(cells, k + 2, hx, true);
      const again = readPointRow(cells, k + 2, hx, true, into);
      expect(again).toEqual(fresh);
      if ('extra' in again) expect(again).toBe(into);
    }
    expect(readPointRow(rows[1], 3, hx, true, into)).toMatchObject({ temperature: undefined, ionicStrength: undefined, given: { pH: undefined, potential: undefined } });
  });
});
