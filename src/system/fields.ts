/**
 * Small field checkers for system files: each reads one value, checks its type and range, and
 * throws an InputError naming the file and the field path when it is wrong.
 */
import { InputError, show } from './errors.js';

/** C0 controls except tab and newline, DEL, C1 controls, unpaired UTF-16 surrogates, U+FFFE/U+FFFF. */
const BAD_CHAR = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\ufffe\uffff]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/**
 * Invisible characters that can make a label read differently from what it is: bidirectional
 * embeddings, overrides, isolates and marks (U+202A–202E, U+2066–2069, U+200E/200F, U+061C), the
 * zero-width space, word joiner and invisible operators (U+200B, U+2060–2064) and a BOM inside
 * text (U+FEFF). Zero-width joiner and non-joiner (U+200C/200D) stay allowed: scripts and emoji
 * sequences need them.
 */
const HIDDEN_CHAR = /[\u202a-\u202e\u2066-\u2069\u200e\u200f\u061c\u200b\u2060-\u2064\ufeff]/;

/** Keys refused in every user map: they reach an object's prototype machinery. */
export const FORBIDDEN_KEYS: readonly string[] = ['__proto__', 'constructor', 'prototype'];

/** The strict decimal syntax of a number typed as text (no hex, no blanks, no Infinity). */
export const NUMBER_TEXT = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/** The known key nearest to `k` (edit distance ≤ 2, case-insensitive), for "did you mean". */
export function closest(k: string, keys: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestD = 3;
  const a = k.toLowerCase();
  for (const key of keys) {
    const d = editDistance(a, key.toLowerCase(), bestD);
    if (d < bestD) {
      bestD = d;
      best = key;
    }
  }
  return best;
}

/** Levenshtein distance, giving up (returning `cap`) once it must reach `cap`. */
function editDistance(a: string, b: string, cap: number): number {
  if (Math.abs(a.length - b.length) >= cap) return cap;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    let rowMin = i;
    for (let j = 1; j <= b.length; j++) {
      const v = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
      cur.push(v);
      rowMin = Math.min(rowMin, v);
    }
    if (rowMin >= cap) return cap;
    prev = cur;
  }
  return Math.min(prev[b.length]!, cap);
}

export class Fields {
  constructor(
    readonly file: string,
    readonly prefix = '',
  ) {}

  at(field: string): string {
    if (!this.prefix) return field;
    if (!field) return this.prefix;
    return field.startsWith('[') ? `${this.prefix}${field}` : `${this.prefix}.${field}`;
  }

  sub(field: string): Fields {
    return new Fields(this.file, this.at(field));
  }

  fail(field: string, expected: string, got?: unknown): never {
    throw new InputError(this.file, this.at(field), expected, got === undefined ? undefined : show(got));
  }

  object(v: unknown, field: string, keys: readonly string[]): Record<string, unknown> {
    if (!v || typeof v !== 'object' || Array.isArray(v)) this.fail(field, 'an object (key: value pairs)', v);
    const o = v as Record<string, unknown>;
    for (const k of Object.keys(o)) {
      if (!keys.includes(k)) {
        const where = field ? `${field}.${k}` : k;
        const near = closest(k, keys);
        const hint = near ? `; did you mean ${JSON.stringify(near)}?` : '';
        throw new InputError(this.file, this.at(where), `one of the known keys (${keys.join(', ')})${hint}`, `unknown key ${show(k)}`);
      }
    }
    return o;
  }

  number(v: unknown, field: string, opts: { min?: number; max?: number; positive?: boolean; integer?: boolean } = {}): number {
    let what = 'a finite number';
    if (opts.integer) what = 'a whole number';
    if (opts.positive) what += ' greater than 0';
    if (opts.min !== undefined && opts.max !== undefined) what += ` from ${opts.min} to ${opts.max}`;
    else if (opts.min !== undefined) what += ` of at least ${opts.min}`;
    else if (opts.max !== undefined) what += ` of at most ${opts.max}`;
    if (typeof v !== 'number' || !Number.isFinite(v)) this.fail(field, what, v);
    const x = v as number;
    if (opts.integer && !Number.isInteger(x)) this.fail(field, what, x);
    if (opts.positive && !(x > 0)) this.fail(field, what, x);
    if (opts.min !== undefined && x < opts.min) this.fail(field, what, x);
    if (opts.max !== undefined && x > opts.max) this.fail(field, what, x);
    return x;
  }

  optNumber(v: unknown, field: string, def: number, opts: Parameters<Fields['number']>[2] = {}): number {
    return v === undefined ? def : this.number(v, field, opts);
  }

  /**
   * A non-empty string of at most maxLen characters, without control characters (other than tab
   * and newline) or unpaired surrogates: text that later lands in SVG/XML must be representable.
   */
  string(v: unknown, field: string, what = 'a text string', maxLen = 500): string {
    if (typeof v !== 'string' || v.length === 0) this.fail(field, what, v);
    const s = v as string;
    if (s.length > maxLen) throw new InputError(this.file, this.at(field), `${what} of at most ${maxLen} characters`, `${s.length} characters`);
    const bad = BAD_CHAR.exec(s);
    if (bad) {
      const code = bad[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0');
      throw new InputError(this.file, this.at(field), `${what} without control characters`, `U+${code} at character ${bad.index + 1}`);
    }
    const hidden = HIDDEN_CHAR.exec(s);
    if (hidden) {
      const code = hidden[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0');
      throw new InputError(this.file, this.at(field), `${what} without invisible or text-direction characters`, `U+${code} at character ${hidden.index + 1}`);
    }
    return s;
  }

  /**
   * The own entries of a user map (key → value), refusing a non-object and the keys
   * FORBIDDEN_KEYS; `what` describes the map for the message.
   */
  entries(v: unknown, field: string, what: string): [string, unknown][] {
    if (!v || typeof v !== 'object' || Array.isArray(v)) this.fail(field, what, v);
    const list = Object.entries(v as Record<string, unknown>);
    for (const [k] of list) {
      if (FORBIDDEN_KEYS.includes(k)) throw new InputError(this.file, this.at(`${field}.${k}`), `keys other than ${FORBIDDEN_KEYS.join(', ')}`, `the key ${JSON.stringify(k)}`);
    }
    return list;
  }

  /**
   * A number typed as text (a command-line option): strict decimal syntax, so that "" or " "
   * (which Number() reads as 0), "0x7" or "Infinity" are refused, then the checks of number().
   */
  numberText(text: string, field: string, opts: Parameters<Fields['number']>[2] = {}): number {
    if (!NUMBER_TEXT.test(text)) this.fail(field, 'a decimal number such as 25 or 1e-6', text);
    return this.number(Number(text), field, opts);
  }

  boolean(v: unknown, field: string): boolean {
    if (typeof v !== 'boolean') this.fail(field, 'true or false', v);
    return v as boolean;
  }

  oneOf<T extends string>(v: unknown, field: string, options: readonly T[]): T {
    if (typeof v !== 'string' || !options.includes(v as T)) this.fail(field, `one of ${options.join(', ')}`, v);
    return v as T;
  }

  /**
   * A range [min, max] within bounds. min < max, and the range at least `minWidth` wide (default
   * 1e-4 of the bounds' span: 0.002 pH units, 1 mV for ±5 V), so that a nearly empty domain is
   * refused here rather than giving an empty diagram.
   */
  range(v: unknown, field: string, def: [number, number], bounds: { min: number; max: number; unit: string; minWidth?: number }): [number, number] {
    if (v === undefined) return def;
    const minWidth = bounds.minWidth ?? (bounds.max - bounds.min) * 1e-4;
    const what = `[min, max] with min < max, ${bounds.unit} within ${bounds.min} to ${bounds.max}`;
    if (!Array.isArray(v) || v.length !== 2) this.fail(field, what, v);
    const a = v as unknown[];
    const lo = this.number(a[0], `${field}[0]`, { min: bounds.min, max: bounds.max });
    const hi = this.number(a[1], `${field}[1]`, { min: bounds.min, max: bounds.max });
    if (!(lo < hi)) throw new InputError(this.file, this.at(field), what, `[${lo}, ${hi}] (reversed or empty)`);
    if (hi - lo < minWidth) throw new InputError(this.file, this.at(field), `${what}, at least ${minWidth} wide`, `[${lo}, ${hi}]`);
    return [lo, hi];
  }

  list(v: unknown, field: string, maxLen = 10000): unknown[] {
    if (!Array.isArray(v)) this.fail(field, 'a list', v);
    const a = v as unknown[];
    if (a.length > maxLen) this.fail(field, `a list of at most ${maxLen} items`, `${a.length} items`);
    return a;
  }

  stringList(v: unknown, field: string): string[] {
    return this.list(v, field).map((x, k) => this.string(x, `${field}[${k}]`));
  }
}
