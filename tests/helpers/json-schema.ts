/**
 * A small validator for the JSON Schema (draft 2020-12) keywords our schemas use. It refuses any
 * other keyword, so a schema cannot pass silently by using something the validator ignores.
 */
export type Schema = Record<string, unknown>;

const ANNOTATIONS = new Set(['$schema', '$id', 'title', 'description', '$defs', 'examples']);

/** Validates `value` against `s` (draft 2020-12 subset); returns error strings with JSON paths. */
export function validate(value: unknown, s: Schema | boolean, path: string, rootSchema: Schema): string[] {
  if (s === true) return [];
  if (s === false) return [`${path}: not allowed`];
  const errs: string[] = [];
  for (const k of Object.keys(s)) {
    if (
      !ANNOTATIONS.has(k) &&
      !['type', 'required', 'properties', 'additionalProperties', 'propertyNames', 'minProperties', 'items',
        'minItems', 'maxItems', 'enum', 'pattern', 'minLength', '$ref', 'not', 'exclusiveMinimum', 'minimum', 'maximum', 'anyOf'].includes(k)
    ) {
      throw new Error(`validator does not support keyword "${k}" (at ${path})`);
    }
  }
  if (typeof s.$ref === 'string') {
    const m = /^#\/\$defs\/(.+)$/.exec(s.$ref);
    if (!m) throw new Error(`unsupported $ref ${s.$ref}`);
    const target = (rootSchema.$defs as Record<string, Schema>)[m[1]!];
    if (!target) return [`${path}: unresolved $ref ${s.$ref}`];
    errs.push(...validate(value, target, path, rootSchema));
  }
  if (Array.isArray(s.anyOf)) {
    const ok = (s.anyOf as Schema[]).some((alt) => validate(value, alt, path, rootSchema).length === 0);
    if (!ok) errs.push(`${path}: matches none of the allowed forms`);
  }
  if (s.type !== undefined) {
    const t = s.type as string;
    const ok =
      t === 'object' ? typeof value === 'object' && value !== null && !Array.isArray(value)
      : t === 'array' ? Array.isArray(value)
      : t === 'string' ? typeof value === 'string'
      : t === 'number' ? typeof value === 'number' && Number.isFinite(value)
      : t === 'integer' ? Number.isInteger(value)
      : t === 'boolean' ? typeof value === 'boolean'
      : (() => { throw new Error(`unsupported type ${t}`); })();
    if (!ok) return [...errs, `${path}: expected ${t}`];
  }
  if (s.enum !== undefined && !(s.enum as unknown[]).includes(value)) errs.push(`${path}: not one of ${JSON.stringify(s.enum)}`);
  if (typeof value === 'string') {
    if (typeof s.minLength === 'number' && value.length < s.minLength) errs.push(`${path}: shorter than ${s.minLength}`);
    if (typeof s.pattern === 'string' && !new RegExp(s.pattern, 'u').test(value)) errs.push(`${path}: does not match ${s.pattern}`);
  }
  if (typeof value === 'number' && typeof s.exclusiveMinimum === 'number' && !(value > s.exclusiveMinimum)) {
    errs.push(`${path}: must be > ${s.exclusiveMinimum}`);
  }
  if (typeof value === 'number' && typeof s.minimum === 'number' && value < s.minimum) errs.push(`${path}: must be ≥ ${s.minimum}`);
  if (typeof value === 'number' && typeof s.maximum === 'number' && value > s.maximum) errs.push(`${path}: must be ≤ ${s.maximum}`);
  if (s.not !== undefined && validate(value, s.not as Schema, path, rootSchema).length === 0) errs.push(`${path}: matches a forbidden form`);
  if (Array.isArray(value)) {
    if (typeof s.minItems === 'number' && value.length < s.minItems) errs.push(`${path}: fewer than ${s.minItems} items`);
    if (typeof s.maxItems === 'number' && value.length > s.maxItems) errs.push(`${path}: more than ${s.maxItems} items`);
    if (s.items !== undefined) value.forEach((v, i) => errs.push(...validate(v, s.items as Schema, `${path}[${i}]`, rootSchema)));
  }
  if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
    const o = value as Record<string, unknown>;
    const props = (s.properties ?? {}) as Record<string, Schema>;
    for (const r of (s.required ?? []) as string[]) if (!(r in o)) errs.push(`${path}: missing required "${r}"`);
    if (typeof s.minProperties === 'number' && Object.keys(o).length < s.minProperties) errs.push(`${path}: fewer than ${s.minProperties} properties`);
    for (const [k, v] of Object.entries(o)) {
      if (s.propertyNames !== undefined) errs.push(...validate(k, s.propertyNames as Schema, `${path}{${k}}`, rootSchema));
      if (k in props) errs.push(...validate(v, props[k]!, `${path}.${k}`, rootSchema));
      else if (s.additionalProperties !== undefined) errs.push(...validate(v, s.additionalProperties as Schema, `${path}.${k}`, rootSchema));
    }
  }
  return errs;
}

