/**
 * Overlay figures: several diagrams in one frame. Either one system at several temperatures or
 * activities, or several systems (e.g. Fe, Cr and Ni for a stainless steel). The first layer is the
 * base, drawn in full (with its fills when every layer has the same element, as lines only
 * otherwise); the others are drawn as boundaries only, each in its own dash style, with small
 * labels of their fields in the layer's ink, and the legend and caption name every layer by
 * element, temperature and activity. Layers of different elements in the 'color' style also get
 * their own colour-blind-safe line colours (LAYER_INKS).
 */
import { atActivity, captionLines, figureInput } from './compose.js';
import { placeOperatingMarks } from './operating-marks.js';
import { type FigureOverrides, type FigureSettings, figureSettingsWidth } from './options.js';
import { compute, type Computed } from '../pipeline.js';
import { LAYER_INK_NAMES, LAYER_INKS } from '../render/palette.js';
import type { FigureInput } from '../render/scene.js';
import { InputError } from '../system/errors.js';
import { T_RANGE, type SystemSpec } from '../system/spec.js';
import { elementAmountText, fmtCelsius, ligandAmountTexts, shortSource } from '../report/format.js';
import { referenceOffset } from '../thermo/reference.js';

/**
 * Dash styles of the overlay layers, in order (names understood by the renderer's parseDash): the
 * long dash first because it differs most from the water lines' short dash in the 'lines' style.
 */
export const OVERLAY_DASHES = ['longdash', 'dashdot', 'dash', 'dot'] as const;

/** At most the base plus one layer per dash style, so that every layer keeps its own style. */
export const MAX_LAYERS = 1 + OVERLAY_DASHES.length;

/** The plain statement printed whenever layers of different elements share a frame. */
export const SEPARATE_ELEMENTS_NOTE =
  "Each layer is a separate single-element diagram; overlaying them does not describe the alloy's thermodynamics.";

export interface OverlayRequest {
  specs: SystemSpec[];
  temperatures?: number[];
  activities?: number[];
}

/**
 * The layer specs, base first: one spec × every temperature × every activity, or several specs
 * (each with the single temperature/activity when one is given). Every layer is solved on the
 * base's pH and E range so that all lines cover the frame. Throws InputError for fewer than two
 * or more than MAX_LAYERS layers, or several values combined with several files.
 */
export function layerSpecs(req: OverlayRequest): SystemSpec[] {
  const { specs } = req;
  const temps = req.temperatures ?? [];
  const acts = req.activities ?? [];
  temps.forEach((t) => {
    if (!(Number.isFinite(t) && t >= T_RANGE.min && t <= T_RANGE.max)) throw new InputError('command line', '--temperatures', `temperatures from ${T_RANGE.min} to ${T_RANGE.max} °C`, String(t));
  });
  acts.forEach((a) => {
    if (!(Number.isFinite(a) && a > 0 && a <= 100)) throw new InputError('command line', '--activities', 'activities greater than 0 and at most 100', String(a));
  });
  if (specs.length > 1 && (temps.length > 1 || acts.length > 1)) {
    throw new InputError('command line', temps.length > 1 ? '--temperatures' : '--activities', 'one value when several system files are overlaid (several values with one file)');
  }
  const withT = (s: SystemSpec, t: number | undefined): SystemSpec => (t === undefined ? s : { ...s, temperature: t });
  const withA = (s: SystemSpec, a: number | undefined): SystemSpec => (a === undefined ? s : atActivity(s, a));
  const out: SystemSpec[] = [];
  for (const s of specs) {
    for (const t of temps.length ? temps : [undefined]) for (const a of acts.length ? acts : [undefined]) out.push(withA(withT(s, t), a));
  }
  if (out.length < 2) {
    throw new InputError('command line', 'layers', 'at least two layers: several system files, or --temperatures / --activities with two or more values');
  }
  if (out.length > MAX_LAYERS) {
    throw new InputError('command line', 'layers', `at most ${MAX_LAYERS} layers (a base and ${OVERLAY_DASHES.length} dash styles)`, String(out.length));
  }
  const base = out[0];
  return out.map((s, k) => (k === 0 ? s : { ...s, pH: base.pH, E: base.E }));
}

/** Label of a layer: "Fe, 90 °C, a = 10⁻⁶" (ASCII "1e-6" where the output font lacks superscripts). */
export function layerLabel(c: Computed, ascii: boolean): string {
  const m = c.model;
  const el = elementAmountText(m, ascii);
  const a = el.startsWith('activity ') ? `a = ${el.slice('activity '.length)}` : el;
  const lig = ligandAmountTexts(m, ascii);
  return `${m.element}, ${fmtCelsius(m.temperature.celsius)} \u00b0C, ${a}${lig.length ? `, ${lig.join(', ')}` : ''}`;
}

/** Legend labels longer than this many characters are shortened to what tells the layers apart. */
export const LEGEND_LABEL_MAX = 40;

/**
 * The legend's name of each layer: its full label (layerLabel) when that is short, else only the
 * parts that differ between layers (the element always kept), e.g. "Fe, 90 °C" when every layer has
 * the same amounts and ligands — the caption's "Layers:" line keeps the full labels. Full labels
 * are kept when the short ones would not tell every layer apart.
 */
export function legendLabels(layers: Computed[], full: string[], ascii: boolean): string[] {
  if (full.every((l) => l.length <= LEGEND_LABEL_MAX)) return full;
  const parts = layers.map((l) => [`${fmtCelsius(l.model.temperature.celsius)} \u00b0C`, elementAmountText(l.model, ascii), ...ligandAmountTexts(l.model, ascii)]);
  const n = Math.max(...parts.map((p) => p.length));
  // Amounts given by mass differ in mol/kg with T (water's density): compare them as given.
  const given = (t: string | undefined) => t?.replace(/ \([^()]*mol\/kg\)/, '');
  const differs = Array.from({ length: n }, (_, i) => parts.some((p) => given(p[i]) !== given(parts[0][i])));
  const short = layers.map((l, k) => [l.model.element, ...parts[k].filter((_, i) => differs[i])].join(', '));
  return new Set(short).size === short.length ? short : full;
}

export interface OverlayFigure {
  input: FigureInput;
  layers: { label: string; dash: string | null; computed: Computed }[];
  sameElement: boolean;
}

/**
 * The second potential axis of the base file's `reference:` and its operating marks, both at the
 * file's own temperature (the one at which its potentials were measured), whatever temperatures
 * the layers are drawn at: the second axis then reads a mark's potential as the file gives it.
 * Returns the caption note when some layer's temperature differs from the file's (the SHE scale of
 * each layer is that layer's own, so a shared reference axis is exact for the file's temperature only).
 */
function fileScaleMarks(input: FigureInput, layers: Computed[], file: SystemSpec, fig: FigureSettings, explicitAxis: boolean): string[] {
  const T = file.temperature;
  const ref = file.operating.reference;
  // Step 1: the file's own reference axis at its temperature (an explicit --ref axis was set by the caller).
  if (ref !== undefined && ref !== 'she' && ref !== 'rhe' && !explicitAxis) {
    const r = referenceOffset(ref, T);
    fig.options.secondAxis = { label: `E / V vs ${r.label}`, offset: r.offset };
    input.options = fig.options;
  }
  // Step 2: the marks converted at the file's temperature.
  placeOperatingMarks(input, file.operating, T);
  // Step 3: say so when a layer is at another temperature and there is something on that scale.
  const hasMarks = file.operating.points.length + file.operating.boxes.length + file.operating.paths.length > 0;
  const differ = layers.some((l) => l.model.temperature.celsius !== T);
  if (!differ || !(hasMarks || fig.options.secondAxis)) return [];
  const what = [fig.options.secondAxis ? 'second axis' : '', hasMarks ? 'operating marks' : ''].filter(Boolean).join(' and ');
  return [`The ${what} use${hasMarks && fig.options.secondAxis ? '' : 's'} the file's temperature (${fmtCelsius(T)} \u00b0C); each layer's potentials are vs SHE at its own temperature.`];
}

/**
 * Composes the figure: the base through figureInput (its settings), the operating marks and the
 * reference axis of the base file at the file's own temperature (`file`, the base file as read,
 * before --temperatures), the other layers as FigureInput.overlays, and a caption naming every layer.
 */
export function overlayFigure(layers: Computed[], fig: FigureSettings, ascii: boolean, file: SystemSpec = layers[0].spec): OverlayFigure {
  const base = layers[0];
  const sameElement = layers.every((l) => l.model.element === base.model.element);
  // Several elements asked in colour: no fills (they would overlap), but a line colour per layer.
  const layerColors = !sameElement && fig.options.style === 'color';
  if (!sameElement) {
    // Separate elements: lines only, and the caption (with the plain statement) is always shown.
    fig.options.style = 'lines';
    fig.options.show.caption = true;
  }
  const labels = layers.map((l) => layerLabel(l, ascii));
  // Step: identical labels (e.g. two files differing only in ligands or data) get the file name.
  labels.forEach((lab, k) => {
    if (labels.filter((x) => x === lab).length > 1) labels[k] = `${lab} (${layers[k].spec.file.split(/[\\/]/).pop()})`;
  });
  if (fig.options.title === undefined) {
    const els = [...new Set(layers.map((l) => l.model.element))];
    const ts = [...new Set(layers.map((l) => fmtCelsius(l.model.temperature.celsius)))];
    fig.options.title = sameElement ? `${base.model.element}\u2013{H2O}, ${ts.join(' / ')} \u00b0C` : `${els.join(', ')}: separate single-element diagrams`;
  }
  const legend = legendLabels(layers, labels, ascii);
  const explicitAxis = fig.options.secondAxis !== undefined;
  const input = figureInput(base, { options: fig.options, families: [] });
  const scaleNote = fileScaleMarks(input, layers, file, fig, explicitAxis);
  input.overlays = layers.slice(1).map((l, k) => ({
    label: legend[k + 1],
    model: l.model,
    dash: OVERLAY_DASHES[k],
    // The base keeps the 'lines' style's black boundaries, LAYER_INKS[0].
    ...(layerColors ? { color: LAYER_INKS[(k + 1) % LAYER_INKS.length] } : {}),
  }));
  // The base layer is named in the legend like the others (its fields are filled when the elements agree).
  input.baseLabel = `${legend[0]}${sameElement && fig.options.style !== 'lines' ? ' (filled)' : ''}`;
  if (fig.options.show.caption) {
    // The base's own caption without its first line (conditions, named per layer here) and data line.
    const own = captionLines(base).slice(1).filter((l) => !l.startsWith('Data: '));
    const lines = [
      `Layers: ${labels[0]} (base, ${layerColors ? `${LAYER_INK_NAMES[0]} ` : ''}solid lines${sameElement && fig.options.style !== 'lines' ? ', filled fields' : ''}); ${layers
        .slice(1)
        .map((_, k) => `${labels[k + 1]} (${layerColors ? `${LAYER_INK_NAMES[(k + 1) % LAYER_INK_NAMES.length]} ` : ''}${OVERLAY_DASHES[k]}, boundaries only)`)
        .join('; ')}.`,
      ...own,
    ];
    if (layers.some((l) => l.model.temperature.celsius !== base.model.temperature.celsius)) {
      lines.push(`Water lines are those of the base layer (${fmtCelsius(base.model.temperature.celsius)} \u00b0C).`);
    }
    lines.push(...scaleNote);
    if (!sameElement) lines.push(SEPARATE_ELEMENTS_NOTE);
    const short = layers.flatMap((l) => l.model.sources.map(shortSource)).filter((s, k, a) => a.indexOf(s) === k);
    if (short.length) lines.push(`Data: ${short.join('; ')}.`);
    input.caption = lines;
  }
  return {
    input,
    layers: layers.map((l, k) => ({ label: labels[k], dash: k === 0 ? null : OVERLAY_DASHES[k - 1], computed: l })),
    sameElement,
  };
}

/** Overlays carry a longer legend and caption: 160 mm wide unless the file or --width says otherwise. */
const OVERLAY_WIDTH = '160mm';

/**
 * Figure settings of an overlay: the base layer's file with the command-line overrides, 160 mm
 * wide by default; the first file's own title describes one layer, not the overlay, so the title
 * comes from the layers unless --title gives one.
 */
export function overlaySettings(layers: Computed[], cli: FigureOverrides): FigureSettings {
  const fig = figureSettingsWidth(layers[0].spec, cli, OVERLAY_WIDTH);
  if (cli.title === undefined) fig.options.title = undefined;
  return fig;
}

/** Every layer's warnings, each prefixed with its layer ("Fe 90 °C: …"), each once, in layer order. */
export function layerWarnings(layers: Computed[]): string[] {
  const out: string[] = [];
  for (const l of layers) {
    for (const w of l.model.warnings) {
      const msg = `${l.model.element} ${l.model.temperature.celsius} °C: ${w}`;
      if (!out.includes(msg)) out.push(msg);
    }
  }
  return out;
}

/** Computes every layer (base first). */
export function computeLayers(specs: SystemSpec[]): Computed[] {
  return specs.map((s) => compute(s));
}
