/**
 * The PDF summary of a forward run: cover, survey, velocity section, depth to an iso-velocity
 * surface, travel-time curves, misfit, method statement, limitations and cautions. A4 portrait,
 * Source Sans 3 embedded, page frames with "page N of M". Pure apart from reading the font files:
 * the same input gives the same pages.
 */
import PDFDocument from 'pdfkit';
import { ReportContext } from './context';
import { drawCautions } from './cautions';
import { drawCover, COVER_TITLE } from './cover';
import { drawCurves } from './curves';
import { fontPath, FONT, registerFonts } from './fonts';
import { drawPageFrames } from './frame';
import { drawIsoDepth } from './iso-depth';
import { drawMethod } from './method';
import { drawMisfit } from './misfit';
import { drawSection } from './section';
import { MARGIN } from './style';
import { drawSurvey } from './survey';
import type { ReportInput } from './types';
import { validateReportInput } from './validate';

export async function renderReportPdf(input: ReportInput): Promise<Buffer> {
  validateReportInput(input);
  const doc = new PDFDocument({
    size: 'A4',
    margins: { ...MARGIN },
    bufferPages: true,
    // The default font must be ours too, or pdfkit would reference a standard (system) font.
    font: fontPath(FONT.regular),
    info: {
      Title: `${COVER_TITLE}: ${input.project.name}, line ${input.line.name}`,
      Author: input.preparedBy,
      Subject: `Forward travel-time model, report ${input.reportId} (${input.status})`,
      Creator: 'Timefield',
      Producer: 'Timefield',
      CreationDate: input.date,
      ModDate: input.date,
    },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);

  const ctx = new ReportContext(doc, input);
  drawCover(ctx);
  drawSurvey(ctx);
  drawSection(ctx);
  drawIsoDepth(ctx);
  drawCurves(ctx);
  drawMisfit(ctx);
  drawMethod(ctx);
  drawCautions(ctx);
  drawPageFrames(doc, input);
  doc.end();
  return done;
}
