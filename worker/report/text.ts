/**
 * Single-line labels placed exactly, for figures and the page frame. They never wrap and never
 * trigger pdfkit's automatic page break (no width is passed), so a label near the page foot stays
 * on its page.
 */
import { FONT, type FontName } from './fonts';
import { glyphRuns, mixedWidth } from './glyph-runs';
import { COLOUR } from './style';

export interface LabelOptions {
  size: number;
  font?: FontName;
  colour?: string;
  /** Horizontal anchor at x. */
  align?: 'left' | 'center' | 'right';
  /** Vertical anchor at y: top of the capitals, their middle, or the baseline. */
  valign?: 'top' | 'middle' | 'baseline';
  /** Degrees, counter-clockwise, about (x, y). */
  rotate?: number;
}

/** Cap height of Source Sans 3 as a share of the font size (660/1000 units). */
const CAP = 0.66;

export function label(doc: PDFKit.PDFDocument, text: string, x: number, y: number, o: LabelOptions): { width: number; height: number } {
  const font = o.font ?? FONT.regular;
  doc.font(font).fontSize(o.size);
  const width = mixedWidth(doc, text, font);
  const dx = o.align === 'center' ? -width / 2 : o.align === 'right' ? -width : 0;
  const valign = o.valign ?? 'baseline';
  const dy = valign === 'top' ? CAP * o.size : valign === 'middle' ? (CAP * o.size) / 2 : 0;
  doc.save();
  if (o.rotate) doc.rotate(-o.rotate, { origin: [x, y] });
  doc.fillColor(o.colour ?? COLOUR.ink);
  // Each run of glyphs from one face is placed after the previous one (see glyph-runs.ts).
  let at = x + dx;
  for (const run of glyphRuns(text, font)) {
    doc.font(run.font).text(run.text, at, y + dy, { lineBreak: false, baseline: 'alphabetic' });
    at += doc.widthOfString(run.text);
  }
  doc.font(font);
  doc.restore();
  return { width, height: CAP * o.size };
}

export function textWidth(doc: PDFKit.PDFDocument, text: string, size: number, font: FontName = FONT.regular): number {
  return mixedWidth(doc.fontSize(size), text, font);
}
