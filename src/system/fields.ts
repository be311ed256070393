/**
 * Small field checkers for system files: each reads one value, checks its type and range, and
 * throws an InputError naming the file and the field path when it is wrong.
 */
import { InputError, show } from './errors.js';

export class Fields {
  constructor(
    readonly file: string,
    readonly prefix = '',
  ) {}

  at(field: string): string {
    return this.prefix ? `${this.prefix}.${field}` : field;
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
        this.fail(where, `one of the known keys (${keys.join(', ')})`, `unknown key ${JSON.stringify(k)}`);
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

  string(v: unknown, field: string, what = 'a text string', maxLen = 500): string {
    if (typeof v !== 'string' || v.length === 0) this.fail(field, what, v);
    const s = v as string;
    if (s.length > maxLen) this.fail(field, `${what} of at most ${maxLen} characters`, `${s.length} characters`);
    return s;
  }

  boolean(v: unknown, field: string): boolean {
    if (typeof v !== 'boolean') this.fail(field, 'true or false', v);
    return v as boolean;
  }

  oneOf<T extends string>(v: unknown, field: string, options: readonly T[]): T {
    if (typeof v !== 'string' || !options.includes(v as T)) this.fail(field, `one of ${options.join(', ')}`, v);
    return v as T;
  }

  range(v: unknown, field: string, def: [number, number], bounds: { min: number; max: number; unit: string }): [number, number] {
    if (v === undefined) return def;
    const what = `[min, max] with min < max, ${bounds.unit} within ${bounds.min} to ${bounds.max}`;
    if (!Array.isArray(v) || v.length !== 2) this.fail(field, what, v);
    const a = v as unknown[];
    const lo = this.number(a[0], `${field}[0]`, { min: bounds.min, max: bounds.max });
    const hi = this.number(a[1], `${field}[1]`, { min: bounds.min, max: bounds.max });
    if (!(lo < hi)) this.fail(field, what, `[${lo}, ${hi}] (reversed or empty)`);
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
