/**
 * Deterministic JSON text: fixed key order as built, numbers rounded to 12 significant digits so
 * that the same input gives byte-identical output across runs.
 */
export function stableJson(value: unknown): string {
  return `${JSON.stringify(value, (_k, v) => (typeof v === 'number' ? tidy(v) : v), 2)}\n`;
}

export function tidy(v: number): number {
  if (!Number.isFinite(v) || v === 0) return v === 0 ? 0 : v;
  return Number(v.toPrecision(12));
}
