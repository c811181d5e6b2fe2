/**
 * The PDF summary of an inversion: cover, velocity section with coverage mask and DOI, depth to an
 * iso-velocity at the stations, boreholes and ties, convergence, misfit, checkerboard test (when run), method and
 * settings, limitations and cautions. Same page, type and frame as the forward-run report; pure
 * apart from reading the font files.
 */
import { drawCoverPage } from '../cover';
import { openReportDocument } from '../document';
import { isoDate } from '../format';
import { drawPageFrames } from '../frame';
import { drawInversionAccuracy } from './accuracy';
import { drawInversionCautions } from './cautions';
import { drawCheckerboard } from './checkerboard';
import { InversionContext } from './context';
import { drawConvergence } from './convergence';
import { drawInversionBoreholes, drawInversionIsoDepth } from './iso-depth';
import { drawInversionMethod } from './method';
import { drawInversionMisfit } from './misfit';
import { inversionHeadingText } from './outline';
import { drawInversionSection } from './section';
import type { InversionReportInput } from './types';
import { validateInversionReportInput } from './validate';

export async function renderInversionReportPdf(input: InversionReportInput): Promise<Buffer> {
  validateInversionReportInput(input);
  const inv = input.inversion;
  const { doc, done } = openReportDocument(input, 'Travel-time tomography');

  const ctx = new InversionContext(doc, input);
  drawCoverPage(ctx, input, {
    subtitle: `Velocity section of line ${input.line.name} by travel-time tomography`,
    cautions: inversionHeadingText('cautions', input).replace(/^(\d+)\s+/, '$1, '),
    provenance: `Produced with Timefield from inversion ${inv.id} (${isoDate(inv.createdAt)}) of pick set ${inv.pickSetFile} revision ${inv.pickSetRevision}; starting model: ${inv.start.kind === 'gradient' ? 'automatic 1-D gradient' : `model version ${inv.start.modelVersion}`}.`,
  });
  drawInversionSection(ctx);
  drawInversionIsoDepth(ctx);
  drawInversionAccuracy(ctx);
  drawInversionBoreholes(ctx);
  drawConvergence(ctx);
  drawInversionMisfit(ctx);
  drawCheckerboard(ctx);
  drawInversionMethod(ctx);
  drawInversionCautions(ctx);
  drawPageFrames(doc, input);
  doc.end();
  return done;
}
