/**
 * Typesetting of chemical formulas and axis labels into text runs: counts as subscripts, charges
 * as superscripts (IUPAC Green Book §2.10: "Fe³⁺", "Fe₃O₄", "HFeO₂⁻"), quantity symbols in italic.
 */
import { chargeLabel, splitPhase, tokenizeFormula } from '../chem/formula.js';
import type { TextRun } from './scene-types.js';

/** Appends text to the last run when it has the same shift/italic, else starts a new run. */
function push(runs: TextRun[], text: string, shift: TextRun['shift'], italic = false): void {
  if (text === '') return;
  const last = runs[runs.length - 1];
  if (last && last.shift === shift && (last.italic ?? false) === italic) last.text += text;
  else runs.push(italic ? { text, shift, italic } : { text, shift });
}

/**
 * Runs for a formula in any accepted notation: "Fe^2+" (or "Fe²⁺", "Fe+2") → Fe, ²⁺; "Fe3O4" → Fe, ₃, O, ₄; "HFeO2^-" → HFeO, ₂, ⁻;
 * "Fe(OH)2+" → Fe(OH), ₂, ⁺; "CuSO4·5H2O" keeps the hydrate coefficient at normal size.
 * A trailing phase tag "(s)", "(aq)" is set at normal size after the formula. Text that is not a
 * valid formula is returned as one plain run.
 */
export function formulaRuns(text: string): TextRun[] {
  // An alloy assemblage ("Fe2O3 + Cr2O3 + Ni+2"; no formula holds " + "): each term typeset.
  if (text.includes(' + ')) return text.split(' + ').flatMap((t, i) => [...(i ? [{ text: ' + ', shift: 'normal' as const }] : []), ...formulaRuns(t)]);
  const { formula, phase } = splitPhase(text);
  let tokens;
  try {
    tokens = tokenizeFormula(formula);
  } catch {
    return [{ text, shift: 'normal' }];
  }
  const runs: TextRun[] = [];
  for (const t of tokens) {
    switch (t.kind) {
      case 'count':
        push(runs, t.text, 'sub');
        break;
      case 'charge':
        push(runs, chargeLabel(t.value ?? 0), 'sup');
        break;
      case 'dot':
        push(runs, '\u00b7', 'normal');
        break;
      default:
        push(runs, t.text, 'normal');
    }
  }
  if (phase) push(runs, `(${phase})`, 'normal');
  return runs;
}

/** Unicode superscript characters → the plain character set as a superscript run (minus as U+2212). */
const SUPERSCRIPTS: Record<string, string> = {
  '\u2070': '0', '\u00b9': '1', '\u00b2': '2', '\u00b3': '3', '\u2074': '4', '\u2075': '5', '\u2076': '6',
  '\u2077': '7', '\u2078': '8', '\u2079': '9', '\u207a': '+', '\u207b': '\u2212', '\u207d': '(', '\u207e': ')',
};
/** Unicode subscript characters → the plain character as a subscript run. */
const SUBSCRIPTS: Record<string, string> = {
  '\u2080': '0', '\u2081': '1', '\u2082': '2', '\u2083': '3', '\u2084': '4', '\u2085': '5', '\u2086': '6',
  '\u2087': '7', '\u2088': '8', '\u2089': '9', '\u208a': '+', '\u208b': '\u2212', '\u208d': '(', '\u208e': ')',
};

/**
 * Splits the Unicode super- and subscript characters of a text (⁰…⁹ ⁺ ⁻ and ₀…₉ ₊ ₋) into
 * sup/sub runs of ordinary characters, so that every backend typesets them the same way — the
 * standard PDF font has no glyphs for most of them: "10⁻⁶" → "10", sup "−6"; "H₂O" → "H", sub "2", "O".
 */
export function scriptRuns(text: string, italic = false): TextRun[] {
  const runs: TextRun[] = [];
  for (const ch of text) {
    const sup = SUPERSCRIPTS[ch];
    const sub = SUBSCRIPTS[ch];
    if (sup !== undefined) push(runs, sup, 'sup', italic);
    else if (sub !== undefined) push(runs, sub, 'sub', italic);
    else push(runs, ch, 'normal', italic);
  }
  return runs;
}

/** Runs with any Unicode super/subscript characters of normal runs split out (see scriptRuns). */
export function expandScripts(runs: readonly TextRun[]): TextRun[] {
  if (!runs.some((r) => r.shift === 'normal' && /[\u00b2\u00b3\u00b9\u2070-\u208e]/.test(r.text))) return [...runs];
  const out: TextRun[] = [];
  for (const r of runs) {
    if (r.shift !== 'normal') push(out, r.text, r.shift, r.italic ?? false);
    else for (const q of scriptRuns(r.text, r.italic ?? false)) push(out, q.text, q.shift, q.italic ?? false);
  }
  return out;
}

/** Plain text as runs: one run, unless it holds Unicode super/subscript characters (see scriptRuns). */
export function plainRuns(text: string, italic = false): TextRun[] {
  if (/[\u00b2\u00b3\u00b9\u2070-\u208e]/.test(text)) return scriptRuns(text, italic);
  return italic ? [{ text, shift: 'normal', italic }] : [{ text, shift: 'normal' }];
}

const TO_SUP: Record<string, string> = {
  '0': '\u2070', '1': '\u00b9', '2': '\u00b2', '3': '\u00b3', '4': '\u2074', '5': '\u2075', '6': '\u2076', '7': '\u2077',
  '8': '\u2078', '9': '\u2079', '+': '\u207a', '-': '\u207b', '\u2212': '\u207b', '(': '\u207d', ')': '\u207e',
};
const TO_SUB: Record<string, string> = {
  '0': '\u2080', '1': '\u2081', '2': '\u2082', '3': '\u2083', '4': '\u2084', '5': '\u2085', '6': '\u2086', '7': '\u2087',
  '8': '\u2088', '9': '\u2089', '+': '\u208a', '-': '\u208b', '\u2212': '\u208b', '(': '\u208d', ')': '\u208e',
};

/**
 * Runs as one line of plain Unicode text, scripts written with the Unicode super/subscript
 * characters where they exist (for HTML read-outs and tooltips): Fe, sup "2+" → "Fe²⁺".
 */
export function runsUnicode(runs: readonly TextRun[]): string {
  let s = '';
  for (const r of runs) {
    if (r.shift === 'normal') s += r.text;
    else {
      const map = r.shift === 'sup' ? TO_SUP : TO_SUB;
      for (const ch of r.text) s += map[ch] ?? ch;
    }
  }
  return s;
}

/** Replaces an ASCII hyphen-minus used as a sign by U+2212 minus. */
export function minus(text: string): string {
  return text.replace(/-/g, '\u2212');
}

/**
 * Power of ten as runs: 1e-2 → "10", "−2"; 1 → "10", "0"; a non-integral exponent keeps one decimal
 * (3.16e-3 → "10^−2.5"). Used for activity labels of line families.
 */
export function powerOfTenRuns(value: number): TextRun[] {
  if (!(value > 0)) return plainRuns(String(value));
  const e = Math.log10(value);
  const rounded = Math.round(e);
  if (Math.abs(e - rounded) < 1e-6) {
    if (rounded === 0) return plainRuns('1'); // "1", not 10⁰
    return [
      { text: '10', shift: 'normal' },
      { text: minus(String(rounded)), shift: 'sup' },
    ];
  }
  return [
    { text: '10', shift: 'normal' },
    { text: minus(e.toFixed(1)), shift: 'sup' },
  ];
}

/**
 * Axis title with the quantity symbol in italic: "E / V vs SHE" → E (italic), " / V vs SHE".
 * Only a leading single-letter symbol followed by a space or "/" is italicised.
 */
export function quantityRuns(label: string): TextRun[] {
  const m = /^([A-Za-z])(\s*\/.*|\s.*)$/.exec(label);
  if (!m) return plainRuns(label);
  return [
    { text: m[1]!, shift: 'normal', italic: true },
    { text: m[2]!, shift: 'normal' },
  ];
}

/**
 * Mixed text with inline formulas in braces: "{O2}/{H2O}" → O₂/H₂O; text outside braces is plain.
 */
export function richRuns(text: string): TextRun[] {
  const runs: TextRun[] = [];
  const re = /\{([^}]*)\}/g;
  let at = 0;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text)) !== null) {
    for (const r of plainRuns(text.slice(at, m.index))) push(runs, r.text, r.shift);
    for (const r of formulaRuns(m[1]!)) push(runs, r.text, r.shift, r.italic);
    at = m.index + m[0].length;
  }
  for (const r of plainRuns(text.slice(at))) push(runs, r.text, r.shift);
  return runs;
}

/** The text of runs joined (for search, titles, tests). */
export function runsText(runs: readonly TextRun[]): string {
  return runs.map((r) => r.text).join('');
}
