/**
 * Figure options: size, fonts, line weights, style and what to show. Lengths are in millimetres
 * (the figure size) or points (fonts, lines); 1 in = 25.4 mm = 72 pt = 96 px (CSS reference pixel).
 */
import { FigureFitError } from '../errors.js';
import { SVG_FONT_FAMILY } from './font-names.js';

export interface FigureOptions {
  /** Figure width and height in mm (the whole figure, caption and legend included). */
  width: number;
  height: number;
  /** Font family list for SVG; PDF and PNG draw with the bundled DejaVu Sans only (fonts.ts). */
  fontFamily: string;
  /** Base font size in pt (tick labels, region labels); other text scales from it. */
  fontSize: number;
  /** Width of the main boundary lines in pt; water lines, families, grid and frame scale from it. */
  lineWidth: number;
  style: 'color' | 'gray' | 'lines';
  show: {
    water: boolean;
    grid: boolean;
    caption: boolean;
    neutral: boolean;
    triplePoints: boolean;
    ligands: boolean;
    legend: boolean;
    title: boolean;
  };
  /** Per-species fill overrides: formula (as in the model) → CSS colour. */
  colors: Record<string, string>;
  title?: string;
  /** Second potential axis on the right: E_ref = E_SHE − offset (V); label e.g. "E / V vs SCE". */
  secondAxis?: { label: string; offset: number };
  /** PNG resolution in dots per inch (default 300): the PNG is width/25.4 × dpi pixels across. */
  dpi?: number;
}

/** Single-column journal figure: 85 mm wide, 8 pt text. */
export const DEFAULT_FIGURE: FigureOptions = {
  width: 85,
  height: 80,
  fontFamily: SVG_FONT_FAMILY,
  fontSize: 8,
  lineWidth: 1,
  style: 'color',
  show: {
    water: true,
    grid: false,
    caption: true,
    neutral: false,
    triplePoints: false,
    ligands: false,
    legend: true,
    title: false,
  },
  colors: {},
};

/** Smallest font size (pt) any text of the figure may have. */
export const MIN_FONT_PT = 6;

export const MM_PER_INCH = 25.4;
export const PT_PER_INCH = 72;
export const PX_PER_INCH = 96;

/** mm → pt (1 pt = 1/72 in). */
export function mmToPt(mm: number): number {
  return (mm * PT_PER_INCH) / MM_PER_INCH;
}

/** pt → mm. */
export function ptToMm(pt: number): number {
  return (pt * MM_PER_INCH) / PT_PER_INCH;
}

/** Width in pixels of a figure `mm` wide at `dpi` dots per inch (rounded to whole pixels). */
export function mmToPx(mm: number, dpi = PX_PER_INCH): number {
  return Math.round((mm * dpi) / MM_PER_INCH);
}

const UNITS: Record<string, number> = {
  mm: 1,
  cm: 10,
  in: MM_PER_INCH,
  pt: MM_PER_INCH / PT_PER_INCH,
  px: MM_PER_INCH / PX_PER_INCH,
};

/**
 * Parses a length to millimetres: "170mm", "17cm", "3.5in", "240pt", "800px" (CSS pixels, 96 px/in)
 * or a plain number (mm). `what` names the option in error messages.
 * Throws Error for anything else, for zero/negative values and for absurd sizes (> 2 m).
 */
export function parseLength(value: string | number, what: string): number {
  let mm: number;
  if (typeof value === 'number') {
    mm = value;
  } else {
    const m = /^\s*([0-9]*\.?[0-9]+(?:[eE][+-]?[0-9]+)?)\s*(mm|cm|in|pt|px)?\s*$/.exec(value);
    if (!m) {
      throw new Error(
        `${what}: cannot read "${value}" as a length; write a number with an optional unit, e.g. "85mm", "17cm", "3.5in", "240pt", "800px" (plain numbers are mm)`,
      );
    }
    mm = Number(m[1]) * UNITS[m[2] ?? 'mm']!;
  }
  if (!Number.isFinite(mm) || mm <= 0) throw new Error(`${what}: length must be positive, got ${String(value)}`);
  if (mm > 2000) throw new Error(`${what}: ${String(value)} is larger than 2 m; give the size in mm, e.g. "170mm"`);
  return mm;
}

/**
 * Merges partial options onto the defaults (nested `show` and `colors` merged key by key).
 * Throws FigureFitError for sizes that cannot make a figure (width < 40 mm, height < 30 mm, font < 6 pt).
 */
export function resolveOptions(partial: Partial<Omit<FigureOptions, 'show'>> & { show?: Partial<FigureOptions['show']> } = {}): FigureOptions {
  const o: FigureOptions = {
    ...DEFAULT_FIGURE,
    ...partial,
    show: { ...DEFAULT_FIGURE.show, ...(partial.show ?? {}) },
    colors: { ...DEFAULT_FIGURE.colors, ...(partial.colors ?? {}) },
  };
  validateOptions(o);
  return o;
}

/**
 * Throws with a clear message when options cannot produce a readable figure: FigureFitError (naming
 * the option: --width, --height, --font-size) for a size that cannot fit, Error for other values.
 */
export function validateOptions(o: FigureOptions): void {
  if (!(o.width >= 40)) throw new FigureFitError('--width', `figure width ${o.width} mm is too small (at least 40 mm)`);
  if (!(o.height >= 30)) throw new FigureFitError('--height', `figure height ${o.height} mm is too small (at least 30 mm)`);
  if (!(o.fontSize >= MIN_FONT_PT)) throw new FigureFitError('--font-size', `font size ${o.fontSize} pt is below the readable minimum of ${MIN_FONT_PT} pt`);
  if (!(o.fontSize <= 24)) throw new FigureFitError('--font-size', `font size ${o.fontSize} pt is too large (at most 24 pt)`);
  if (!(o.lineWidth > 0 && o.lineWidth <= 6)) throw new Error(`line width ${o.lineWidth} pt must be in (0, 6]`);
  if (!['color', 'gray', 'lines'].includes(o.style)) throw new Error(`style "${o.style}" must be color, gray or lines`);
  if (o.secondAxis && !Number.isFinite(o.secondAxis.offset)) throw new Error('second axis offset must be a finite number of volts');
}
