/**
 * Output rows written straight into bytes (UTF-8), for long streamed outputs (`probe --points`):
 * cells go into one growing buffer instead of strings joined per row and encoded per batch, and
 * numbers are written digit by digit (`num8`, the same text as report/points-csv.ts num8, without
 * building a string). points-csv.ts CellText is the same writer into a string.
 *
 * num8 steps (as points-csv.ts num8; the text of String(Number(v.toPrecision(8)))):
 *  1. v·10^k rounded to an integer n of 8 digits; near a half, and outside 10⁻¹⁵…10²¹, the text
 *     of toPrecision is written instead;
 *  2. the digits of n without trailing zeros, placed by the rules of ECMAScript Number::toString
 *     (plain notation from 10⁻⁶ to 10²¹, else d.ddde±x).
 * Example: 4.6349387 writes the bytes of "4.6349387"; −0.000012345678 of "-0.000012345678".
 *
 * toFixed steps (the text of Number.prototype.toFixed for 0 or 2 digits, ECMAScript §21.1.3.3: n
 * the integer nearest to |v|·10^d, the larger on a tie, a "-" before it for v < 0):
 *  1. |v|·10^d split into its integer part and fraction (exact for 0 digits; for 2 digits a
 *     fraction within 10⁻⁶ of a half, where the product's rounding could decide, and magnitudes
 *     from 2·10⁷ on go through toFixed itself);
 *  2. n rounded up when the fraction is above a half (or, for 0 digits, exactly a half);
 *  3. the digits of n, with the point before the last two for 2 digits.
 * Example: toFixed(−0.3055018, 2) writes "-0.31"; toFixed(249.65151, 0) writes "250".
 */

/** Where the cells of a row go: text (any string), a number rounded to 8 digits, an integer. */
export interface CellWriter {
  text(s: string): void;
  /**
   * Text from a small set that recurs row after row (a formula, a reaction, a phrase): the same
   * as `text`; the byte writer keeps its encoding and copies it (one memory copy instead of a
   * loop over the characters).
   */
  recurring(s: string): void;
  /** Nothing for null or undefined (an empty cell). */
  num8(v: number | null | undefined): void;
  /** A non-negative integer below 2^31 (a line number). */
  int(n: number): void;
  /** The text of v.toFixed(digits), digits 0 or 2. */
  toFixed(v: number, digits: 0 | 2): void;
}

/** Recurring texts whose encodings a writer keeps at most. */
const RECURRING_MAX = 4096;

const POW10 = Array.from({ length: 40 }, (_, k) => Number(`1e${k}`));

/** a·10^k with an exact power of ten (|k| ≤ 22 keeps 10^|k| exact; beyond, one more rounding). */
function scale(a: number, k: number): number {
  return k >= 0 ? a * POW10[k] : a / POW10[-k];
}

/** The reference text of num8 (slow path, and where the fast one does not apply). */
function slowNum8(v: number): string {
  return String(Number(v.toPrecision(8)));
}

/** A growing UTF-8 buffer of rows (see the module comment); `take` hands out what was written. */
export class RowBytes implements CellWriter {
  private buf: Buffer;
  private len = 0;
  private readonly digits = new Uint8Array(12);
  /** Encodings of recurring texts (emptied at RECURRING_MAX entries). */
  private readonly encoded = new Map<string, Uint8Array>();

  constructor(size = 1 << 20) {
    this.buf = Buffer.allocUnsafe(size);
  }

  /** Bytes written so far. */
  get length(): number {
    return this.len;
  }

  /** The bytes written (a view of the buffer: valid until the next write), and starts over. */
  take(): Buffer {
    const out = this.buf.subarray(0, this.len);
    this.len = 0;
    return out;
  }

  private room(n: number): void {
    if (this.len + n <= this.buf.length) return;
    const bigger = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.len + n));
    this.buf.copy(bigger, 0, 0, this.len);
    this.buf = bigger;
  }

  text(s: string): void {
    const n = s.length;
    this.room(3 * n);
    const b = this.buf;
    let p = this.len;
    for (let i = 0; i < n; i++) {
      const c = s.charCodeAt(i);
      if (c >= 0x80) {
        // The rest through the UTF-8 encoder (the first non-ASCII unit starts a character).
        p += b.write(s.slice(i), p, 'utf8');
        break;
      }
      b[p++] = c;
    }
    this.len = p;
  }

  recurring(s: string): void {
    // Short texts are as quick through the loop; longer ones are copied from their encoding.
    if (s.length < 12) return this.text(s);
    let e = this.encoded.get(s);
    if (e === undefined) {
      if (this.encoded.size >= RECURRING_MAX) this.encoded.clear();
      this.encoded.set(s, (e = Buffer.from(s, 'utf8')));
    }
    this.room(e.length);
    this.buf.set(e, this.len);
    this.len += e.length;
  }

  int(n: number): void {
    this.room(12);
    let m = n | 0;
    const d = this.digits;
    let k = 0;
    do {
      d[k++] = 48 + (m % 10);
      m = (m / 10) | 0;
    } while (m > 0);
    const b = this.buf;
    let p = this.len;
    while (k > 0) b[p++] = d[--k];
    this.len = p;
  }

  toFixed(v: number, digits: 0 | 2): void {
    const a = Math.abs(v);
    if (!(a < 2e7)) return this.text(v.toFixed(digits));
    // Step 1.
    const x = digits === 0 ? a : a * 100;
    let n = Math.floor(x);
    const f = x - n;
    if (digits === 2 && Math.abs(f - 0.5) < 1e-6) return this.text(v.toFixed(digits));
    // Step 2.
    if (f > 0.5 || (f === 0.5 && digits === 0)) n++;
    // Step 3.
    if (v < 0) {
      this.room(1);
      this.buf[this.len++] = 45; // -
    }
    if (digits === 0) return this.int(n);
    const whole = Math.floor(n / 100);
    const cents = n - whole * 100;
    this.int(whole);
    this.room(3);
    const b = this.buf;
    b[this.len++] = 46; // .
    b[this.len++] = 48 + Math.floor(cents / 10);
    b[this.len++] = 48 + (cents % 10);
  }

  num8(v: number | null | undefined): void {
    if (v === null || v === undefined) return;
    if (v === 0) return this.text('0');
    const a = Math.abs(v);
    if (!(a >= 1e-15 && a < 1e21)) return this.text(slowNum8(v));
    // Step 1.
    let k = 7 - Math.floor(Math.log10(a));
    let x = scale(a, k);
    if (x >= 1e8) x = scale(a, --k);
    else if (x < 1e7) x = scale(a, ++k);
    if (Math.abs(x - Math.floor(x) - 0.5) < 1e-6) return this.text(slowNum8(v));
    let n = Math.round(x);
    // Step 2: digits (least significant first), trailing zeros dropped; the value is 0.d₁d₂… × 10^p.
    while (n % 10 === 0) (n /= 10), k--;
    let m = n | 0;
    const d = this.digits;
    let nd = 0;
    do {
      d[nd++] = 48 + (m % 10);
      m = (m / 10) | 0;
    } while (m > 0);
    const p = nd - k;
    this.room(32);
    const b = this.buf;
    let w = this.len;
    if (v < 0) b[w++] = 45; // -
    if (p >= nd) {
      // An integer: the digits, then zeros (p ≤ 21 since a < 10²¹).
      for (let i = nd - 1; i >= 0; i--) b[w++] = d[i];
      for (let i = nd; i < p; i++) b[w++] = 48;
    } else if (p > 0) {
      for (let i = nd - 1; i >= nd - p; i--) b[w++] = d[i];
      b[w++] = 46; // .
      for (let i = nd - p - 1; i >= 0; i--) b[w++] = d[i];
    } else if (p > -6) {
      b[w++] = 48;
      b[w++] = 46;
      for (let i = 0; i < -p; i++) b[w++] = 48;
      for (let i = nd - 1; i >= 0; i--) b[w++] = d[i];
    } else {
      // d.ddde-x (p ≤ −6: a small number; large ones are plain up to 10²¹).
      b[w++] = d[nd - 1];
      if (nd > 1) {
        b[w++] = 46;
        for (let i = nd - 2; i >= 0; i--) b[w++] = d[i];
      }
      b[w++] = 101; // e
      b[w++] = 45; // -
      this.len = w;
      return this.int(1 - p);
    }
    this.len = w;
  }
}
