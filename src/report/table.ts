/** Aligned plain-text tables for people: left-aligned text, right-aligned numbers. */
export function table(header: string[], rows: string[][], numeric: boolean[] = []): string {
  const w = header.map((h, k) => Math.max(h.length, ...rows.map((r) => (r[k] ?? '').length)));
  const line = (r: string[]) =>
    r
      .map((c, k) => (numeric[k] ? c.padStart(w[k]) : c.padEnd(w[k])))
      .join('  ')
      .trimEnd();
  return [line(header), w.map((n) => '-'.repeat(n)).join('  '), ...rows.map(line)].join('\n');
}
