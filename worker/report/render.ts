/**
 * The PDF summary of a forward run: cover, survey, velocity section, depth to an iso-velocity
 * surface, boreholes and ties, the layer interpretation behind the model (when there is one), travel-time curves, misfit, method statement, limitations and cautions. A4 portrait,
 * Source Sans 3 embedded, page frames with "page N of M". Pure apart from reading the font files:
 * the same input gives the same pages.
 */
import { ReportContext } from './context';
import { drawCautions } from './cautions';
import { drawCover } from './cover';
import { drawCurves } from './curves';
import { openReportDocument } from './document';
import { drawPageFrames } from './frame';
import { drawIsoDepth, drawReportBoreholes } from './iso-depth';
import { drawLayers } from './layers';
import { drawMethod } from './method';
import { drawMisfit } from './misfit';
import { drawSection } from './section';
import { drawSurvey } from './survey';
import type { ReportInput } from './types';
import { validateReportInput } from './validate';

export async function renderReportPdf(input: ReportInput): Promise<Buffer> {
  validateReportInput(input);
  const { doc, done } = openReportDocument(input, 'Forward travel-time model');

  const ctx = new ReportContext(doc, input);
  drawCover(ctx);
  drawSurvey(ctx);
  drawSection(ctx);
  drawIsoDepth(ctx);
  drawReportBoreholes(ctx);
  drawLayers(ctx);
  drawCurves(ctx);
  drawMisfit(ctx);
  drawMethod(ctx);
  drawCautions(ctx);
  drawPageFrames(doc, input);
  doc.end();
  return done;
}
