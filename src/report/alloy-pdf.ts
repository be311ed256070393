/**
 * The alloy report as a PDF (issue 18): the same sections as the Markdown and HTML alloy reports
 * (alloy-text.ts) — composition, the figure drawn as vectors from its scene, the assemblages with
 * their verdicts and amounts, the operating points, envelopes and paths answered, the reactions between neighbouring assemblages, warnings, what the
 * diagram does not say, sources — on the A4 page of the single-element PDF report (report-pdf.ts
 * Writer, the bundled DejaVu Sans embedded). Reproducible: fixed creation date, same bytes for the
 * same input. Writes nothing itself (returns the bytes).
 */
import type { AlloyOperating } from './alloy-operating.js';
import { envelopeText, REPORT_CAUTIONS, REPORT_CLOSING } from './report-data.js';
import type { DiagramModel } from '../model.js';
import { PDF_FACE, registerPdfFonts } from '../render/fonts.js';
import { collectPdf } from '../render/pdf-buffer.js';
import type { Scene } from '../render/scene-types.js';
import { ENVELOPE_NOTE, lineText, memberAmounts, referenceNote, verdictText } from './alloy-text.js';
import { fmtCelsius, fmtNum } from './format.js';
import { lineRows } from './lines.js';
import { BODY, MARGIN, SMALL, Writer } from './report-pdf.js';

/** The report's bytes; `figureMm` is the figure's physical size (scaled down to the text width). */
export async function alloyReportPdf(model: DiagramModel, scene: Scene, figureMm: { width: number; height: number }, caption: string[], operating?: AlloyOperating): Promise<Buffer> {
  const a = model.alloy!;
  const title = `Alloy ${model.element} at ${fmtCelsius(model.temperature.celsius)} °C`;
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
    compress: true,
    info: { Title: title, Creator: 'ephmap', Producer: 'ephmap', CreationDate: new Date(Date.UTC(2000, 0, 1)) },
  });
  const done = collectPdf(doc);
  registerPdfFonts(doc);
  const w = new Writer(doc);
  doc.font(PDF_FACE.bold).fontSize(17).text(title, w.left, MARGIN, { width: w.width });
  doc.moveDown(0.3);
  w.para('Equilibrium thermodynamics only: a screening aid. See "What this diagram does not say" at the end.', { italic: true });

  w.heading('Composition');
  w.table(['element', 'mole fraction', 'threshold activity of its dissolved species'], Object.keys(a.composition).map((e) => [e, fmtNum(a.composition[e]), fmtNum(a.activities[e])]), [0.2, 0.3, 0.5], BODY - 0.5);
  if (model.reference) w.para(referenceNote(model));

  w.figure('Diagram', scene, figureMm);
  for (const l of caption) w.para(l, { size: SMALL });

  w.heading('Assemblages');
  w.table(['assemblage', 'verdict', 'amounts (mol per mol of alloy atoms)', 'area (pH·V)'], model.regions.map((r) => [
    r.species,
    verdictText(r.alloyVerdict!, r.dissolving ?? []),
    memberAmounts(r),
    fmtNum(r.area, 3),
  ]), [0.26, 0.24, 0.38, 0.12]);

  if (operating?.points.length) {
    w.heading('Operating points');
    w.table(['point', 'pH', 'E as given', 'E / V vs SHE', 'assemblage', 'verdict'], operating.points.map((p) => [p.label, fmtNum(p.pH), `${fmtNum(p.Egiven)} V vs ${p.scale}`, p.Eshe.toFixed(4), p.assemblage, p.verdict]), [0.18, 0.08, 0.18, 0.12, 0.26, 0.18]);
  }
  if (operating?.envelopes.length) {
    w.heading('Envelopes and paths');
    w.para(ENVELOPE_NOTE);
    w.bullets(operating.envelopes.map(envelopeText));
  }

  w.heading('Reactions between neighbouring assemblages');
  w.table(['between', 'reaction', 'line'], lineRows(model, model.reference).map((r) => [r.between.join(' | '), r.reaction, lineText(r)]), [0.28, 0.4, 0.32]);

  w.heading('Warnings');
  if (!model.warnings.length) w.para('None.');
  else w.bullets(model.warnings);

  w.heading('What this diagram does not say');
  w.bullets([
    'Phases are pure compounds: no solid-solution activities (a chromium-rich spinel film is not an ideal mixture of FeCr2O4 and Fe3O4), no alloy-metal activities below one.',
    'Equilibrium only: no kinetics, film quality, breakdown or localized attack; a passive assemblage is a thermodynamic possibility, not a guarantee.',
  ]);

  w.heading('Cautions');
  for (const c of REPORT_CAUTIONS) w.para(c);
  w.para(REPORT_CLOSING, { bold: true });

  w.heading('Data sources');
  w.bullets(model.sources);
  doc.end();
  return done;
}
