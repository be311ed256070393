/**
 * The one text mapping for the standard PDF fonts (Helvetica, WinAnsi encoding), used by the
 * figure PDF (render/pdf.ts) and the report PDF (report/report-pdf.ts). Characters outside WinAnsi
 * become close equivalents; only what has none becomes "?". Pure: no I/O.
 */

/** Close equivalents for characters the standard fonts (WinAnsi encoding) cannot show. */
const PDF_SUBSTITUTES: Record<string, string> = {
  '\u2212': '\u2013', // minus → en dash (same width as a digit in Helvetica)
  '\u2010': '-',
  '\u2011': '-',
  '\u2012': '\u2013',
  '\u2009': ' ',
  '\u200a': ' ',
  '\u202f': ' ',
  '\u2002': ' ',
  '\u2003': ' ',
  '\u2032': "'",
  '\u2033': '"',
  '\u2192': '->',
  '\u2190': '<-',
  '\u21cc': '=',
  '\u21c4': '=',
  '\u2248': '~',
  '\u2264': '<=',
  '\u2265': '>=',
  '\u2260': '!=',
  '\u221e': 'inf',
  '\u03bc': '\u00b5', // Greek mu → micro sign
  '\u03b1': 'alpha',
  '\u03b2': 'beta',
  '\u03b3': 'gamma',
  '\u03b4': 'delta',
  '\u03b5': 'epsilon',
  '\u03b8': 'theta',
  '\u03ba': 'kappa',
  '\u03bb': 'lambda',
  '\u03bd': 'nu',
  '\u03c0': 'pi',
  '\u03c1': 'rho',
  '\u03c3': 'sigma',
  '\u03c4': 'tau',
  '\u03c6': 'phi',
  '\u03c8': 'psi',
  '\u03c9': 'omega',
  '\u0394': 'Delta ',
  '\u03a9': 'Ohm',
  '\u2126': 'Ohm',
  '\u207a': '+',
  '\u207b': '-',
  '\u208a': '+',
  '\u208b': '-',
  '\u2070': '0',
  '\u2074': '4',
  '\u2075': '5',
  '\u2076': '6',
  '\u2077': '7',
  '\u2078': '8',
  '\u2079': '9',
};

const WIN_ANSI = /[\u0020-\u007e\u00a0-\u00ff\u2013\u2014\u2018\u2019\u201a\u201c\u201d\u201e\u2026\u2022\u2020\u2021\u2030\u20ac\u0152\u0153\u0160\u0161\u0178\u017d\u017e\u0192\u02c6\u02dc\u2039\u203a\u2122]/;

/**
 * Text for the standard PDF fonts (WinAnsi encoding): characters outside it are mapped to close
 * equivalents (U+2212 minus → en dash, subscript digits → digits, ≤ → "<=", α → "alpha", …), then
 * accented letters to their base letter (NFKD without combining marks); only what is left becomes
 * "?". Super/subscripts of the figure text are already separate runs (typeset.expandScripts).
 */
export function winAnsi(s: string): string {
  let out = '';
  for (const ch of s) {
    if (WIN_ANSI.test(ch)) {
      out += ch;
      continue;
    }
    const sub = PDF_SUBSTITUTES[ch];
    if (sub !== undefined) {
      out += sub;
      continue;
    }
    const c = ch.codePointAt(0)!;
    if (c >= 0x2080 && c <= 0x2089) {
      out += String(c - 0x2080);
      continue;
    }
    const base = ch.normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
    out += base !== '' && [...base].every((b) => WIN_ANSI.test(b)) ? base : '?';
  }
  return out;
}

const SUPERSCRIPT_DIGITS: Record<string, string> = { '\u2070': '0', '\u00b9': '1', '\u00b2': '2', '\u00b3': '3', '\u2074': '4', '\u2075': '5', '\u2076': '6', '\u2077': '7', '\u2078': '8', '\u2079': '9', '\u207b': '-', '\u207a': '+' };

/**
 * Running text (report paragraphs and tables) for the standard PDF fonts: a run of Unicode
 * superscripts that holds at least one character outside Latin-1 (10⁻⁶, not m²) is written "^-6",
 * then the whole string goes through winAnsi. Figure text needs no "^": its scripts are separate,
 * raised runs (typeset.expandScripts), so the figure calls winAnsi directly.
 *   pdfText("H₂O, 10⁻⁶, γ, −") = "H2O, 10^-6, gamma, –"
 */
export function pdfText(s: string): string {
  const marked = s.replace(/[\u2070\u00b9\u00b2\u00b3\u2074-\u207b]*[\u2070\u2074-\u207b][\u2070\u00b9\u00b2\u00b3\u2074-\u207b]*/g, (run) => `^${[...run].map((c) => SUPERSCRIPT_DIGITS[c]).join('')}`);
  return winAnsi(marked);
}
