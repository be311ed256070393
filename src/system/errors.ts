/** Bad user input (file, field, expected): defined with the other typed errors in src/errors.ts. */
export { InputError } from '../errors.js';

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
