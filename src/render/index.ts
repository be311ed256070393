/** Figure rendering: options → scene → SVG / PDF / PNG. */
export { DEFAULT_FIGURE, parseLength, resolveOptions, validateOptions, mmToPt, ptToMm, mmToPx, MIN_FONT_PT } from './options.js';
export type { FigureOptions } from './options.js';
export { buildScene, CAUTION, dashStroke, parseDash, wrapText } from './scene.js';
export type { FigureInput } from './scene.js';
export type { Scene, SceneItem, ScenePath, SceneText, SceneCircle, SceneGroup, TextRun, Rect, Point, PlotFrame } from './scene-types.js';
export { sceneToSvg } from './svg.js';
export { sceneToPdf, drawSceneOnPdf } from './pdf.js';
export { sceneToHtml } from './html.js';
export { svgToPng, pngWidthFor, PNG_FALLBACK_FONT } from './png.js';
export { formulaRuns, runsText, runsUnicode, scriptRuns } from './typeset.js';
