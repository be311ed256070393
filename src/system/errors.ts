/**
 * The one error type for bad user input: names the file, the field (or species) and what is
 * expected. The CLI prints `message` and exits with code 2; nothing is written.
 */
export class InputError extends Error {
  readonly file: string;
  readonly field: string;
  readonly expected: string;

  constructor(file: string, field: string, expected: string, got?: string) {
    const where = field ? `${file}: ${field}` : file;
    super(`${where}: expected ${expected}${got !== undefined ? `, got ${got}` : ''}`);
    this.name = 'InputError';
    this.file = file;
    this.field = field;
    this.expected = expected;
  }
}

/** A short, safe rendering of a user value for an error message. */
export function show(v: unknown): string {
  if (v === null) return 'null';
  if (v === undefined) return 'nothing';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : String(v);
  if (typeof v === 'string') return JSON.stringify(v.length > 60 ? `${v.slice(0, 57)}...` : v);
  if (Array.isArray(v)) return `a list of ${v.length}`;
  if (typeof v === 'object') return 'an object';
  return typeof v;
}
