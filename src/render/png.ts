/**
 * SVG → PNG raster with @resvg/resvg-js (loaded lazily). Fonts: only the bundled DejaVu Sans
 * files (no system fonts), so the same SVG gives the same PNG bytes on every machine.
 */
import { BUNDLED_FAMILY, fontFiles } from './fonts.js';

/** The one family the rasteriser knows (every family the SVG names falls back to it). */
export const PNG_FALLBACK_FONT = BUNDLED_FAMILY;

/**
 * Renders SVG text to a PNG `widthPx` pixels wide (height follows the aspect ratio), on white.
 * Throws Error for a width that is not a positive integer up to 20000 px.
 */
export async function svgToPng(svg: string, widthPx: number): Promise<Buffer> {
  if (!Number.isInteger(widthPx) || widthPx < 1 || widthPx > 20000) {
    throw new Error(`PNG width must be a whole number of pixels from 1 to 20000, got ${widthPx}`);
  }
  const { Resvg } = await import('@resvg/resvg-js');
  const r = new Resvg(svg, {
    fitTo: { mode: 'width', value: widthPx },
    background: '#ffffff',
    font: {
      loadSystemFonts: false,
      fontFiles: fontFiles(),
      defaultFontFamily: PNG_FALLBACK_FONT,
      sansSerifFamily: PNG_FALLBACK_FONT,
    },
    shapeRendering: 2,
    textRendering: 1,
    logLevel: 'off',
  });
  return Buffer.from(r.render().asPng());
}

/** Pixels across for a width in mm at a resolution in dots per inch (e.g. 85 mm at 600 dpi → 2008). */
export function pngWidthFor(widthMm: number, dpi: number): number {
  if (!(dpi > 0)) throw new Error(`resolution must be positive, got ${dpi} dpi`);
  return Math.max(1, Math.round((widthMm / 25.4) * dpi));
}
