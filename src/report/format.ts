/**
 * Number, amount, temperature and source formatting shared by the report writers (Markdown, HTML,
 * PDF), captions and overlay labels: the one place these texts are written. Pure and deterministic:
 * the same number always gives the same text.
 */

import { formulaForPeople } from '../chem/present.js';
import type { DiagramModel, GivenAmount } from '../model.js';

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

const SUP: Record<string, string> = { '-': '\u207b', '0': '\u2070', '1': '\u00b9', '2': '\u00b2', '3': '\u00b3', '4': '\u2074', '5': '\u2075', '6': '\u2076', '7': '\u2077', '8': '\u2078', '9': '\u2079' };

/** 1e-6 → "10⁻⁶"; other values as three significant digits. */
export function powerOfTen(a: number): string {
  const e = Math.log10(a);
  if (Math.abs(e - Math.round(e)) < 1e-9) {
    const k = Math.round(e);
    return k === 0 ? '1' : `10${[...String(k)].map((ch) => SUP[ch]).join('')}`;
  }
  return a.toPrecision(3);
}

/** "Wagman D.D., Evans W.H., … (1982) The NBS tables …" → "Wagman et al. 1982". */
export function shortSource(s: string): string {
  const year = /\((\d{4})\)/.exec(s)?.[1] ?? /\b(19|20)\d{2}\b/.exec(s)?.[0];
  const first = s.split(/[ ,]/)[0];
  if (!first) return s.slice(0, 40);
  const many = (s.match(/,/g) ?? []).length > 2 && /[A-Z]\.,/.test(s);
  return `${first}${many ? ' et al.' : ''}${year ? ` ${year}` : ''}`;
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

/** A number as the file gave it: "10⁻⁶" (ASCII "1e-6") for powers of ten below 0.01, else plain. */
function givenNumber(v: number, ascii: boolean): string {
  const e = Math.log10(v);
  if (Math.abs(e - Math.round(e)) < 1e-9 && Math.round(e) <= -2) return ascii ? fmtAmount(v) : powerOfTen(v);
  return fmtNum(v, 4);
}

/**
 * An amount with its unit, exactly as computed: "activity 10⁻⁶", "1.3 mol/kg",
 * "60 mg/L (0.00169 mol/kg)", "5 mg/L as Fe (…)". `molal` marks the default threshold read as a
 * molality (an ionic strength is given). Without `a` (models from older versions) `fallback` is
 * written as an activity.
 */
export function amountLabel(a: GivenAmount | undefined, fallback: number, opts: { molal?: boolean; ascii?: boolean } = {}): string {
  const ascii = opts.ascii ?? false;
  if (!a) return `${opts.molal ? '' : 'activity '}${givenNumber(fallback, ascii)}${opts.molal ? ' mol/kg' : ''}`;
  if (a.kind === 'activity') return opts.molal && a.isDefault ? `${givenNumber(a.value, ascii)} mol/kg` : `activity ${givenNumber(a.value, ascii)}`;
  if (a.kind === 'molality') return `${givenNumber(a.value, ascii)} mol/kg`;
  return `${massConcentration(a.value)}${a.as ? ` as ${formulaForPeople(a.as)}` : ''}${a.molality !== undefined ? ` (${fmtNum(a.molality, 3)} mol/kg)` : ''}`;
}

/** A mass concentration kept in mg/L, written in g/L from 1000 mg/L: "60 mg/L", "30 g/L" (never "3e+4 mg/L"). */
function massConcentration(mgPerL: number): string {
  return mgPerL >= 1000 ? `${fmtNum(mgPerL / 1000, 4)} g/L` : `${fmtNum(mgPerL, 4)} mg/L`;
}

/** The dissolved-element amount of a model, with its unit. */
export function elementAmountText(m: DiagramModel, ascii = false): string {
  const molal = m.species.some((x) => x.role === 'main' && x.molality !== undefined);
  return amountLabel(m.amounts?.element, m.activity, { molal, ascii });
}

/** Each ligand's total with its unit: ["Cl 60 mg/L (0.00169 mol/kg)", "S activity 10⁻³"]. */
export function ligandAmountTexts(m: DiagramModel, ascii = false): string[] {
  return Object.entries(m.ligands).map(([k, v]) => `${k} ${amountLabel(m.amounts?.ligands[k], v, { ascii })}`);
}
