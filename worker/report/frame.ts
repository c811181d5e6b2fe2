/**
 * The page frame, drawn once every page exists: a footer rule, the project, line and report status
 * on the left and "page N of M" on the right, and the consultancy's name in the header from page 2.
 */
import type { ReportMeta } from './types';
import { label, textWidth } from './text';
import { COLOUR, CONTENT, PAGE, SIZE } from './style';

export function footerText(input: ReportMeta): string {
  return `${input.project.name} · line ${input.line.name} · report ${input.status}`;
}

/** Shortens the project name (the front of the footer) with an ellipsis until the text fits. */
function fitText(doc: PDFKit.PDFDocument, text: string, width: number, size: number): string {
  if (textWidth(doc, text, size) <= width) return text;
  const tail = text.slice(text.indexOf(' · line '));
  let head = text.slice(0, text.length - tail.length);
  while (head.length > 1 && textWidth(doc, `${head}…${tail}`, size) > width) head = head.slice(0, -1);
  return `${head.trimEnd()}…${tail}`;
}

export function drawPageFrames(doc: PDFKit.PDFDocument, input: ReportMeta): void {
  const range = doc.bufferedPageRange();
  const total = range.count;
  const footerY = PAGE.height - 44;
  for (let i = range.start; i < range.start + total; i++) {
    doc.switchToPage(i);
    doc.save().lineWidth(0.5).strokeColor(COLOUR.rule).moveTo(CONTENT.left, footerY - 8).lineTo(CONTENT.right, footerY - 8).stroke().restore();
    const pageText = `page ${i - range.start + 1} of ${total}`;
    const room = CONTENT.width - textWidth(doc, pageText, SIZE.footer) - 24;
    label(doc, fitText(doc, footerText(input), room, SIZE.footer), CONTENT.left, footerY, { size: SIZE.footer, valign: 'top', colour: COLOUR.muted });
    label(doc, pageText, CONTENT.right, footerY, { size: SIZE.footer, valign: 'top', align: 'right', colour: COLOUR.muted });
    if (i > range.start) {
      label(doc, input.consultancy, CONTENT.right, 36, { size: SIZE.footer, valign: 'top', align: 'right', colour: COLOUR.muted });
      label(doc, `Seismic refraction summary · ${input.line.name}`, CONTENT.left, 36, { size: SIZE.footer, valign: 'top', colour: COLOUR.muted });
    }
  }
}
