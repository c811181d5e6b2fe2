/** Page 1: who, where, what and in which state, with a pointer to the cautions. */
import type { PageFlow, ReportContext } from './context';
import { labelValues } from './flow';
import { FONT } from './fonts';
import { drawText } from './glyph-runs';
import { isoDate } from './format';
import { sectionNumber, sectionTitle } from './outline';
import { COLOUR, CONTENT, PAGE, SIZE } from './style';
import type { ReportMeta } from './types';

export const COVER_TITLE = 'Seismic refraction summary';

/** Room for the consultancy's logo at the top right of the cover, pt (the image is fitted inside). */
const LOGO = { width: 120, height: 50 };

export function drawCover(ctx: ReportContext): void {
  const { input } = ctx;
  drawCoverPage(ctx, input, {
    subtitle: `Forward travel-time model of line ${input.line.name}`,
    cautions: `${sectionNumber('cautions', input)}, ${sectionTitle('cautions', input)}`,
    provenance: `Produced with Timefield from run ${input.run.id} (${isoDate(input.run.createdAt)}), model "${input.model.name}" version ${input.model.version}, pick set ${input.run.pickSetFile} revision ${input.run.pickSetRevision}.`,
  });
}

/** What differs between the covers of the report kinds. */
export interface CoverText {
  /** Under the title, e.g. "Forward travel-time model of line BH-2". */
  subtitle: string;
  /** "7, Limitations and cautions": the section the status box points to. */
  cautions: string;
  /** Small print at the foot: what the report was made from. */
  provenance: string;
}

export function drawCoverPage(ctx: PageFlow, input: ReportMeta, text: CoverText): void {
  const { doc } = ctx;
  const logoBox = input.consultancyLogo ? LOGO : null;
  const nameWidth = CONTENT.width - (logoBox ? logoBox.width + 16 : 0);
  if (logoBox) doc.image(input.consultancyLogo!, CONTENT.right - logoBox.width, CONTENT.top, { fit: [logoBox.width, logoBox.height], align: 'right' });
  drawText(doc.fontSize(SIZE.subheading).fillColor(COLOUR.accent), input.consultancy, FONT.semibold, CONTENT.left, CONTENT.top, { width: nameWidth });
  if (input.consultancyAddress) drawText(doc.fontSize(SIZE.small).fillColor(COLOUR.muted), input.consultancyAddress, FONT.regular, CONTENT.left, doc.y + 2, { width: nameWidth });
  doc.save().lineWidth(1.2).strokeColor(COLOUR.accent).moveTo(CONTENT.left, doc.y + 6).lineTo(CONTENT.left + 60, doc.y + 6).stroke().restore();

  ctx.y = 190;
  doc.font(FONT.semibold).fontSize(SIZE.title).fillColor(COLOUR.ink).text(COVER_TITLE, CONTENT.left, ctx.y, { width: CONTENT.width });
  drawText(doc.fontSize(SIZE.subtitle).fillColor(COLOUR.muted), text.subtitle, FONT.regular, CONTENT.left, doc.y + 4, { width: CONTENT.width });
  drawText(doc.fontSize(SIZE.subtitle + 2).fillColor(COLOUR.ink), input.project.name, FONT.semibold, CONTENT.left, doc.y + 26, { width: CONTENT.width });
  ctx.y = doc.y + 22;

  labelValues(ctx, [
    ['Project', input.project.name],
    ['Site', input.project.site],
    ['Client', input.project.clientOrganisation],
    ['Survey line', input.line.name],
    ['Date', isoDate(input.date)],
    ['Prepared by', input.preparedBy],
    ['Reviewed by', input.reviewedBy ?? 'not yet reviewed'],
    ['Report status', input.status],
    ['Report reference', input.reportId],
  ], { labelWidth: 120, size: SIZE.body + 1 });

  // A plain box on the status: until a lead approves it the report is a working document.
  const { cautions } = text;
  const approved = input.status === 'approved' || input.status === 'shared';
  const note = approved
    ? `Approved for issue by ${input.reviewedBy ?? 'the project lead'}. Read the results together with section ${cautions}.`
    : `This report is ${input.status} and has not been approved for issue. Do not base design or excavation decisions on it. Read the results together with section ${cautions}.`;
  const boxTop = ctx.y + 18;
  doc.font(FONT.regular).fontSize(SIZE.body);
  const h = doc.heightOfString(note, { width: CONTENT.width - 24 }) + 18;
  doc.save().lineWidth(0.8).strokeColor(approved ? COLOUR.accent : COLOUR.shot).rect(CONTENT.left, boxTop, CONTENT.width, h).stroke().restore();
  drawText(doc.fillColor(COLOUR.ink), note, FONT.regular, CONTENT.left + 12, boxTop + 9, { width: CONTENT.width - 24 });
  ctx.y = boxTop + h + 10;

  drawText(doc.fontSize(SIZE.small).fillColor(COLOUR.muted), text.provenance, FONT.regular, CONTENT.left, PAGE.height - 120, { width: CONTENT.width });
}
