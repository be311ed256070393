/**
 * Scene → vector PDF with pdfkit (loaded lazily so SVG-only runs never load it). Text uses the
 * standard PDF font Helvetica (no font files needed); the layout was measured with its metrics.
 * Output is reproducible: the creation date is fixed unless given.
 */
import { runRise, runSize, runsWidth } from './metrics.js';
import { faceOf, PDF_FACE, registerPdfFonts } from './fonts.js';
import { collectPdf } from './pdf-buffer.js';
import type { Scene, SceneItem, ScenePath, SceneText } from './scene-types.js';


// pdfkit's document type (kept loose to avoid loading the module for types at run time).
type Doc = PDFKit.PDFDocument;

function drawPath(doc: Doc, p: ScenePath): void {
  // A path with neither fill nor stroke (a region in the 'lines' style) is not built at all: an
  // unpainted PDF path stays current and the next fill would paint it too.
  if (!p.fill && !p.stroke) return;
  let any = false;
  for (const sp of p.subpaths) {
    if (sp.points.length < 2) continue;
    const [first, ...rest] = sp.points;
    doc.moveTo(first![0], first![1]);
    for (const q of rest) doc.lineTo(q[0], q[1]);
    if (sp.closed) doc.closePath();
    any = true;
  }
  if (!any) return;
  const rule = p.fillRule === 'evenodd' ? 'even-odd' : 'non-zero';
  if (p.stroke) {
    doc.lineWidth(p.strokeWidth);
    doc.lineCap(p.lineCap ?? 'butt');
    doc.lineJoin(p.lineJoin ?? 'miter');
    // pdfkit accepts an array of lengths (its type declarations say number).
    if (p.dash) doc.dash(p.dash.map((x) => Math.max(x, 0.001)) as unknown as number, {});
    else doc.undash();
  }
  if (p.fill && p.stroke) doc.fillAndStroke(p.fill, p.stroke, rule);
  else if (p.fill) doc.fill(p.fill, rule);
  else if (p.stroke) doc.stroke(p.stroke);
}

function drawText(doc: Doc, t: SceneText): void {
  const total = runsWidth(t.runs, t.size, t.bold ?? false);
  let x = t.anchor === 'start' ? t.x : t.anchor === 'middle' ? t.x - total / 2 : t.x - total;
  doc.save();
  if (t.rotate !== 0) doc.rotate(t.rotate, { origin: [t.x, t.y] });
  doc.fillColor(t.fill);
  for (const r of t.runs) {
    const size = runSize(r, t.size);
    doc.font(PDF_FACE[faceOf(r.italic ?? false, t.bold ?? false)]).fontSize(size);
    doc.text(r.text, x, t.y - runRise(r, t.size), { lineBreak: false, baseline: 'alphabetic' });
    x += runsWidth([r], t.size, t.bold ?? false);
  }
  doc.restore();
}

function drawItems(doc: Doc, items: readonly SceneItem[]): void {
  for (const it of items) {
    if (it.type === 'path') drawPath(doc, it);
    else if (it.type === 'text') drawText(doc, it);
    else if (it.type === 'circle') {
      if (!it.fill && !it.stroke) continue; // nothing to paint; an unpainted path would stay current
      doc.circle(it.cx, it.cy, it.r);
      if (it.fill && it.stroke) {
        doc.lineWidth(it.strokeWidth).undash();
        doc.fillAndStroke(it.fill, it.stroke);
      } else if (it.fill) doc.fill(it.fill);
      else if (it.stroke) {
        doc.lineWidth(it.strokeWidth).undash();
        doc.stroke(it.stroke);
      }
    } else {
      doc.save();
      if (it.clip) doc.rect(it.clip.x, it.clip.y, it.clip.w, it.clip.h).clip();
      drawItems(doc, it.children);
      doc.restore();
    }
  }
}

/**
 * Draws a scene as vector graphics into an existing pdfkit document on its current page: the
 * scene's top left corner at (x, y) in the page's points (origin top left, y down), scaled to
 * `width` pt (default: the scene's own width; the height follows the aspect ratio). The figure's
 * background is painted and everything is clipped to the figure's rectangle. The graphics state
 * is saved and restored around the drawing; pdfkit's text cursor (doc.x, doc.y) is put back too.
 * Returns the drawn size in pt.
 */
export function drawSceneOnPdf(doc: Doc, scene: Scene, at: { x: number; y: number; width?: number }): { width: number; height: number } {
  const width = at.width ?? scene.widthPt;
  if (!(width > 0) || !Number.isFinite(width)) throw new Error(`figure width on the page must be positive, got ${width} pt`);
  const s = width / scene.widthPt;
  const cursor = { x: doc.x, y: doc.y };
  registerPdfFonts(doc);
  doc.save();
  doc.translate(at.x, at.y);
  doc.scale(s);
  doc.rect(0, 0, scene.widthPt, scene.heightPt).clip();
  doc.rect(0, 0, scene.widthPt, scene.heightPt).fill(scene.background);
  drawItems(doc, scene.items);
  doc.restore();
  doc.x = cursor.x;
  doc.y = cursor.y;
  return { width, height: scene.heightPt * s };
}

/**
 * Renders a scene to a one-page vector PDF of the scene's physical size.
 * `creationDate` defaults to a fixed date so that the same scene gives the same bytes.
 */
export async function sceneToPdf(scene: Scene, opts: { creationDate?: Date } = {}): Promise<Buffer> {
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: [scene.widthPt, scene.heightPt],
    margin: 0,
    autoFirstPage: true,
    compress: true,
    info: {
      Title: scene.title,
      ...(scene.caption !== undefined ? { Subject: scene.caption } : {}),
      Creator: 'ephmap',
      Producer: 'ephmap',
      CreationDate: opts.creationDate ?? new Date(Date.UTC(2000, 0, 1)),
    },
  });
  const done = collectPdf(doc);
  registerPdfFonts(doc);
  doc.rect(0, 0, scene.widthPt, scene.heightPt).fill(scene.background);
  drawItems(doc, scene.items);
  doc.end();
  return done;
}
