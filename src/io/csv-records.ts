/**
 * CSV records read and written by the rules of RFC 4180 (IETF, "Common Format and MIME Type for
 * Comma-Separated Values Files", 2005), with the separator chosen by the caller (`,`, `;` or tab):
 *   - a field may be enclosed in double quotes; inside, the separator, CR and LF are plain text
 *     and a doubled quote `""` stands for one quote;
 *   - records end at LF or CRLF (a lone CR also ends a record);
 *   - a quote inside an unquoted field, or text after a closing quote, is malformed: the record is
 *     returned with `error` set (the caller decides whether that row or the run fails).
 *
 * The reader is incremental (`push` chunks as they arrive, `end` at the end of input) so a file of
 * any length is read in constant memory: at most one partial record is held between chunks.
 * Lines without a quote take a fast path (a plain split). `each`/`endEach` hand each record to a
 * function as soon as it is read instead of collecting the chunk's records: a long run then holds
 * one record at a time, so records die young and the garbage collector's young generation stays
 * small (a chunk's records alive across a collection make it grow: see DEVELOPERS.md).
 *
 * Example: reading `a,"b,""c"""\n` gives one record with fields ["a", 'b,"c"'] on line 1.
 */

import { InputError } from '../errors.js';

/** Longest record held while waiting for its end (characters). */
export const MAX_RECORD = 1 << 20;

export interface CsvRecord {
  fields: string[];
  /** Line number (1-based) where the record starts. */
  line: number;
  /** Set when the record breaks the quoting rules. */
  error?: string;
}

/** Incremental RFC 4180 reader (see the module comment). */
export class CsvRecordReader {
  private rest = '';
  private line = 1;
  private started = false;

  /**
   * `firstLine`: for a piece of a longer input cut at a record boundary (csv-cut.ts), the line
   * its first record starts on; the piece is not the start of the input (no byte-order mark).
   */
  constructor(
    private readonly sep: string,
    private readonly file: string,
    firstLine?: number,
  ) {
    if (firstLine !== undefined) {
      this.line = firstLine;
      this.started = true;
    }
  }

  /** Records completed by this chunk, in order. */
  push(chunk: string, out: CsvRecord[] = []): CsvRecord[] {
    this.each(chunk, (r) => out.push(r === this.plain ? { fields: r.fields.slice(), line: r.line } : r));
    return out;
  }

  /** The last record (input not ending in a newline); an unterminated quote is an error record. */
  end(out: CsvRecord[] = []): CsvRecord[] {
    this.endEach((r) => out.push(r));
    return out;
  }

  /**
   * Each record completed by this chunk to `emit`, in order, as soon as it is read. A record
   * without quotes comes in one record object with one fields array, refilled for the next such
   * record: `emit` reads it and keeps neither (push keeps copies).
   */
  each(chunk: string, emit: (r: CsvRecord) => void): void {
    let text = this.rest + chunk;
    if (!this.started && text.length) {
      this.started = true;
      if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    }
    let pos = 0;
    // Next quote and next CR at or after pos, found once and reused (no rescans per line).
    let q = -2;
    let cr = -2;
    for (;;) {
      const nl = text.indexOf('\n', pos);
      if (q !== -1 && q < pos) q = text.indexOf('"', pos);
      if (cr !== -1 && cr < pos) cr = text.indexOf('\r', pos);
      const brk = cr >= 0 && (nl < 0 || cr < nl - 1) ? cr : nl;
      if (brk < 0) break;
      if (q < 0 || q > brk) {
        // Fast path: a record without quotes, ended by LF, CRLF or a lone CR.
        if (brk === cr && brk !== nl - 1) {
          if (brk + 1 >= text.length) break; // CR at the end of the chunk: maybe CRLF
          const from = pos;
          pos = text.charCodeAt(brk + 1) === 10 ? brk + 2 : brk + 1;
          emit(this.plainRecord(text, from, brk));
        } else {
          const from = pos;
          pos = nl + 1;
          emit(this.plainRecord(text, from, nl > from && text.charCodeAt(nl - 1) === 13 ? nl - 1 : nl));
        }
        continue;
      }
      const r = this.quoted(text, pos, false);
      if (!r) break;
      pos = r.next;
      emit(r.record);
    }
    this.rest = text.slice(pos);
    if (this.rest.length > MAX_RECORD) {
      throw new InputError(this.file, `line ${this.line}`, `a CSV record of at most ${MAX_RECORD} characters (an unclosed double quote?)`);
    }
  }

  /** The one record object of quote-free records (see `each`). */
  private readonly plain: CsvRecord = { fields: [], line: 0 };

  /**
   * The quote-free record text[from, to) in the reused record: its fields are
   * text.slice(from, to).split(sep), cut from `text` directly without the record's own string
   * (about twice as fast), into the same array.
   */
  private plainRecord(text: string, from: number, to: number): CsvRecord {
    const sep = this.sep;
    const r = this.plain;
    const fields = r.fields;
    let n = 0;
    let a = from;
    for (;;) {
      const b = text.indexOf(sep, a);
      if (b < 0 || b >= to) {
        fields[n++] = text.slice(a, to);
        break;
      }
      fields[n++] = text.slice(a, b);
      a = b + 1;
    }
    if (fields.length !== n) fields.length = n;
    r.line = this.line++;
    return r;
  }

  /** The last record to `emit` (see `end`). */
  endEach(emit: (r: CsvRecord) => void): void {
    const text = this.rest;
    this.rest = '';
    if (text === '') return;
    // Whatever is left is at most one record (push consumed every complete one).
    let pos = 0;
    while (pos < text.length) {
      const r = this.quoted(text, pos, true)!;
      pos = r.next;
      emit(r.record);
    }
  }

  /**
   * One record starting at `pos`, parsed character by character. Returns undefined when the record
   * is not complete in `text` (more input needed), unless `final`.
   */
  private quoted(text: string, pos: number, final: boolean): { record: CsvRecord; next: number } | undefined {
    const fields: string[] = [];
    let field = '';
    let error: string | undefined;
    let i = pos;
    let lines = 0;
    const sep = this.sep;
    for (;;) {
      // Start of a field.
      if (text[i] === '"') {
        i++;
        for (;;) {
          if (i >= text.length) {
            if (!final) return undefined;
            error ??= 'a closing double quote (the quoted field runs to the end of the input)';
            fields.push(field);
            return this.done(fields, error, lines, text.length);
          }
          const ch = text[i];
          if (ch === '"') {
            if (text[i + 1] === '"') (field += '"'), (i += 2);
            else if (i + 1 >= text.length && !final) return undefined;
            else {
              i++;
              break;
            }
          } else {
            if (ch === '\n') lines++;
            field += ch;
            i++;
          }
        }
        // After a closing quote: separator, end of record, or (malformed) more text.
        while (i < text.length && text[i] !== sep && text[i] !== '\n' && text[i] !== '\r') {
          error ??= 'a separator or the end of the line after a closing double quote';
          field += text[i++];
        }
      } else {
        while (i < text.length && text[i] !== sep && text[i] !== '\n' && text[i] !== '\r') {
          if (text[i] === '"') error ??= 'no double quote inside an unquoted field (enclose the field in quotes and double the quote)';
          field += text[i++];
        }
      }
      fields.push(field);
      field = '';
      if (i >= text.length) {
        if (!final) return undefined;
        return this.done(fields, error, lines, i);
      }
      if (text[i] === sep) {
        i++;
        continue;
      }
      // End of record: CRLF, LF or a lone CR.
      if (text[i] === '\r' && i + 1 >= text.length && !final) return undefined;
      const next = text[i] === '\r' && text[i + 1] === '\n' ? i + 2 : i + 1;
      return this.done(fields, error, lines, next);
    }
  }

  private done(fields: string[], error: string | undefined, lines: number, next: number): { record: CsvRecord; next: number } {
    const record: CsvRecord = { fields, line: this.line };
    if (error) record.error = error;
    this.line += lines + 1;
    return { record, next };
  }
}

const NEEDS_QUOTES: Record<string, RegExp> = { ',': /[",\n\r]/, ';': /[";\n\r]/, '\t': /["\t\n\r]/ };

/** One field written by RFC 4180: quoted when it holds the separator, a quote, CR or LF. */
export function csvField(s: string, sep: string): string {
  const re = NEEDS_QUOTES[sep] ?? new RegExp(`["\n\r${sep.replace(/[\\\]^-]/g, '\\$&')}]`);
  return re.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
