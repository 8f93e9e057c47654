/**
 * Small generated documents (pdf-lib): the demo filing's evidence and the fixtures of the
 * read-back tests and benchmark. Each page is a list of lines, drawn top to bottom.
 */
import { PDFDocument, StandardFonts } from 'pdf-lib';

export async function makePdf(pages: string[][], title = 'Fieldfile generated document'): Promise<Buffer> {
  const doc = await PDFDocument.create();
  doc.setTitle(title);
  doc.setProducer('Fieldfile');
  // Fixed dates so the same content gives the same bytes (and the same SHA-256).
  doc.setCreationDate(new Date('2026-01-05T09:00:00Z'));
  doc.setModificationDate(new Date('2026-01-05T09:00:00Z'));
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (const lines of pages) {
    const page = doc.addPage([595, 842]);
    lines.forEach((line, i) => page.drawText(line, { x: 56, y: 780 - i * 16, size: 10, font }));
  }
  return Buffer.from(await doc.save());
}
