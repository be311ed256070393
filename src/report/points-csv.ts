/**
 * Logged operating data for `probe --points`: the header of the input CSV, one input row read into
 * numbers (or a per-row error), and one output row written.
 *
 * Input columns (header names, case-insensitive): `pH`; the potential as `potential` | `E` | `E_V`
 * (V) or `potential_mV` | `E_mV` (mV); optional `temperature` | `T` | `t_C` (°C) and
 * `ionic_strength` (mol/kg). Every other column is carried through to the output unchanged (user
 * text, so neutralised against spreadsheet formulas). A column named twice (two pH columns, or a
 * potential in V and in mV) refuses the file.
 *
 * Numbers: plain decimal or exponent notation; with a `;` or tab separator a decimal comma is read
 * too (`7,25`). Hexadecimal (`0x7`), `Infinity`, thousands separators and blanks are refused for
 * that row. Sane ranges (common practice for aqueous work): pH −2…16, |E| ≤ 5 V, 0…350 °C,
 * ionic strength 0…10 mol/kg (the system file's own bound).
 */
import { InputError } from '../errors.js';
import { csvField } from '../io/csv-records.js';
import { neutraliseCsvCell } from '../io/csv-cell.js';
import { ADVICE_AFTER_SHIFT, ADVICE_HEAD, ADVICE_NONE, type AdviceParts, adviceOfResult, adviceText, type ProbeResult } from '../analysis/probe.js';
import type { RowProbe } from '../analysis/probe-row.js';
import type { CellWriter } from './row-bytes.js';

export type PotentialUnit = 'V' | 'mV';

export interface PointsHeader {
  pH: number;
  potential: number;
  /** Unit of the potential column (from its name, or --unit). */
  unit: PotentialUnit;
  temperature: number;
  ionicStrength: number;
  /** Indexes and names of the carried columns, in input order. */
  extra: { index: number; name: string }[];
  width: number;
}

export interface PointRow {
  line: number;
  pH: number;
  /** Potential as given, V (converted from mV when the column is in mV). */
  potential: number;
  temperature?: number;
  ionicStrength?: number;
  extra: string[];
  /** The pH and potential cells as written, echoed when they are plain decimals (else formatted). */
  given: { pH?: string; potential?: string };
  /** Unit the potential was given in (the output echoes it in that unit). */
  unit: PotentialUnit;
}

const ROLES: Record<string, { role: 'pH' | 'potential' | 'temperature' | 'ionicStrength'; unit?: PotentialUnit }> = {
  ph: { role: 'pH' },
  potential: { role: 'potential' },
  e: { role: 'potential' },
  e_v: { role: 'potential', unit: 'V' },
  'e/v': { role: 'potential', unit: 'V' },
  potential_v: { role: 'potential', unit: 'V' },
  potential_mv: { role: 'potential', unit: 'mV' },
  e_mv: { role: 'potential', unit: 'mV' },
  'e/mv': { role: 'potential', unit: 'mV' },
  temperature: { role: 'temperature' },
  t: { role: 'temperature' },
  t_c: { role: 'temperature' },
  temperature_c: { role: 'temperature' },
  ionic_strength: { role: 'ionicStrength' },
};

/**
 * The header row: which column holds what. `unit` (from --unit) applies to a potential column
 * whose name carries no unit; a name with a unit that contradicts it is refused.
 */
export function readPointsHeader(fields: string[], file: string, unit: PotentialUnit | undefined): PointsHeader {
  const at: Record<string, number> = { pH: -1, potential: -1, temperature: -1, ionicStrength: -1 };
  let named: PotentialUnit | undefined;
  const extra: { index: number; name: string }[] = [];
  fields.forEach((raw, k) => {
    const name = raw.trim();
    const r = Object.hasOwn(ROLES, name.toLowerCase()) ? ROLES[name.toLowerCase()] : undefined;
    if (!r) {
      extra.push({ index: k, name });
      return;
    }
    if (at[r.role] >= 0) throw new InputError(file, 'header', `one ${r.role} column`, `two (columns ${at[r.role] + 1} and ${k + 1}: "${fields[at[r.role]].trim()}" and "${name}")`);
    at[r.role] = k;
    if (r.role === 'potential') named = r.unit;
  });
  if (at.pH < 0 || at.potential < 0) throw new InputError(file, 'header', 'columns named pH and potential (or potential_mV), optionally temperature and ionic_strength', fields.join(','));
  if (named && unit && named !== unit) throw new InputError(file, 'header', `a potential column in ${unit} (--unit ${unit})`, `"${fields[at.potential].trim()}"`);
  return { pH: at.pH, potential: at.potential, unit: named ?? unit ?? 'V', temperature: at.temperature, ionicStrength: at.ionicStrength, extra, width: fields.length };
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
/** A cell echoed as written: a plain decimal without spaces, exponent or sign other than minus. */

/**
 * A plain decimal cell (/^-?\d{1,9}(?:\.\d{1,8})?$/: an optional "-", 1–9 digits, optionally "." and 1–8 digits) as
 * Number(cell) reads it, or NaN for any other text — without the regular expression:
 *  1. the digits gathered into an integer m (exact: at most 15 digits, below 2^53) and the count
 *     k of digits after the point;
 *  2. m / 10^k, one correctly rounded division of two exact numbers, which is the double nearest
 *     the decimal, as Number() gives (the fast path of W. D. Clinger, "How to read floating point
 *     numbers accurately", PLDI 1990); 16–17 digits go through Number() itself.
 * Example: "-0.4015" → −0.4015; "7." → NaN; "1e3" → NaN.
 */
export function plainDecimal(cell: string): number {
  const n = cell.length;
  let i = cell.charCodeAt(0) === 45 ? 1 : 0;
  const neg = i === 1;
  // Step 1.
  let m = 0;
  const intStart = i;
  for (; i < n; i++) {
    const c = cell.charCodeAt(i);
    if (c < 48 || c > 57) break;
    m = m * 10 + (c - 48);
  }
  const intDigits = i - intStart;
  if (intDigits < 1 || intDigits > 9) return NaN;
  let k = 0;
  if (i < n) {
    if (cell.charCodeAt(i) !== 46) return NaN;
    for (i++; i < n; i++) {
      const c = cell.charCodeAt(i);
      if (c < 48 || c > 57) return NaN;
      m = m * 10 + (c - 48);
      k++;
    }
    if (k < 1 || k > 8) return NaN;
  }
  // Step 2.
  if (intDigits + k > 15) return Number(cell);
  const v = k === 0 ? m : m / POW10[k];
  return neg ? -v : v;
}

/** Why a row was refused: where (line, column), what was expected, what was found. */
export interface RowError {
  field: string;
  expected: string;
  got?: string;
}

/** The message for a refused row, as InputError words it. */
export function rowErrorText(e: RowError): string {
  return `${e.field}: expected ${e.expected}${e.got !== undefined ? `, got ${e.got}` : ''}`;
}

/** A number cell, or what was wrong with it. */
function readNumber(cell: string | undefined, decimalComma: boolean): number | { expected: string; got: string } {
  if (cell === undefined) return { expected: 'a number', got: 'nothing (the row is short)' };
  const plain = plainDecimal(cell);
  if (!Number.isNaN(plain)) return plain;
  let s = cell.trim();
  if (s === '') return { expected: 'a number', got: 'a blank cell' };
  if (decimalComma && /^[^,]*,[^,]*$/.test(s) && !s.includes('.')) s = s.replace(',', '.');
  if (!NUMBER.test(s)) return { expected: 'a decimal number', got: JSON.stringify(cell.length > 40 ? `${cell.slice(0, 40)}…` : cell) };
  return Number(s);
}

export const LIMITS = { pH: [-2, 16], E: 5, temperature: [0, 350], ionicStrength: [0, 10] } as const;

/**
 * One data row: its numbers, or what was wrong naming the line and column. `decimalComma` reads
 * `7,25` as 7.25 (separator `;` or tab). `into` (newPointRow) is filled instead of a new row.
 */
export function readPointRow(fields: string[], line: number, h: PointsHeader, decimalComma: boolean, into?: PointRow): PointRow | RowError {
  // The pH and potential cells: a plain decimal (the common case) is read and echoed without more tests.
  const pHCell = fields[h.pH];
  const pHv = pHCell === undefined ? NaN : plainDecimal(pHCell);
  const pHPlain = pHv === pHv;
  const pH = pHPlain ? pHv : cellNumber(fields, h.pH, 'pH', line, decimalComma);
  if (typeof pH !== 'number') return pH;
  if (pH < LIMITS.pH[0] || pH > LIMITS.pH[1]) return outOfRange(h.pH, 'pH', pH, LIMITS.pH, '', line);
  const pName = h.unit === 'mV' ? 'potential, mV' : 'potential, V';
  const pCell = fields[h.potential];
  const pv = pCell === undefined ? NaN : plainDecimal(pCell);
  const pPlain = pv === pv;
  const p = pPlain ? pv : cellNumber(fields, h.potential, pName, line, decimalComma);
  if (typeof p !== 'number') return p;
  const E = h.unit === 'mV' ? p / 1000 : p;
  if (Math.abs(E) > LIMITS.E) return { field: cellPlace(line, h.potential, pName), expected: `|E| ≤ ${LIMITS.E} V`, got: `${p} ${h.unit}` };
  // Optional cells first, so that a refused one leaves `into` as it was.
  let T: number | undefined;
  if (h.temperature >= 0 && (fields[h.temperature] ?? '').trim() !== '') {
    const v = cellNumber(fields, h.temperature, 'temperature', line, decimalComma);
    if (typeof v !== 'number') return v;
    if (v < LIMITS.temperature[0] || v > LIMITS.temperature[1]) return outOfRange(h.temperature, 'temperature', v, LIMITS.temperature, ' °C', line);
    T = v;
  }
  let I: number | undefined;
  if (h.ionicStrength >= 0 && (fields[h.ionicStrength] ?? '').trim() !== '') {
    const v = cellNumber(fields, h.ionicStrength, 'ionic_strength', line, decimalComma);
    if (typeof v !== 'number') return v;
    if (v < LIMITS.ionicStrength[0] || v > LIMITS.ionicStrength[1]) return outOfRange(h.ionicStrength, 'ionic_strength', v, LIMITS.ionicStrength, ' mol/kg', line);
    I = v;
  }
  const row = into ?? newPointRow(h.unit);
  row.line = line;
  row.pH = pH;
  row.potential = E;
  row.temperature = T;
  row.ionicStrength = I;
  if (h.extra.length === 0) row.extra = NO_EXTRA;
  else {
    // A reused row keeps its own array of carried cells (never the shared empty one).
    const extra = into !== undefined && row.extra !== NO_EXTRA ? row.extra : [];
    if (extra.length !== h.extra.length) extra.length = h.extra.length;
    for (let j = 0; j < h.extra.length; j++) extra[j] = fields[h.extra[j].index] ?? '';
    row.extra = extra;
  }
  row.given.pH = pHPlain ? pHCell : undefined;
  row.given.potential = pPlain ? pCell : undefined;
  row.unit = h.unit;
  return row;
}

/**
 * A row record to be filled by readPointRow again and again (a long series reads every row into
 * the same one: nothing allocated per row beyond its cells). Read it before the next row.
 */
export function newPointRow(unit: PotentialUnit = 'V'): PointRow {
  return { line: 0, pH: 0, potential: 0, temperature: undefined, ionicStrength: undefined, extra: NO_EXTRA, given: { pH: undefined, potential: undefined }, unit };
}

/** The carried cells of a row without carried columns (shared, never modified). */
const NO_EXTRA: string[] = [];

/** Where a cell is, for a RowError: "line 7, column 2 (pH)". */
function cellPlace(line: number, k: number, what: string): string {
  return `line ${line}, column ${k + 1} (${what})`;
}

/** Cell k as a number (readNumber), or the RowError naming it. */
function cellNumber(fields: string[], k: number, what: string, line: number, decimalComma: boolean): number | RowError {
  const v = readNumber(fields[k], decimalComma);
  return typeof v === 'number' ? v : { field: cellPlace(line, k, what), ...v };
}

/** The RowError of a value outside [lo, hi]. */
function outOfRange(k: number, what: string, v: number, [lo, hi]: readonly [number, number], unit: string, line: number): RowError {
  return { field: cellPlace(line, k, what), expected: `${lo} to ${hi}${unit}`, got: String(v) };
}

const HEAD = ['line', 'pH', 'potential', 'scale', 'E_SHE_V', 'temperature_C', 'predominant', 'verdict', 'runner_up', 'margin_kJ_per_mol', 'distance_mV', 'distance_pH', 'nearest_boundary', 'advice', 'warnings', 'error'];

/** The output header: the carried columns first (renamed `in_NAME` if they clash), then ours. */
export function pointsOutputHeader(h: PointsHeader, sep: string): string {
  const names = h.extra.map((x) => (HEAD.includes(x.name) || x.name === 'potential_mV' ? `in_${x.name}` : x.name));
  const ours = h.unit === 'mV' ? HEAD.map((n) => (n === 'potential' ? 'potential_mV' : n)) : HEAD;
  return [...names.map((n) => csvField(neutraliseCsvCell(n), sep)), ...ours].join(sep) + '\n';
}

/**
 * A number as written: rounded to 8 significant digits, then its shortest form — the same text as
 * String(Number(v.toPrecision(8))), built without the general double-to-text conversion:
 *  1. v·10^k is rounded to an integer n of 8 digits (10^k exact, so the product is off by at most
 *     one rounding, ~10⁻⁸ of a unit); a product within 10⁻⁶ of a half, where that could decide,
 *     and values outside 10⁻¹⁵…10²¹ go through toPrecision instead;
 *  2. the digits of n without trailing zeros, placed by the rules of ECMAScript Number::toString
 *     (plain notation from 10⁻⁶ to 10²¹, else d.ddde±x). No other decimal of at most 8 digits
 *     rounds to the same double, so this is the shortest form that round-trips.
 */
export function num8(v: number | null | undefined): string {
  if (v === null || v === undefined) return '';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (!(a >= 1e-15 && a < 1e21)) return String(Number(v.toPrecision(8)));
  // Step 1.
  let k = 7 - Math.floor(Math.log10(a));
  let x = scale(a, k);
  if (x >= 1e8) x = scale(a, --k);
  else if (x < 1e7) x = scale(a, ++k);
  if (Math.abs(x - Math.floor(x) - 0.5) < 1e-6) return String(Number(v.toPrecision(8)));
  let n = Math.round(x);
  // Step 2: digits, trailing zeros dropped; the value is 0.d₁d₂… × 10^p.
  while (n % 10 === 0) (n /= 10), k--;
  const d = String(n);
  const p = d.length - k;
  const sign = v < 0 ? '-' : '';
  if (p >= d.length && p <= 21) return sign + d + '0'.repeat(p - d.length);
  if (p > 0 && p <= 21) return `${sign}${d.slice(0, p)}.${d.slice(p)}`;
  if (p > -6 && p <= 0) return `${sign}0.${'0'.repeat(-p)}${d}`;
  const e = p - 1;
  return `${sign}${d[0]}${d.length > 1 ? `.${d.slice(1)}` : ''}e${e >= 0 ? '+' : '-'}${Math.abs(e)}`;
}

const POW10 = Array.from({ length: 40 }, (_, k) => Number(`1e${k}`));

/** a·10^k with an exact power of ten (|k| ≤ 22 keeps 10^|k| exact; beyond, one more rounding). */
function scale(a: number, k: number): number {
  return k >= 0 ? a * POW10[k] : a / POW10[-k];
}

/** User text (carried cells, messages that echo cells): neutralised, then quoted as needed. */
function text(s: string, sep: string): string {
  // An unsigned plain decimal (a time stamp, a count) needs neither: digits and a point only.
  if (s.charCodeAt(0) !== 45 && !Number.isNaN(plainDecimal(s))) return s;
  return csvField(neutraliseCsvCell(s), sep);
}

let lastCelsius = NaN;
let lastCelsiusSep = '';
let lastCelsiusText = '';
/** Temperature cells met before (with the separator after them), emptied at 4096. */
const celsiusTexts = new Map<number, string>();
/** The temperature cell and the separator after it: one value for long runs of rows, so its text is kept. */
function celsiusText(T: number, sep: string): string {
  if (T !== lastCelsius || sep !== lastCelsiusSep) {
    if (sep !== lastCelsiusSep) celsiusTexts.clear();
    lastCelsius = T;
    lastCelsiusSep = sep;
    let t = celsiusTexts.get(T);
    if (t === undefined) {
      if (celsiusTexts.size >= 4096) celsiusTexts.clear();
      celsiusTexts.set(T, (t = num8(T) + sep));
    }
    lastCelsiusText = t;
  }
  return lastCelsiusText;
}

/** One answered row. `warnings` are joined with " | ". */
export function pointsOutputRow(row: PointRow, scale: string, r: ProbeResult, warnings: readonly string[], sep: string): string {
  const f: RowProbe = {
    predominant: r.predominant,
    verdict: r.verdict,
    runnerUp: r.runnerUp,
    marginKJ: r.margin.kJPerMol,
    distanceMV: r.distance.mV,
    distancePH: r.distance.pH,
    nearestReaction: r.nearestBoundary?.reaction ?? null,
    advice: adviceOfResult(r),
    warnings,
    celsius: r.temperature.celsius,
  };
  return pointsRowLine(row, scale, r.E, f, NONE, sep);
}

const NONE: readonly string[] = [];

/**
 * One answered row from the printed fields of its probe (analysis/probe-row.ts): `E` on the SHE
 * scale; `f.warnings` then `more` joined with " | ".
 */
export function pointsRowLine(row: PointRow, scale: string, E: number, f: RowProbe, more: readonly string[], sep: string): string {
  const w = new CellText();
  writePointsRow(w, row, scale, E, f, more, sep);
  return w.s;
}

/** The cells of a row as text (num8 above), for pointsRowLine. */
export class CellText implements CellWriter {
  s = '';
  text(s: string): void {
    this.s += s;
  }
  recurring(s: string): void {
    this.s += s;
  }
  num8(v: number | null | undefined): void {
    this.s += num8(v);
  }
  int(n: number): void {
    this.s += String(n);
  }
  toFixed(v: number, digits: 0 | 2): void {
    this.s += v.toFixed(digits);
  }
}

/** The row of pointsRowLine, cell by cell into `w` (text, or bytes: report/row-bytes.ts). */
export function writePointsRow(w: CellWriter, row: PointRow, scale: string, E: number, f: RowProbe, more: readonly string[], sep: string): void {
  for (const c of row.extra) {
    w.text(text(c, sep));
    w.text(sep);
  }
  w.int(row.line);
  w.text(sep);
  if (row.given.pH !== undefined) w.text(row.given.pH);
  else w.num8(row.pH);
  w.text(sep);
  if (row.given.potential !== undefined) w.text(row.given.potential);
  else w.num8(row.unit === 'mV' ? row.potential * 1000 : row.potential);
  w.text(sep);
  w.recurring(fixedSep(scale, sep));
  w.num8(E);
  w.text(sep);
  w.recurring(celsiusText(f.celsius, sep));
  w.recurring(fixedSep(f.predominant, sep));
  w.recurring(fixedSep(f.verdict, sep));
  w.recurring(fixedSep(f.runnerUp ?? '', sep));
  w.num8(f.marginKJ);
  w.text(sep);
  w.num8(f.distanceMV);
  w.text(sep);
  w.num8(f.distancePH);
  w.text(sep);
  w.recurring(fixedSep(f.nearestReaction ?? '', sep));
  writeAdvice(w, f.advice, sep);
  w.text(sep);
  w.recurring(warningsText(f.warnings, more, sep));
  w.text(sep);
  w.text('\n');
}

/**
 * The advice cell part by part (probe.ts ADVICE_HEAD, shift, ADVICE_AFTER_SHIFT, species, verdict:
 * the text of adviceText without building it). Only the species could need quoting (the other
 * parts hold no separator, quote or line end): then the whole sentence is quoted as csvField does.
 */
export function writeAdvice(w: CellWriter, a: AdviceParts, sep: string): void {
  if (a.k < 0) return w.recurring(fixed(ADVICE_NONE, sep));
  const tail = adviceTail(a.k, a.to, a.verdict, sep);
  if (tail === undefined) return w.text(csvField(adviceText(a.k, a.shift, a.to, a.verdict), sep));
  w.recurring(ADVICE_HEAD[a.k]);
  // adviceShiftText, written without the string: mV to 0 digits for E, pH to 2.
  if (a.k < 2) w.toFixed(a.k === 0 ? a.shift * 1000 : -a.shift * 1000, 0);
  else w.toFixed(a.k === 2 ? -a.shift : a.shift, 2);
  w.recurring(tail);
}

/**
 * The advice's words after the shift — ADVICE_AFTER_SHIFT, the species, its verdict — kept per
 * species and verdict (a few dozen per run), or undefined when the species would need quoting.
 */
let tailSep = '';
let tails = new Map<string, Map<string, string[] | undefined>>();
function adviceTail(k: number, to: string, verdict: string, sep: string): string | undefined {
  if (sep !== tailSep) (tailSep = sep), (tails = new Map());
  let byVerdict = tails.get(to);
  if (byVerdict === undefined) tails.set(to, (byVerdict = new Map()));
  let pair = byVerdict.get(verdict);
  if (pair === undefined && !byVerdict.has(verdict)) {
    pair = fixed(to, sep) === to ? ADVICE_AFTER_SHIFT.map((after) => `${after}${to} (${verdict}).`) : undefined;
    if (tails.size < 10_000) byVerdict.set(verdict, pair);
  }
  return pair === undefined ? undefined : pair[k];
}

let lastWarnings: readonly string[] | undefined;
let lastWarningsSep = '';
let lastWarningsText = '';
/** Texts of warning arrays met before (per separator; an array is one system's, kept while it is). */
let warningTexts = new WeakMap<readonly string[], string>();
/**
 * The warnings cell: the probe's (one array per system and species, so its text is kept — for the
 * last array at hand, and for any met before) and `more`, each once.
 */
function warningsText(w: readonly string[], more: readonly string[], sep: string): string {
  if (more.length) return text([...w, ...more.filter((m) => !w.includes(m))].join(' | '), sep);
  if (w !== lastWarnings || sep !== lastWarningsSep) {
    if (sep !== lastWarningsSep) warningTexts = new WeakMap();
    lastWarnings = w;
    lastWarningsSep = sep;
    let t = warningTexts.get(w);
    if (t === undefined) warningTexts.set(w, (t = w.length ? text(w.join(' | '), sep) : ''));
    lastWarningsText = t;
  }
  return lastWarningsText;
}

/**
 * Cells from a small set (formulas, reactions, scales): quoted once each, then looked up — one map
 * per separator, keyed by the cell itself (no key string built per row). `fixedSep` is the same
 * cell followed by the separator (one write instead of two).
 */
const FIXED = new Map<string, { cell: Map<string, string>; withSep: Map<string, string> }>();
let fixedFor = '';
let fixedMaps = { cell: new Map<string, string>(), withSep: new Map<string, string>() };
function mapsFor(sep: string): { cell: Map<string, string>; withSep: Map<string, string> } {
  if (sep !== fixedFor) {
    let m = FIXED.get(sep);
    if (m === undefined) FIXED.set(sep, (m = { cell: new Map(), withSep: new Map() }));
    fixedFor = sep;
    fixedMaps = m;
  }
  return fixedMaps;
}
function fixed(s: string, sep: string): string {
  return kept(mapsFor(sep).cell, s, sep, '');
}
function fixedSep(s: string, sep: string): string {
  return kept(mapsFor(sep).withSep, s, sep, sep);
}
/** csvField(s, sep) + after, from `bySep` or worked out and kept there (up to 10,000 cells). */
function kept(bySep: Map<string, string>, s: string, sep: string, after: string): string {
  let v = bySep.get(s);
  if (v === undefined) {
    v = csvField(s, sep) + after;
    if (bySep.size < 10_000) bySep.set(s, v);
  }
  return v;
}

/** A row that could not be answered: carried columns, the line, and the error column. */
export function pointsErrorRow(extra: readonly string[], line: number, message: string, sep: string): string {
  const cells = extra.map((c) => text(c, sep));
  cells.push(String(line), ...Array<string>(HEAD.length - 2).fill(''), text(message, sep));
  return cells.join(sep) + '\n';
}
