/**
 * The report as a PDF (pdfkit, A4, the bundled DejaVu Sans, embedded): text, tables and the figure,
 * drawn as vector graphics from its scene (src/render/pdf.ts drawSceneOnPdf); a PNG is still
 * accepted in its place. Reproducible: the creation date is fixed, so the same input gives the
 * same bytes.
 */
import { reportForPeople } from './people.js';
import { shortSource } from './format.js';
import { drawSceneOnPdf } from '../render/pdf.js';
import { PDF_FACE, registerPdfFonts } from '../render/fonts.js';
import { collectPdf } from '../render/pdf-buffer.js';
import type { Scene } from '../render/scene-types.js';
import type { ReportData } from './report-data.js';
import { crossingTexts, envelopeText } from './report-data.js';
import { runnerUpText } from './probe-text.js';
import { fmtCelsius, fmtNum, fmtSigned } from './format.js';

type Doc = PDFKit.PDFDocument;

export const MARGIN = 56;
export const BODY = 9;
export const SMALL = 7.5;

/** Text, headings, bullets and tables on an A4 pdfkit document (shared with the alloy report). */
export class Writer {
  constructor(private readonly doc: Doc) {}

  get left(): number {
    return this.doc.page.margins.left;
  }
  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }
  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** Starts a new page unless `h` points fit below the current position. */
  room(h: number): void {
    if (this.doc.y + h > this.bottom) {
      this.doc.addPage();
      this.doc.y = this.doc.page.margins.top;
    }
  }

  /**
   * The figure under its heading (kept on one page with it), centred, at most `figureMm` wide: a
   * scene drawn as vectors, or PNG bytes placed as an image.
   */
  figure(heading: string, figure: Scene | Uint8Array, figureMm: { width: number; height: number }): void {
    const doc = this.doc;
    const mmToPt = (mm: number) => (mm / 25.4) * 72;
    const fw = Math.min(this.width, mmToPt(figureMm.width));
    const fh = fw * (figureMm.height / figureMm.width);
    this.room(fh + 50);
    this.heading(heading);
    const y = doc.y;
    if (isScene(figure)) drawSceneOnPdf(doc, figure, { x: this.left + (this.width - fw) / 2, y, width: fw });
    else doc.image(Buffer.from(figure), this.left + (this.width - fw) / 2, y, { width: fw, height: fh });
    doc.y = y + fh + 6;
  }

  heading(s: string, size = 13): void {
    this.room(size * 4);
    this.doc.moveDown(0.6);
    this.doc.font(PDF_FACE.bold).fontSize(size).fillColor('#000000').text(s, this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.3);
  }

  para(s: string, opts: { bold?: boolean; italic?: boolean; size?: number } = {}): void {
    const font = opts.bold ? PDF_FACE.bold : opts.italic ? PDF_FACE.italic : PDF_FACE.regular;
    this.doc.font(font).fontSize(opts.size ?? BODY).fillColor('#000000').text(s, this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.4);
  }

  bullets(items: string[]): void {
    for (const s of items) {
      this.doc.font(PDF_FACE.regular).fontSize(BODY).fillColor('#000000').text(`\u2022 ${s}`, this.left + 6, this.doc.y, { width: this.width - 6 });
      this.doc.moveDown(0.15);
    }
    this.doc.moveDown(0.3);
  }

  /** A table with column widths as fractions of the text width; rows break across pages. */
  table(header: string[], rows: string[][], fractions: number[], size = SMALL): void {
    const doc = this.doc;
    const pad = 2.5;
    const ws = fractions.map((f) => f * this.width);
    const cellH = (cells: string[], font: string) =>
      Math.max(...cells.map((c, k) => doc.font(font).fontSize(size).heightOfString(c, { width: ws[k] - 2 * pad }))) + 2 * pad;
    const draw = (cells: string[], font: string, fill: string | null) => {
      const h = cellH(cells, font);
      let y = doc.y;
      if (y + h > this.bottom) {
        doc.addPage();
        y = doc.page.margins.top;
        if (font !== PDF_FACE.bold) {
          doc.y = y;
          draw(header, PDF_FACE.bold, '#eeeeee');
          y = doc.y;
        }
      }
      let x = this.left;
      cells.forEach((c, k) => {
        if (fill) doc.rect(x, y, ws[k], h).fill(fill);
        doc.rect(x, y, ws[k], h).lineWidth(0.4).strokeColor('#999999').stroke();
        doc.font(font).fontSize(size).fillColor('#000000').text(c, x + pad, y + pad, { width: ws[k] - 2 * pad });
        x += ws[k];
      });
      doc.y = y + h;
      doc.x = this.left;
    };
    this.room(cellH(header, PDF_FACE.bold) * 2);
    draw(header, PDF_FACE.bold, '#eeeeee');
    for (const r of rows) draw(r, PDF_FACE.regular, null);
    doc.moveDown(0.6);
  }
}

/** Whether the figure argument is a scene (vector) rather than PNG bytes. */
export function isScene(f: Scene | Uint8Array): f is Scene {
  return !(f instanceof Uint8Array) && typeof (f as Scene).widthPt === 'number' && Array.isArray((f as Scene).items);
}

/**
 * Renders the report. `figure` is the figure's scene (drawn as vectors; preferred) or a PNG of it;
 * `figureMm` its physical size. The figure is scaled down only when wider than the text column.
 */
export async function reportPdf(data: ReportData, figure: Scene | Uint8Array, figureMm: { width: number; height: number }, caption: string[]): Promise<Buffer> {
  const d = reportForPeople(data);
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
    compress: true,
    info: { Title: d.title, Creator: 'ephmap', Producer: 'ephmap', CreationDate: new Date(Date.UTC(2000, 0, 1)) },
  });
  const done = collectPdf(doc);
  registerPdfFonts(doc);
  const w = new Writer(doc);
  doc.font(PDF_FACE.bold).fontSize(17).text(d.title, w.left, MARGIN, { width: w.width });
  doc.moveDown(0.3);
  w.para('Equilibrium thermodynamics only: a screening aid. See the cautions at the end.', { italic: true });

  w.heading('Conditions');
  w.table(['quantity', 'value'], d.conditions.map(([k, v]) => [k, v]), [0.28, 0.72], BODY - 0.5);
  if (d.activities.length) {
    w.para('Activities used (a = gamma·m where a concentration m was given):');
    w.table(['species', 'role', 'm / (mol/kg)', 'log gamma', 'activity a'], d.activities.map((r) => [
      r.formula,
      r.role,
      r.molality === undefined ? 'as given' : fmtNum(r.molality),
      r.logGamma === undefined ? '0' : r.logGamma.toFixed(4),
      fmtNum(r.activity),
    ]), [0.24, 0.14, 0.22, 0.18, 0.22]);
  }

  w.figure('Diagram', figure, figureMm);
  for (const l of caption) w.para(l, { size: SMALL });

  w.heading('Reactions and lines');
  w.para(`Each boundary's balanced reaction and its line at ${fmtCelsius(d.celsius)} °C; E in V vs SHE at that temperature.`);
  w.table(['boundary', 'reaction', 'E° / V or log K', 'line', 'pH range'], d.lines.map((r) => [
    r.between.join(' / '),
    r.reaction,
    r.line.kind === 'E' ? `E° = ${r.line.E0!.toFixed(4)}` : `log K = ${r.line.logK!.toFixed(3)}`,
    r.equation,
    `${r.pHRange[0].toFixed(2)}\u2013${r.pHRange[1].toFixed(2)}`,
  ]), [0.14, 0.34, 0.14, 0.27, 0.11]);
  w.table(['water line', 'reaction', 'line'], d.waterLines.map((x) => [x.couple, x.reaction, x.equation]), [0.16, 0.44, 0.4]);

  pointsSection(d, w);

  if (d.envelopes.length) {
    w.heading('Envelopes and paths');
    w.para('Each envelope is answered at its four corners and its centre, each path at its points (exactly, as for operating points); a field crossed between samples is not reported here - see the figure.');
    w.bullets(d.envelopes.map(envelopeText));
  }

  windowSection(d, w);

  w.heading('Data sources');
  w.bullets(d.sources);
  w.table(['species', 'phase', 'name', 'role', 'from', 'recalled from memory', 'source (full citations above)'], d.species.map((s) => [
    s.formula,
    s.phase,
    s.name,
    s.role,
    s.origin,
    s.recalled === null ? 'not stated' : s.recalled ? 'yes' : 'no',
    shortSource(s.source),
  ]), [0.11, 0.07, 0.25, 0.09, 0.12, 0.14, 0.22]);
  w.para('"Recalled from memory": the library marks these values as recalled rather than read from the cited table just now; check them against the source before relying on them.', { size: SMALL });

  w.heading('Warnings');
  if (!d.warnings.length) w.para('None.');
  else w.bullets(d.warnings);

  w.heading('Cautions');
  for (const c of d.cautions) w.para(c);
  w.para(d.closing, { bold: true });
  doc.end();
  return done;
}

/** The "Operating points" section: speciation tables, or the verdict table with one bullet per point. */
function pointsSection(d: ReportData, w: Writer): void {
  w.heading('Operating points');
  if (d.speciation) {
    w.para(d.speciation.intro);
    w.table(d.speciation.header, d.speciation.rows, [0.13, 0.07, 0.13, 0.1, 0.15, 0.11, 0.16, 0.15]);
    for (const x of d.speciation.details) {
      w.para(x.label);
      w.table(x.header, x.rows, [0.22, 0.12, 0.24, 0.18, 0.24]);
    }
  } else if (!d.points.length) w.para('The system file names no operating points (key "points").');
  else {
    w.para(d.verdictBasis);
    w.table(['point', 'pH', 'E as given', 'E / V vs SHE', 'predominant', 'verdict', 'E shift to runner-up / mV', 'to line along E / mV', 'along pH'], d.points.map((p) => [
      p.label,
      fmtNum(p.pH),
      `${fmtNum(p.Egiven)} V vs ${p.scale}`,
      p.Eshe.toFixed(4),
      p.result.predominant,
      p.result.verdict.toUpperCase(),
      p.result.margin.potentialV === null ? '\u2014' : fmtSigned(p.result.margin.potentialV * 1000, 1),
      p.result.distance.mV === null ? '\u2014' : fmtSigned(p.result.distance.mV, 1),
      p.result.distance.pH === null ? '\u2014' : fmtSigned(p.result.distance.pH, 3),
    ]), [0.16, 0.07, 0.13, 0.1, 0.11, 0.12, 0.09, 0.12, 0.1]);
    w.bullets(d.points.map((p) => {
      const cr = crossingTexts(p.result);
      return `${p.label}: ${p.result.advice}${cr.length ? ` Crossings: ${cr.join('; ')}.` : ''} Runner-up: ${runnerUpText(p.result)}.${p.result.nearestBoundary ? ` Nearest boundary: ${p.result.nearestBoundary.reaction} (${p.result.nearestBoundary.equation}).` : ''}`;
    }));
  }
}

/** The "Plating window" section, where the system asks for it. */
function windowSection(d: ReportData, w: Writer): void {
  if (d.window) {
    const win = d.window;
    w.heading('Plating window');
    w.table(['pH range', 'dissolved form', 'E_dep at the ends / V vs SHE', 'E_dep - E(H2) min \u2026 max / V', 'bounded by (low / high pH)'], win.windows.map((x) => [
      `${x.pH[0].toFixed(2)}\u2013${x.pH[1].toFixed(2)}`,
      x.dissolved.join(', '),
      `${fmtSigned(x.deposition[0].E, 3)} \u2026 ${fmtSigned(x.deposition[x.deposition.length - 1].E, 3)}`,
      `${fmtSigned(x.marginToHydrogen.min, 3)} \u2026 ${fmtSigned(x.marginToHydrogen.max, 3)}`,
      `${x.boundedBy.low ?? 'edge'} / ${x.boundedBy.high ?? 'edge'}`,
    ]), [0.14, 0.2, 0.22, 0.2, 0.24]);
    w.para(win.firstSolid ? `First solid above the window: ${win.firstSolid.species} from pH ${win.firstSolid.pH.toFixed(2)}.` : (d.window.windows.length ? 'No solid appears above the window within the diagram.' : 'No plating window in the diagram (see the note below for why).'));
    w.bullets(win.notes);
  }
}
