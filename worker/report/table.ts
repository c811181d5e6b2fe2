/**
 * Plain tables: a semibold header between two rules, light banding, numbers right-aligned. Long
 * tables continue on the next page under a repeated header; narrow tables with many rows can be
 * laid out in side-by-side blocks to save paper.
 */
import type { PageFlow } from './context';
import { FONT } from './fonts';
import { label, textWidth } from './text';
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

export function drawTable(ctx: PageFlow, o: TableOptions): void {
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
    drawBlock(ctx.doc, CONTENT.left, ctx.y, o.columns, [], size, [], headH);
    ctx.y += headH + 10;
    return;
  }
  // A cell too long for its column wraps onto more lines; a row is as tall as its tallest cell,
  // and row j of every block shares one height so that side-by-side blocks stay aligned.
  const cells = o.rows.map((row) => o.columns.map((col, c) => wrapCell(ctx.doc, row[c] ?? '', col.width - 2 * PAD, size)));
  const heights = Array.from({ length: perBlock }, (_, j) => {
    let lines = 1;
    for (let b = 0; b < blocks; b++) for (const cell of cells[b * perBlock + j] ?? []) lines = Math.max(lines, cell.length);
    return rowH + (lines - 1) * size * LINE;
  });
  let start = 0;
  while (start < perBlock) {
    ctx.ensureSpace(headH + 3 * rowH);
    // Rows of each block that fit on this page (at least one).
    let take = 0;
    let used = headH + 2;
    while (start + take < perBlock && (take === 0 || used + heights[start + take] <= ctx.spaceLeft)) used += heights[start + take++];
    const hs = heights.slice(start, start + take);
    for (let b = 0; b < blocks; b++) {
      const left = CONTENT.left + b * (blockWidth + gap);
      const rows = cells.slice(b * perBlock + start, b * perBlock + start + take);
      if (rows.length === 0 && b > 0) continue;
      drawBlock(ctx.doc, left, ctx.y, o.columns, rows, size, hs, headH);
    }
    ctx.y += used - 2 + 10;
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

/** Line spacing of wrapped cell text, as a share of the font size. */
const LINE = 1.2;

/**
 * Splits a cell into lines no wider than `width`: at a space (dropped) or after a hyphen, underscore
 * or slash (kept) where it can, otherwise between any two characters (ids may have none of these).
 */
export function wrapCell(doc: PDFKit.PDFDocument, text: string, width: number, size: number): string[] {
  if (textWidth(doc, text, size) <= width) return [text];
  const lines: string[] = [];
  let line = '';
  for (const ch of text) {
    if (line && textWidth(doc, line + ch, size) > width) {
      const at = Math.max(line.lastIndexOf(' '), line.lastIndexOf('-'), line.lastIndexOf('_'), line.lastIndexOf('/'));
      if (ch === ' ') {
        lines.push(line);
        line = '';
      } else if (at > 0) {
        const keep = line[at] === ' ' ? at : at + 1;
        lines.push(line.slice(0, keep));
        line = line.slice(at + 1) + ch;
      } else {
        lines.push(line);
        line = ch;
      }
    } else line += ch;
  }
  if (line) lines.push(line);
  return lines;
}

function drawBlock(doc: PDFKit.PDFDocument, left: number, top: number, columns: Column[], rows: string[][][], size: number, heights: number[], headH: number): void {
  const width = columns.reduce((s, c) => s + c.width, 0);
  const tops = heights.map((_, i) => top + headH + heights.slice(0, i).reduce((a, h) => a + h, 0));
  const bottom = top + headH + heights.slice(0, rows.length).reduce((a, h) => a + h, 0);
  doc.save();
  rows.forEach((_, i) => {
    if (i % 2 === 1) doc.rect(left, tops[i], width, heights[i]).fill(COLOUR.faint);
  });
  doc.lineWidth(0.6).strokeColor(COLOUR.ink);
  doc.moveTo(left, top).lineTo(left + width, top).stroke();
  doc.lineWidth(0.4).moveTo(left, top + headH).lineTo(left + width, top + headH).stroke();
  doc.lineWidth(0.6).moveTo(left, bottom).lineTo(left + width, bottom).stroke();
  doc.restore();
  let x = left;
  for (const [c, col] of columns.entries()) {
    const ax = anchor(x, col);
    label(doc, col.title, ax, top + headH / 2, { size, font: FONT.semibold, align: col.align ?? 'left', valign: 'middle' });
    rows.forEach((row, i) => {
      const lines = row[c] ?? [''];
      // Lines centred as a group in the row, as a single line always was.
      const first = tops[i] + heights[i] / 2 - ((lines.length - 1) * size * LINE) / 2;
      lines.forEach((text, k) => label(doc, text, ax, first + k * size * LINE, { size, align: col.align ?? 'left', valign: 'middle', colour: COLOUR.ink }));
    });
    x += col.width;
  }
}
function anchor(x: number, col: Column): number {
  if (col.align === 'right') return x + col.width - PAD;
  if (col.align === 'center') return x + col.width / 2;
  return x + PAD;
}
