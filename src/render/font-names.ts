/** Names of the bundled font (pure: no file access; the files are found by fonts.ts). */

/** Family name of the bundled font, as SVG and the PNG rasteriser know it. */
export const BUNDLED_FAMILY = 'DejaVu Sans';

/** The SVG font-family list: the bundled family, then fallbacks for viewers without it. */
export const SVG_FONT_FAMILY = "'DejaVu Sans', 'Bitstream Vera Sans', sans-serif";

/**
 * Whether a font-family list asks for the bundled font (its first family is DejaVu Sans, quoted or
 * not): PDF and PNG can draw only that one.
 */
export function isBundledFamily(list: string): boolean {
  const first = list.split(',')[0]!.trim().replace(/^['"]|['"]$/g, '');
  return first.toLowerCase() === BUNDLED_FAMILY.toLowerCase();
}
