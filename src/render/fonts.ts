/**
 * The bundled font: DejaVu Sans from the npm package dejavu-fonts-ttf (Bitstream Vera licence,
 * fonts/LICENSE-DejaVu). The PDF embeds it (subset), the PNG rasteriser loads only it, the SVG
 * names it first. Files are found next to the installed package; a missing package is a clear error.
 */
import { createRequire } from 'node:module';


export { BUNDLED_FAMILY, SVG_FONT_FAMILY, isBundledFamily } from './font-names.js';

export type FontFace = 'regular' | 'bold' | 'italic' | 'boldItalic';

const FILES: Record<FontFace, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  italic: 'DejaVuSans-Oblique.ttf',
  boldItalic: 'DejaVuSans-BoldOblique.ttf',
};

/** PDF font names the faces are registered under. */
export const PDF_FACE: Record<FontFace, string> = {
  regular: 'DejaVuSans',
  bold: 'DejaVuSans-Bold',
  italic: 'DejaVuSans-Oblique',
  boldItalic: 'DejaVuSans-BoldOblique',
};

/** Path of a face's TTF file. Throws Error naming the package when it is not installed. */
export function fontFile(face: FontFace): string {
  try {
    return createRequire(import.meta.url).resolve(`dejavu-fonts-ttf/ttf/${FILES[face]}`);
  } catch {
    throw new Error(`the bundled font ${FILES[face]} (npm package dejavu-fonts-ttf) is not installed; reinstall ephmap`);
  }
}

/** Every face's TTF file (regular, bold, italic, bold italic). */
export const fontFiles = (): string[] => (Object.keys(FILES) as FontFace[]).map(fontFile);

/** The face for a run's style. */
export const faceOf = (italic: boolean, bold: boolean): FontFace => (bold ? (italic ? 'boldItalic' : 'bold') : italic ? 'italic' : 'regular');

const registered = new WeakSet<object>();

/** Registers the four faces with a pdfkit document (once per document), so they are embedded, subset. */
export function registerPdfFonts(doc: PDFKit.PDFDocument): void {
  if (registered.has(doc)) return;
  for (const face of Object.keys(FILES) as FontFace[]) doc.registerFont(PDF_FACE[face], fontFile(face));
  registered.add(doc);
}
