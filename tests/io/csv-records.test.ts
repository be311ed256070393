/** RFC 4180 reading and writing (IETF RFC 4180, 2005: quoted fields, doubled quotes, CRLF). */
import { describe, expect, it } from 'vitest';
import { type CsvRecord, CsvRecordReader, csvField } from '../../src/io/csv-records.js';

function readAll(text: string, sep = ',', chunk = text.length || 1): CsvRecord[] {
  const r = new CsvRecordReader(sep, 'test.csv');
  const out: CsvRecord[] = [];
  for (let i = 0; i < text.length; i += chunk) r.push(text.slice(i, i + chunk), out);
  return r.end(out);
}

describe('CsvRecordReader', () => {
  it('reads quoted fields holding commas, quotes and line breaks (RFC 4180 §2.5–2.7)', () => {
    const recs = readAll('a,"b,""c""",d\r\n"x\ny",2\n');
    expect(recs.map((r) => r.fields)).toEqual([['a', 'b,"c"', 'd'], ['x\ny', '2']]);
    expect(recs.map((r) => r.line)).toEqual([1, 2]);
  });

  it('gives the same records whatever the chunk size (a record split across chunks)', () => {
    const text = 'pH,E,note\n7,0.1,"a,b"\r\n8,-0.2,"q""x"\n9,0,plain\r\n10,0,last';
    const whole = readAll(text).map((r) => [r.fields, r.line]);
    for (const n of [1, 2, 3, 5, 7]) expect(readAll(text, ',', n).map((r) => [r.fields, r.line])).toEqual(whole);
    expect(whole.length).toBe(5);
  });

  it('reads ; separators and CR-only line ends', () => {
    expect(readAll('pH;E\r7,5;0,1\r8;0\r', ';').map((r) => r.fields)).toEqual([['pH', 'E'], ['7,5', '0,1'], ['8', '0']]);
  });

  it('marks malformed records instead of guessing', () => {
    expect(readAll('a,b"c\n')[0].error).toMatch(/double quote/);
    expect(readAll('"ab"x,1\n')[0].error).toMatch(/after a closing double quote/);
    expect(readAll('1,"open\n2,3\n')[0].error).toMatch(/closing double quote/);
  });

  it('each/endEach hand over the same records, in the same order, as push/end, for any chunking (read as they come)', () => {
    // Quoted separators and line breaks, doubled quotes, CRLF, lone CR, a malformed record, no final line end.
    const text = '\ufeffpH,E,note\n7,0.1,"a,b"\r\n8,-0.2,"q""x"\n9,0,plain\r10,0,"two\nlines"\n1,b"c,2\n11,0,last';
    const whole = readAll(text);
    expect(whole.length).toBe(7);
    for (const n of [1, 2, 3, 5, 7, 11, text.length]) {
      const r = new CsvRecordReader(',', 'test.csv');
      const got: CsvRecord[] = [];
      // A quote-free record comes in one reused object: copied here as `emit` reads it.
      const copy = (x: CsvRecord) => got.push({ ...x, fields: [...x.fields] });
      for (let i = 0; i < text.length; i += n) r.each(text.slice(i, i + n), copy);
      r.endEach(copy);
      expect(got).toEqual(whole);
    }
  });

  it('splits quote-free records as String.prototype.split does (empty fields, trailing separators, CRLF, lone CR)', () => {
    let seed = 77;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    for (const sep of [',', ';', '\t']) {
      const lines: string[] = [];
      for (let k = 0; k < 300; k++) {
        let l = 'x'; // never empty: an empty line after a lone CR would read as CRLF
        const len = Math.floor(rnd() * 12);
        for (let j = 0; j < len; j++) l += rnd() < 0.3 ? sep : 'ab1.-'[Math.floor(rnd() * 5)];
        lines.push(l);
      }
      const ends = ['\n', '\r\n', '\r'];
      const text = lines.map((l, k) => l + ends[k % 3]).join('') + 'last';
      const got = readAll(text, sep, 64);
      expect(got.map((r) => r.fields)).toEqual([...lines, 'last'].map((l) => l.split(sep)));
    }
  });

  it('drops a leading byte-order mark', () => {
    expect(readAll('\ufeffpH,E\n')[0].fields).toEqual(['pH', 'E']);
  });
});

describe('csvField', () => {
  it('quotes only when needed and doubles quotes (RFC 4180 §2.6–2.7)', () => {
    expect(csvField('plain', ',')).toBe('plain');
    expect(csvField('a,b', ',')).toBe('"a,b"');
    expect(csvField('a,b', ';')).toBe('a,b');
    expect(csvField('say "hi"', ',')).toBe('"say ""hi"""');
    expect(csvField('two\nlines', ';')).toBe('"two\nlines"');
  });

  it('round-trips through the reader', () => {
    const cells = ['x', 'a,b', '"q"', 'l1\r\nl2', ''];
    const line = `${cells.map((c) => csvField(c, ',')).join(',')}\n`;
    expect(readAll(line)[0].fields).toEqual(cells);
  });
});
