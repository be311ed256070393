/**
 * Spreadsheet safety for CSV cells that carry user text (labels, names, notes — never numbers):
 * a spreadsheet opening the file runs a cell as a formula when it starts with `=`, `+`, `-` or `@`
 * (also after leading spaces, and in their full-width forms), and tab or carriage return at the
 * start can shift or hide it. Common practice (the spreadsheet-injection guidance of web-security
 * checklists): prefix such a cell with a single quote `'`, which spreadsheets show as text.
 * A plain signed number (`-12.5`, `-12,5`) is left as it is: it is data, and no formula.
 * This helper only neutralises; quoting for the CSV syntax (RFC 4180) is the writer's job.
 *
 * Example: neutraliseCsvCell('=HYPERLINK("x")') === `'=HYPERLINK("x")`; neutraliseCsvCell('Fe+2') === 'Fe+2';
 * neutraliseCsvCell('-12.5') === '-12.5'.
 */
const FORMULA_START = /^[ \u00a0]*[=+\-@\uff1d\uff0b\uff0d\uff20]|^[\t\r]/;

/**
 * A plain signed decimal number (point or comma, optional exponent): a spreadsheet reads it as a
 * number, never as a formula, so a carried column of readings such as `-12.5` or `-12,5` stays
 * numeric. Anything more (`-2+3`, `-1e5+x`, `- 5`) is neutralised.
 */
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?$/;

export function neutraliseCsvCell(text: string): string {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}
