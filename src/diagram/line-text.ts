/**
 * The one plain-text form of a boundary's line equation, from its LineCoefficients (no drawing):
 *   potential line  E = a + b·pH  →  "E = 1.0130 - 0.1775 pH V vs SHE"  (a, |b| to 4 decimals; no
 *                                    pH term when |b| < 5e-9 V per pH unit)
 *   no-electron line  pH = c      →  "pH = 9.300"                        (3 decimals)
 * In another reference scale the intercept becomes a − offset (E_ref = E_SHE − offset, V); pH lines
 * do not change. A value that rounds to zero prints without a sign ("0.0000", never "-0.0000").
 * `minus: '\u2212'` prints the typographic minus sign (HTML read-out) instead of the hyphen-minus
 * (plain-text tables and JSON).
 * Example: intercept 1.013, slope −0.1775, offset 0.241, scale "SCE", minus U+2212 →
 *   "E = 0.7720 − 0.1775 pH V vs SCE".
 */
import type { LineCoefficients } from '../model.js';

export interface LineTextOptions {
  /** Name of the reference scale printed after "V vs" (default "SHE"). */
  scale?: string;
  /** E_SHE − E_ref in V (default 0). */
  offset?: number;
  /** Sign character for negative numbers and a falling slope (default "-"). */
  minus?: '-' | '\u2212';
}

/** `v` to `d` decimals, "-0.00…" printed as "0.00…", with the chosen minus sign. */
function fixed(v: number, d: number, minus: string): string {
  const t = v.toFixed(d);
  const s = /^-0\.0*$/.test(t) ? t.slice(1) : t;
  return minus === '-' ? s : s.replace('-', minus);
}

/** The line equation as plain text (see the module comment for the form and rounding). */
export function lineEquationText(line: LineCoefficients, options: LineTextOptions = {}): string {
  const minus = options.minus ?? '-';
  if (line.kind === 'pH') return `pH = ${fixed(line.value!, 3, minus)}`;
  const a = fixed(line.intercept! - (options.offset ?? 0), 4, minus);
  const s = line.slope ?? 0;
  const scale = options.scale ?? 'SHE';
  if (Math.abs(s) < 5e-9) return `E = ${a} V vs ${scale}`;
  return `E = ${a} ${s < 0 ? minus : '+'} ${fixed(Math.abs(s), 4, minus)} pH V vs ${scale}`;
}
