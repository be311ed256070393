/**
 * Cutting CSV text at record boundaries (io/csv-cut.ts) by the reading rules of RFC 4180 (IETF,
 * 2005: quoted fields may hold separators, quotes as `""`, CR and LF): each piece read on its own
 * from its first line gives exactly the records — fields, errors and line numbers — of reading the
 * whole text at once.
 */
import { describe, expect, it } from 'vitest';
import { CsvCutter, type CsvPiece } from '../../src/io/csv-cut.js';
import { type CsvRecord, CsvRecordReader, MAX_RECORD } from '../../src/io/csv-records.js';
import { InputError } from '../../src/errors.js';

function readWhole(text: string, sep: string): CsvRecord[] {
  const r = new CsvRecordReader(sep, 't.csv');
  return r.end(r.push(text));
}

function cut(text: string, sep: string, target: number, chunk: number): CsvPiece[] {
  const c = new CsvCutter(sep, 't.csv', target);
  const out: CsvPiece[] = [];
  for (let i = 0; i < text.length; i += chunk) c.push(text.slice(i, i + chunk), out);
  const rest = c.end();
  if (rest) out.push(rest);
  return out;
}

/** Each piece read by its own reader (the first as the start of the input). */
function readPieces(pieces: CsvPiece[], sep: string): CsvRecord[] {
  const all: CsvRecord[] = [];
  pieces.forEach((p, k) => {
    const r = k === 0 ? new CsvRecordReader(sep, 't.csv') : new CsvRecordReader(sep, 't.csv', p.line);
    r.push(p.text, all);
    r.end(all);
  });
  return all;
}

// Quoted LF, CRLF and lone CR inside and between records, doubled quotes, a quote inside an
// unquoted field (malformed: an error record, no quoted mode), text after a closing quote, a
// separator inside quotes, a blank line, and a last line without a line end.
const TRICKY = '\ufeffpH,E,note\n7,0.1,"a\nb"\r\n8,-0.2,"q""x\r\ny"\rx"y,1,2\n9,"0",after"q"z\n\n10,"a,b","multi\n\nline"\r\n11,0,"""x"""\n12,0,last';

describe('CsvCutter', () => {
  it('cuts after each record with target 1, as in the module example', () => {
    const pieces = cut('a,"x\ny"\nb\n', ',', 1, 100);
    expect(pieces).toEqual([
      { text: 'a,"x\ny"\n', line: 1 },
      { text: 'b\n', line: 3 },
    ]);
  });

  it('gives the whole-text records for any target and chunk size (quoted newlines, CR, CRLF, malformed quotes)', () => {
    const whole = readWhole(TRICKY, ',');
    expect(whole.length).toBe(9);
    expect(whole.some((r) => r.error)).toBe(true);
    for (const target of [1, 2, 7, 20, 1000]) {
      for (const chunk of [1, 2, 3, 5, 11, TRICKY.length]) {
        const pieces = cut(TRICKY, ',', target, chunk);
        expect(pieces.map((p) => p.text).join('')).toBe(TRICKY);
        expect(readPieces(pieces, ',')).toEqual(whole);
      }
    }
  });

  it('gives the whole-text records on long random mixes of plain and tricky records (the jump to the next LF and the step by step scan in turn)', () => {
    let seed = 31;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const parts = ['7,0.1', '8,-0.2,x', '"q""x"', '"a\nb"', 'x"y', '"a,b"', '', '9,0'];
    const ends = ['\n', '\n', '\n', '\r\n', '\r'];
    for (let trial = 0; trial < 5; trial++) {
      let text = 'pH,E,note\n';
      for (let k = 0; k < 400; k++) {
        const n = 1 + Math.floor(rnd() * 3);
        const cells: string[] = [];
        for (let j = 0; j < n; j++) cells.push(parts[Math.floor(rnd() * parts.length)]);
        // A lone CR before an empty record would read as CRLF: keep records non-empty.
        text += (cells.join(',') || '0') + ends[Math.floor(rnd() * ends.length)];
      }
      const whole = readWhole(text, ',');
      for (const target of [1, 50, 700]) {
        for (const chunk of [3, 64, 1000, text.length]) {
          const pieces = cut(text, ',', target, chunk);
          expect(pieces.map((p) => p.text).join('')).toBe(text);
          expect(readPieces(pieces, ',')).toEqual(whole);
        }
      }
    }
  });

  it('cuts at every record end outside quotes only (never inside a quoted field)', () => {
    const pieces = cut(TRICKY, ',', 1, 4);
    // 9 records, one piece each; the quoted line breaks stay inside their pieces.
    expect(pieces.length).toBe(9);
    expect(pieces[1]).toEqual({ text: '7,0.1,"a\nb"\r\n', line: 2 });
    expect(pieces[6].text).toBe('10,"a,b","multi\n\nline"\r\n');
    // Header 1; `7` on 2 (one quoted LF), `8` on 4 (one quoted LF, ended by the lone CR),
    // `x"y` on 6, `9` on 7, the blank line 8: `10` starts on line 9.
    expect(pieces[6].line).toBe(9);
  });

  it('follows the separator: with ";" a comma is plain text and a ";" inside quotes is not a field end', () => {
    const text = 'pH;E;note\n7,5;0,1;"a;\nb"\n8;"x"";y";z\n';
    const whole = readWhole(text, ';');
    for (const chunk of [1, 3, text.length]) expect(readPieces(cut(text, ';', 1, chunk), ';')).toEqual(whole);
  });

  it('refuses a record longer than the reader allows, naming its line', () => {
    const c = new CsvCutter(',', 'big.csv', 10);
    c.push('a,b\n"open\n');
    let error: unknown;
    try {
      for (let k = 0; k < 20; k++) c.push('x'.repeat(MAX_RECORD / 16));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(InputError);
    expect((error as InputError).field).toBe('line 2');
  });
});
