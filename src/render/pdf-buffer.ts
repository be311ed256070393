/**
 * The bytes of a pdfkit document: collects its data chunks into one Buffer when the document ends.
 * Call right after creating the document (before anything is drawn), then `doc.end()` when done.
 */
export function collectPdf(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  return new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}
