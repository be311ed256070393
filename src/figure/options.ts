/**
 * The `figure` section of a system file (and matching CLI options) → FigureOptions for the renderer.
 * Keys: width, height (mm number, or "170mm" / "800px"), font, fontSize (pt), lineWidth (pt),
 * style (color | gray | lines), show { water, grid, caption, neutral, triplePoints, ligands, legend,
 * title }, colors { formula: CSS colour }, title, families (list of activities).
 */
import { DEFAULT_FIGURE, type FigureOptions, parseLength } from '../render/options.js';
import { Fields } from '../system/fields.js';
import type { SystemSpec } from '../system/spec.js';

export const FIGURE_KEYS = ['width', 'height', 'font', 'fontSize', 'lineWidth', 'style', 'show', 'colors', 'title', 'families'] as const;
const SHOW_KEYS = ['water', 'grid', 'caption', 'neutral', 'triplePoints', 'ligands', 'legend', 'title'] as const;

export interface FigureSettings {
  options: FigureOptions;
  /** Extra activities whose boundaries are drawn as thinner family lines. */
  families: number[];
}

/** CLI overrides, already strings/numbers from commander. */
export interface FigureOverrides {
  width?: string;
  height?: string;
  style?: string;
  font?: string;
  fontSize?: string;
  title?: string;
  caption?: boolean;
  grid?: boolean;
  lineWidth?: string;
  /** PNG resolution in dots per inch. */
  dpi?: string;
  /** Comma-separated decorations to switch on / off (water, grid, caption, neutral, triplePoints, ligands, legend, title). */
  show?: string;
  hide?: string;
}

const COLOR_RE = /^(#[0-9a-fA-F]{3}|#[0-9a-fA-F]{6}|[a-zA-Z]{3,20}|rgb\(\s*\d{1,3}\s*,\s*\d{1,3}\s*,\s*\d{1,3}\s*\))$/;

/** Smallest figure the renderer lays out: 40 mm wide, 30 mm high (refused here, naming the key). */
export const MIN_WIDTH_MM = 40;
export const MIN_HEIGHT_MM = 30;

export function figureSettings(spec: SystemSpec, cli: FigureOverrides = {}): FigureSettings {
  const f = new Fields(spec.file, 'figure');
  const o = spec.extra.figure === undefined ? {} : f.object(spec.extra.figure, '', FIGURE_KEYS);
  const opt: FigureOptions = { ...DEFAULT_FIGURE, show: { ...DEFAULT_FIGURE.show, neutral: spec.temperature !== 25 }, colors: {} };
  const length = (v: unknown, field: string, fb: number): number => {
    if (v === undefined) return fb;
    if (typeof v !== 'number' && typeof v !== 'string') f.fail(field, 'a length: mm as a number, or text such as "170mm" or "800px"', v);
    let mm: number;
    try {
      mm = parseLength(v as string | number, field);
    } catch {
      f.fail(field, 'a length: mm as a number, or text such as "170mm" or "800px"', v);
    }
    const min = field === 'width' ? MIN_WIDTH_MM : MIN_HEIGHT_MM;
    if (!(mm! >= min && mm! <= 1000)) f.fail(field, `a length from ${min} mm to 1000 mm`, v);
    return mm!;
  };
  opt.width = length(o.width, 'width', opt.width);
  // Height follows the width unless given: a slightly landscape plot.
  opt.height = length(o.height, 'height', Math.round(opt.width * (DEFAULT_FIGURE.height / DEFAULT_FIGURE.width) * 100) / 100);
  if (o.font !== undefined) opt.fontFamily = f.string(o.font, 'font', 'a font family name', 200).replace(/[<>"&]/g, '');
  opt.fontSize = f.optNumber(o.fontSize, 'fontSize', opt.width >= 150 ? 9 : opt.fontSize, { min: 6, max: 24 });
  opt.lineWidth = f.optNumber(o.lineWidth, 'lineWidth', opt.lineWidth, { min: 0.1, max: 5 });
  if (o.style !== undefined) opt.style = f.oneOf(o.style, 'style', ['color', 'gray', 'lines'] as const);
  if (o.show !== undefined) {
    const s = f.object(o.show, 'show', SHOW_KEYS);
    for (const k of SHOW_KEYS) if (s[k] !== undefined) opt.show[k] = f.boolean(s[k], `show.${k}`);
  }
  if (o.colors !== undefined) {
    if (!o.colors || typeof o.colors !== 'object' || Array.isArray(o.colors)) f.fail('colors', 'a map of formula → colour', o.colors);
    for (const [k, v] of Object.entries(o.colors as Record<string, unknown>)) {
      const c = f.string(v, `colors.${k}`, 'a colour such as "#4477aa" or "steelblue"', 40);
      if (!COLOR_RE.test(c)) f.fail(`colors.${k}`, 'a colour such as "#4477aa", "rgb(68,119,170)" or "steelblue"', c);
      opt.colors[k] = c;
    }
  }
  const title = o.title ?? spec.title;
  if (title !== undefined) {
    opt.title = f.string(title, 'title', 'a title text', 200);
    opt.show.title = true;
  }
  let families: number[] = [];
  const famRaw = o.families ?? spec.extra.families;
  if (famRaw !== undefined) {
    families = f.list(famRaw, 'families', 8).map((v, k) => f.number(v, `families[${k}]`, { positive: true, max: 100 }));
  }
  // Step: command-line overrides.
  const c = new Fields('command line');
  if (cli.dpi !== undefined) opt.dpi = c.number(Number(cli.dpi), '--dpi', { min: 10, max: 2400 });
  if (cli.width !== undefined) opt.width = lengthCli(c, cli.width, '--width');
  pixelWidth(opt, cli.width ?? o.width);
  if (cli.height !== undefined) opt.height = lengthCli(c, cli.height, '--height');
  else if (cli.width !== undefined || (o.height === undefined && cli.dpi !== undefined)) opt.height = Math.round(opt.width * (DEFAULT_FIGURE.height / DEFAULT_FIGURE.width) * 100) / 100;
  if (cli.width !== undefined && o.fontSize === undefined && cli.fontSize === undefined) opt.fontSize = opt.width >= 150 ? 9 : DEFAULT_FIGURE.fontSize;
  if (cli.style !== undefined) opt.style = c.oneOf(cli.style, '--style', ['color', 'gray', 'lines'] as const);
  if (cli.font !== undefined) opt.fontFamily = c.string(cli.font, '--font', 'a font family name', 200).replace(/[<>"&]/g, '');
  if (cli.fontSize !== undefined) opt.fontSize = c.number(Number(cli.fontSize), '--font-size', { min: 6, max: 24 });
  if (cli.title !== undefined) {
    opt.title = c.string(cli.title, '--title', 'a title text', 200);
    opt.show.title = true;
  }
  if (cli.lineWidth !== undefined) opt.lineWidth = c.number(Number(cli.lineWidth), '--line-width', { min: 0.1, max: 5 });
  for (const [flag, list, on] of [['--show', cli.show, true], ['--hide', cli.hide, false]] as const) {
    if (list === undefined) continue;
    for (const item of list.split(',').map((x) => x.trim()).filter(Boolean)) {
      const key = c.oneOf(item, flag, SHOW_KEYS);
      opt.show[key] = on;
    }
  }
  if (cli.caption === false) opt.show.caption = false;
  if (cli.grid === true) opt.show.grid = true;
  return { options: opt, families };
}

/**
 * A width given in pixels ("800px") asks for a PNG that many pixels across: the raster resolution
 * becomes --dpi, or 96 px/in (CSS pixels, as the layout reads px) when none is given, and the figure
 * is laid out px/dpi inches wide. Other units leave the resolution at --dpi or 300.
 */
function pixelWidth(opt: FigureOptions, given: unknown): void {
  const m = typeof given === 'string' ? /^\s*([0-9]*\.?[0-9]+(?:[eE][+-]?[0-9]+)?)\s*px\s*$/.exec(given) : null;
  if (!m) return;
  const dpi = opt.dpi ?? 96;
  opt.dpi = dpi;
  opt.width = Math.round((Number(m[1]) / dpi) * 25.4 * 1e6) / 1e6;
}

function lengthCli(c: Fields, v: string, opt: string): number {
  const t = /^\d+(\.\d+)?$/.test(v) ? Number(v) : v;
  let mm: number;
  try {
    mm = parseLength(t, opt);
  } catch {
    c.fail(opt, 'a length such as 85, "170mm" or "800px"', v);
  }
  const min = opt === '--width' ? MIN_WIDTH_MM : MIN_HEIGHT_MM;
  if (!(mm! >= min && mm! <= 1000)) c.fail(opt, `a length from ${min} mm to 1000 mm`, v);
  return mm!;
}

/**
 * Figure settings where the command sets its own default width (e.g. 160 mm for reports and
 * overlays, which carry longer legends and captions): used unless the system file's figure.width
 * or the --width option gives one.
 */
export function figureSettingsWidth(spec: SystemSpec, cli: FigureOverrides, width: string): FigureSettings {
  const figure = spec.extra.figure;
  const fileWidth = typeof figure === 'object' && figure !== null && (figure as Record<string, unknown>).width !== undefined;
  return figureSettings(spec, cli.width === undefined && !fileWidth ? { ...cli, width } : cli);
}
