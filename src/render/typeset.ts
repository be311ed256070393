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
 * Runs for a formula in ephmap notation: "Fe+2" → Fe, ²⁺; "Fe3O4" → Fe, ₃, O, ₄; "HFeO2-" → HFeO, ₂, ⁻;
 * "Fe(OH)2+" → Fe(OH), ₂, ⁺; "CuSO4·5H2O" keeps the hydrate coefficient at normal size.
 * A trailing phase tag "(s)", "(aq)" is set at normal size after the formula. Text that is not a
 * valid formula is returned as one plain run.
 */
export function formulaRuns(text: string): TextRun[] {
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

/** Plain text as a single run. */
export function plainRuns(text: string, italic = false): TextRun[] {
  return italic ? [{ text, shift: 'normal', italic }] : [{ text, shift: 'normal' }];
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
    push(runs, text.slice(at, m.index), 'normal');
    for (const r of formulaRuns(m[1]!)) push(runs, r.text, r.shift, r.italic);
    at = m.index + m[0].length;
  }
  push(runs, text.slice(at), 'normal');
  return runs;
}

/** The text of runs joined (for search, titles, tests). */
export function runsText(runs: readonly TextRun[]): string {
  return runs.map((r) => r.text).join('');
}
