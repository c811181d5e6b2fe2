/**
 * Plain tables: a semibold header between two rules, light banding, numbers right-aligned. Long
 * tables continue on the next page under a repeated header; narrow tables with many rows can be
 * laid out in side-by-side blocks to save paper.
 */
import type { ReportContext } from './context';
import { FONT } from './fonts';
import { label } from './text';
import { COLOUR, CONTENT, SIZE } from './style';

export interface Column {
  title: string;
  /** Width in pt. */
  width: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableOptions {
  columns: Column[];
  rows: string[][];
  /** Side-by-side blocks (rows split evenly, top to bottom then left to right). */
  blocks?: number;
  size?: number;
  /** Written above the header on every page after the first, e.g. "Table 3 (continued)". */
  continued?: string;
}

const PAD = 4;

export function drawTable(ctx: ReportContext, o: TableOptions): void {
  const size = o.size ?? SIZE.table;
  const rowH = size * 1.55;
  const headH = size * 1.9;
  const blocks = Math.max(1, Math.min(o.blocks ?? 1, o.rows.length));
  const blockWidth = o.columns.reduce((s, c) => s + c.width, 0);
  const gap = blocks > 1 ? (CONTENT.width - blocks * blockWidth) / (blocks - 1) : 0;
  if (gap < 0) throw new RangeError(`table of ${blocks} blocks × ${blockWidth} pt does not fit the page width`);
  const perBlock = Math.ceil(o.rows.length / blocks);

  if (perBlock === 0) {
    // No rows: the header alone says what would be here.
    ctx.ensureSpace(headH + rowH);
    drawBlock(ctx.doc, CONTENT.left, ctx.y, o.columns, [], size, rowH, headH);
    ctx.y += headH + 10;
    return;
  }
  let start = 0;
  while (start < perBlock) {
    ctx.ensureSpace(headH + 3 * rowH);
    // Rows of each block that fit on this page.
    const fit = Math.max(1, Math.floor((ctx.spaceLeft - headH - 2) / rowH));
    const take = Math.min(fit, perBlock - start);
    for (let b = 0; b < blocks; b++) {
      const left = CONTENT.left + b * (blockWidth + gap);
      const rows = o.rows.slice(b * perBlock + start, b * perBlock + start + take);
      if (rows.length === 0 && b > 0) continue;
      drawBlock(ctx.doc, left, ctx.y, o.columns, rows, size, rowH, headH);
    }
    ctx.y += headH + take * rowH + 10;
    start += take;
    if (start < perBlock) {
      ctx.newPage();
      if (o.continued) {
        label(ctx.doc, o.continued, CONTENT.left, ctx.y, { size: SIZE.caption, valign: 'top', colour: COLOUR.muted });
        ctx.y += SIZE.caption + 8;
      }
    }
  }
}

function drawBlock(doc: PDFKit.PDFDocument, left: number, top: number, columns: Column[], rows: string[][], size: number, rowH: number, headH: number): void {
  const width = columns.reduce((s, c) => s + c.width, 0);
  doc.save();
  rows.forEach((_, i) => {
    if (i % 2 === 1) doc.rect(left, top + headH + i * rowH, width, rowH).fill(COLOUR.faint);
  });
  doc.lineWidth(0.6).strokeColor(COLOUR.ink);
  doc.moveTo(left, top).lineTo(left + width, top).stroke();
  doc.lineWidth(0.4).moveTo(left, top + headH).lineTo(left + width, top + headH).stroke();
  doc.lineWidth(0.6).moveTo(left, top + headH + rows.length * rowH).lineTo(left + width, top + headH + rows.length * rowH).stroke();
  doc.restore();
  let x = left;
  for (const [c, col] of columns.entries()) {
    const ax = anchor(x, col);
    label(doc, col.title, ax, top + headH / 2, { size, font: FONT.semibold, align: col.align ?? 'left', valign: 'middle' });
    rows.forEach((row, i) => {
      label(doc, row[c] ?? '', ax, top + headH + i * rowH + rowH / 2, { size, align: col.align ?? 'left', valign: 'middle', colour: COLOUR.ink });
    });
    x += col.width;
  }
}

function anchor(x: number, col: Column): number {
  if (col.align === 'right') return x + col.width - PAD;
  if (col.align === 'center') return x + col.width / 2;
  return x + PAD;
}
