/**
 * The temperature-model parameter blocks of a species entry: revised-HKF parameters (`hkf`,
 * aqueous species) and a Maier–Kelley heat-capacity polynomial (`cpPolynomial`, other phases).
 * Format only; the thermodynamics is in src/thermo/hkf.ts and src/thermo/cp-poly.ts.
 */

export interface HkfRecord {
  a1: number; a2: number; a3: number; a4: number; c1: number; c2: number; omega: number;
  /** Key of the file's `sources` map. */
  source: string;
  recalled?: boolean;
}

export interface CpPolynomialRecord {
  a: number; b: number; c: number;
  source: string;
  recalled?: boolean;
}

export const HKF_FIELDS = ['a1', 'a2', 'a3', 'a4', 'c1', 'c2', 'omega'] as const;
export const POLY_FIELDS = ['a', 'b', 'c'] as const;

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Checks a parameter block: the numeric fields, a source key of the file's `sources` map and the
 * recalled flag. `fail(field, message)` must throw (field '' for the block itself).
 */
export function checkParameterBlock(
  o: unknown,
  fields: readonly string[],
  sources: Record<string, string>,
  fail: (field: string, msg: string) => never,
): void {
  if (typeof o !== 'object' || o === null || Array.isArray(o)) fail('', `must be an object { ${fields.join(', ')}, source, recalled? }`);
  const b = o as Record<string, unknown>;
  for (const k of Object.keys(b)) if (![...fields, 'source', 'recalled'].includes(k)) fail(k, 'unknown field');
  for (const k of fields) if (!isNum(b[k])) fail(k, 'required, a finite number');
  if (typeof b.source !== 'string' || !Object.prototype.hasOwnProperty.call(sources, b.source)) {
    fail('source', 'required, a key of the file\'s "sources" map');
  }
  if (b.recalled !== undefined && typeof b.recalled !== 'boolean') fail('recalled', 'must be true or false');
}
