/**
 * The page frame, drawn once every page exists: a footer rule, the project, line and report status
 * on the left and "page N of M" on the right, and the consultancy's name in the header from page 2.
 */
import type { ReportInput } from './types';
import { label } from './text';
import { COLOUR, CONTENT, PAGE, SIZE } from './style';

export function footerText(input: ReportInput): string {
  return `${input.project.name} · line ${input.line.name} · report ${input.status}`;
}

export function drawPageFrames(doc: PDFKit.PDFDocument, input: ReportInput): void {
  const range = doc.bufferedPageRange();
  const total = range.count;
  const footerY = PAGE.height - 44;
  for (let i = range.start; i < range.start + total; i++) {
    doc.switchToPage(i);
    doc.save().lineWidth(0.5).strokeColor(COLOUR.rule).moveTo(CONTENT.left, footerY - 8).lineTo(CONTENT.right, footerY - 8).stroke().restore();
    label(doc, footerText(input), CONTENT.left, footerY, { size: SIZE.footer, valign: 'top', colour: COLOUR.muted });
    label(doc, `page ${i - range.start + 1} of ${total}`, CONTENT.right, footerY, { size: SIZE.footer, valign: 'top', align: 'right', colour: COLOUR.muted });
    if (i > range.start) {
      label(doc, input.consultancy, CONTENT.right, 36, { size: SIZE.footer, valign: 'top', align: 'right', colour: COLOUR.muted });
      label(doc, `Seismic refraction summary · ${input.line.name}`, CONTENT.left, 36, { size: SIZE.footer, valign: 'top', colour: COLOUR.muted });
    }
  }
}
