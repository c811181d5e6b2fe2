/**
 * A new report PDF: A4 portrait, our margins and fonts (the default font must be ours too, or
 * pdfkit would reference a standard system font), document info from the report's meta, pages
 * buffered for the frames drawn at the end; `done` resolves with the bytes once `doc.end()` is called.
 */
import PDFDocument from 'pdfkit';
import { COVER_TITLE } from './cover';
import { fontPath, FONT, registerFonts } from './fonts';
import { MARGIN } from './style';
import type { ReportMeta } from './types';

export function openReportDocument(meta: ReportMeta, subject: string): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { ...MARGIN },
    bufferPages: true,
    font: fontPath(FONT.regular),
    info: {
      Title: `${COVER_TITLE}: ${meta.project.name}, line ${meta.line.name}`,
      Author: meta.preparedBy,
      Subject: `${subject}, report ${meta.reportId} (${meta.status})`,
      Creator: 'Timefield',
      Producer: 'Timefield',
      CreationDate: meta.date,
      ModDate: meta.date,
    },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);
  return { doc, done };
}
