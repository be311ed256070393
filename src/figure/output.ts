/**
 * Render a composed figure to bytes by output format. PDF, PNG and HTML modules load lazily, only
 * when asked for, so SVG and JSON runs start fast.
 */
import { InputError } from '../errors.js';
import { BUNDLED_FAMILY, isBundledFamily } from '../render/font-names.js';
import { mmToPx } from '../render/options.js';
import { buildScene, type FigureInput } from '../render/scene.js';
import { sceneToSvg } from '../render/svg.js';
import { type Drawn, figureInput } from './compose.js';
import { type FigureOverrides, figureSettings } from './options.js';

export type FigureFormat = 'svg' | 'pdf' | 'png' | 'html';

/**
 * Draws a figure input in one format. What the layout did to fit the size (scene notes) is kept in
 * the model's `figureNotes` for the caller to report.
 */
export async function renderFigure(input: FigureInput, format: FigureFormat): Promise<string | Uint8Array> {
  if ((format === 'pdf' || format === 'png') && !isBundledFamily(input.options.fontFamily)) {
    throw new InputError(
      'figure',
      'font (--font)',
      `${BUNDLED_FAMILY} for ${format.toUpperCase()} output (it embeds the bundled font only; other families apply to SVG and HTML)`,
      JSON.stringify(input.options.fontFamily),
    );
  }
  const scene = buildScene(input);
  if (scene.notes.length) input.model.figureNotes = [...scene.notes];
  else delete input.model.figureNotes;
  if (format === 'svg') return sceneToSvg(scene);
  if (format === 'html') {
    const { sceneToHtml } = await import('../render/html.js');
    return sceneToHtml(scene, input.model, input.options, input.readout);
  }
  if (format === 'pdf') {
    const { sceneToPdf } = await import('../render/pdf.js');
    return sceneToPdf(scene);
  }
  const { svgToPng } = await import('../render/png.js');
  // The figure's resolution (--dpi; a width given in px sets it so the PNG has those pixels), else 300 dpi.
  return svgToPng(sceneToSvg(scene), Math.round(mmToPx(input.options.width, input.options.dpi ?? 300)));
}

/**
 * A computed diagram (either kind) drawn as one output: the figure settings of its system file (with the
 * command-line style overrides, if any) composed as the `draw` verb does, then rendered. SVG and
 * HTML come back as text, PDF and PNG as bytes.
 */
export async function renderDiagram(c: Drawn, format: FigureFormat, overrides: FigureOverrides = {}): Promise<string | Uint8Array> {
  return renderFigure(figureInput(c, figureSettings(c.spec, overrides)), format);
}
