/** Flowing text blocks: section headings, paragraphs, bullet lists, captions and label–value lists. */
import type { PageFlow } from './context';
import { FONT } from './fonts';
import { drawText } from './glyph-runs';
import { COLOUR, CONTENT, GAP, SIZE } from './style';

/** "2  Velocity section" at the top of a new page (or below the cursor when `newPage` is false). */
export function sectionHeading<K extends string>(ctx: PageFlow<K>, key: K, o: { newPage?: boolean } = {}): void {
  if (o.newPage ?? true) ctx.newPage();
  else {
    ctx.y += GAP.block;
    ctx.ensureSpace(120);
  }
  const { doc } = ctx;
  drawText(doc.fontSize(SIZE.heading).fillColor(COLOUR.accent), ctx.headingText(key), FONT.semibold, CONTENT.left, ctx.y, { width: CONTENT.width });
  ctx.y = doc.y + 3;
  doc.save().lineWidth(0.6).strokeColor(COLOUR.rule).moveTo(CONTENT.left, ctx.y).lineTo(CONTENT.right, ctx.y).stroke().restore();
  ctx.y += GAP.afterHeading + 2;
}

export function subheading(ctx: PageFlow, title: string): void {
  ctx.ensureSpace(60);
  const { doc } = ctx;
  drawText(doc.fontSize(SIZE.subheading).fillColor(COLOUR.ink), title, FONT.semibold, CONTENT.left, ctx.y, { width: CONTENT.width });
  ctx.y = doc.y + 3;
}

export function paragraph(ctx: PageFlow, text: string, o: { size?: number; colour?: string; italic?: boolean; gap?: number } = {}): void {
  const { doc } = ctx;
  const size = o.size ?? SIZE.body;
  const font = o.italic ? FONT.italic : FONT.regular;
  doc.font(font).fontSize(size).fillColor(o.colour ?? COLOUR.ink);
  ctx.ensureSpace(Math.min(doc.heightOfString(text, { width: CONTENT.width, lineGap: 1.5 }), 3 * size * 1.4));
  drawText(doc, text, font, CONTENT.left, ctx.y, { width: CONTENT.width, lineGap: 1.5 });
  ctx.y = doc.y + (o.gap ?? GAP.paragraph);
}

/** Height the bullet list will take (lead-ins measured in the regular weight, a little narrower than drawn). */
export function bulletsHeight(ctx: PageFlow, items: { lead?: string; text: string }[]): number {
  const { doc } = ctx;
  doc.font(FONT.regular).fontSize(SIZE.body);
  return items.reduce((h, item) => h + doc.heightOfString(`${item.lead ?? ''} ${item.text}`, { width: CONTENT.width - 12, lineGap: 1.5 }) + 4, 0) + GAP.paragraph;
}

/** Bullet points with a hanging indent; each item may start with a short semibold lead-in. */
export function bullets(ctx: PageFlow, items: { lead?: string; text: string }[]): void {
  const { doc } = ctx;
  const indent = 12;
  for (const item of items) {
    const width = CONTENT.width - indent;
    doc.font(FONT.regular).fontSize(SIZE.body);
    const h = doc.heightOfString(`${item.lead ?? ''} ${item.text}`, { width, lineGap: 1.5 });
    ctx.ensureSpace(h + 2);
    doc.fillColor(COLOUR.accent).circle(CONTENT.left + 3.5, ctx.y + SIZE.body * 0.62, 1.4).fill();
    doc.fillColor(COLOUR.ink);
    if (item.lead) {
      drawText(doc, `${item.lead} `, FONT.semibold, CONTENT.left + indent, ctx.y, { width, lineGap: 1.5, continued: true });
      drawText(doc, item.text, FONT.regular, undefined, undefined, { lineGap: 1.5 });
    } else {
      drawText(doc, item.text, FONT.regular, CONTENT.left + indent, ctx.y, { width, lineGap: 1.5 });
    }
    ctx.y = doc.y + 4;
  }
  ctx.y += GAP.paragraph - 4;
}

/** "Figure 2. …" or "Table 1. …" below a figure or above a table; returns its number. */
export function caption(ctx: PageFlow, kind: 'Figure' | 'Table', text: string, n = kind === 'Figure' ? ctx.nextFigure() : ctx.nextTable()): number {
  const { doc } = ctx;
  doc.font(FONT.regular).fontSize(SIZE.caption);
  const h = doc.heightOfString(`${kind} ${n}. ${text}`, { width: CONTENT.width, lineGap: 1 });
  ctx.ensureSpace(h);
  doc.font(FONT.semibold).fillColor(COLOUR.ink).text(`${kind} ${n}. `, CONTENT.left, ctx.y, { width: CONTENT.width, lineGap: 1, continued: true });
  drawText(doc.fillColor(COLOUR.muted), text, FONT.regular, undefined, undefined, { lineGap: 1 });
  ctx.y = doc.y + GAP.block;
  return n;
}

/** Height a caption will take, to keep a figure and its caption on one page. */
export function captionHeight(ctx: PageFlow, text: string): number {
  ctx.doc.font(FONT.regular).fontSize(SIZE.caption);
  return ctx.doc.heightOfString(`Figure 00. ${text}`, { width: CONTENT.width, lineGap: 1 }) + GAP.block;
}

/** Two columns: labels in muted type, values in ink. */
export function labelValues(ctx: PageFlow, rows: [string, string][], o: { labelWidth?: number; size?: number; left?: number; width?: number } = {}): void {
  const { doc } = ctx;
  const size = o.size ?? SIZE.body;
  const left = o.left ?? CONTENT.left;
  const width = o.width ?? CONTENT.width;
  const lw = o.labelWidth ?? 130;
  for (const [k, v] of rows) {
    doc.font(FONT.regular).fontSize(size);
    const h = Math.max(doc.heightOfString(v, { width: width - lw }), size * 1.3);
    ctx.ensureSpace(h);
    const y = ctx.y;
    drawText(doc.fillColor(COLOUR.muted), k, FONT.regular, left, y, { width: lw - 8 });
    drawText(doc.fillColor(COLOUR.ink), v, FONT.regular, left + lw, y, { width: width - lw });
    ctx.y = Math.max(doc.y, y + size * 1.3) + 2.5;
  }
}
