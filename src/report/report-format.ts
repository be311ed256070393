/**
 * Number and text formatting shared by the report writers (Markdown, HTML, PDF). Pure and
 * deterministic: the same number always gives the same text.
 */

/** A number to `sig` significant digits, plain between 1e-3 and 1e4, exponential outside. */
export function fmtNum(v: number, sig = 4): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  return a >= 1e-3 && a < 1e4 ? String(Number(v.toPrecision(sig))) : v.toExponential(sig - 1).replace(/\.?0+e/, 'e');
}

/** An activity or concentration: "1e-6" for exact powers of ten, else three significant digits. */
export function fmtAmount(a: number): string {
  const e = Math.log10(a);
  if (Math.abs(e - Math.round(e)) < 1e-9) return Math.round(e) === 0 ? '1' : `1e${Math.round(e)}`;
  return fmtNum(a, 3);
}

/** A signed value with fixed decimals: "+0.123", "−0.456" (true minus sign). */
export function fmtSigned(v: number, decimals: number): string {
  const s = v.toFixed(decimals);
  if (/^-0\.?0*$/.test(s)) return s.slice(1);
  return v >= 0 ? `+${s}` : `\u2212${s.slice(1)}`;
}

/** Temperature in °C as written: integer degrees without decimals, else one decimal. */
export function fmtCelsius(t: number): string {
  return Number.isInteger(t) ? String(t) : t.toFixed(1);
}

/**
 * Markdown text escape: backslash-escapes the characters Markdown gives meaning to and writes
 * <, > and & as HTML entities, so user text can neither format nor inject markup.
 */
export function mdEsc(s: string): string {
  return s
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/([\\`*_[\]#|~])/g, '\\$1')
    .replace(/\r?\n/g, ' ');
}

/** A Markdown code span for formulas and reactions (backticks cannot occur in validated formulas). */
export function mdCode(s: string): string {
  return `\`${s.replace(/`/g, "'").replace(/\r?\n/g, ' ')}\``;
}

/** A GitHub-flavoured Markdown table; cells must already be escaped. */
export function mdTable(header: string[], rows: string[][]): string {
  const line = (r: string[]) => `| ${r.join(' | ')} |`;
  return [line(header), line(header.map(() => '---')), ...rows.map(line)].join('\n');
}
