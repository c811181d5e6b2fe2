/**
 * A plot frame on the page: a data rectangle, linear scales for x and y, ticks with labels and an
 * axis title with units on each side that asks for one. y may run up (elevation, time) or down
 * (depth).
 */
import { label, textWidth } from './text';
import { COLOUR, SIZE } from './style';
import { decimalsFor, niceTicks } from './ticks';
import { fixed } from './format';

export interface Box {
  left: number;
  top: number;
  width: number;
  height: number;
}

export interface Range {
  min: number;
  max: number;
}

export class Plot {
  constructor(
    readonly doc: PDFKit.PDFDocument,
    readonly box: Box,
    readonly x: Range,
    readonly y: Range,
    /** True when y grows downwards on the page (depth). */
    readonly yDown = false,
  ) {}

  px(x: number): number {
    return this.box.left + ((x - this.x.min) / (this.x.max - this.x.min)) * this.box.width;
  }

  py(y: number): number {
    const f = (y - this.y.min) / (this.y.max - this.y.min);
    return this.yDown ? this.box.top + f * this.box.height : this.box.top + (1 - f) * this.box.height;
  }

  get right(): number {
    return this.box.left + this.box.width;
  }

  get bottom(): number {
    return this.box.top + this.box.height;
  }

  /** Limits drawing to the data rectangle until the matching restore(). */
  clip(): void {
    this.doc.save();
    this.doc.rect(this.box.left, this.box.top, this.box.width, this.box.height).clip();
  }

  restore(): void {
    this.doc.restore();
  }

  /** A polyline of x, z pairs; NaN values break it into pieces. */
  polyline(points: ArrayLike<number>): void {
    let pen = false;
    for (let i = 0; i + 1 < points.length; i += 2) {
      const x = points[i];
      const y = points[i + 1];
      if (!Number.isFinite(x) || !Number.isFinite(y)) {
        pen = false;
        continue;
      }
      if (pen) this.doc.lineTo(this.px(x), this.py(y));
      else this.doc.moveTo(this.px(x), this.py(y));
      pen = true;
    }
  }

  frame(): void {
    this.doc.save().lineWidth(0.6).strokeColor(COLOUR.ink).rect(this.box.left, this.box.top, this.box.width, this.box.height).stroke().restore();
  }

  /** Ticks and labels along the bottom (or top) edge, with an axis title below. */
  xAxis(title: string | null, o: { target?: number; edge?: 'bottom' | 'top'; labels?: boolean } = {}): void {
    const { doc } = this;
    const edge = o.edge ?? 'bottom';
    const y = edge === 'bottom' ? this.bottom : this.box.top;
    const sign = edge === 'bottom' ? 1 : -1;
    const ticks = niceTicks(this.x.min, this.x.max, o.target ?? 8);
    const dp = decimalsFor(ticks.step);
    doc.save().lineWidth(0.5).strokeColor(COLOUR.ink);
    for (const v of ticks.values) {
      const x = this.px(v);
      doc.moveTo(x, y).lineTo(x, y + sign * 3).stroke();
      if (o.labels !== false) label(doc, fixed(v, dp), x, y + sign * 5, { size: SIZE.tick, align: 'center', valign: edge === 'bottom' ? 'top' : 'baseline' });
    }
    doc.restore();
    if (title) label(doc, title, this.box.left + this.box.width / 2, y + sign * 20, { size: SIZE.small, align: 'center', valign: edge === 'bottom' ? 'top' : 'baseline', colour: COLOUR.muted });
  }

  /** Ticks and labels along the left (or right) edge, with a rotated axis title beside them. */
  yAxis(title: string | null, o: { target?: number; edge?: 'left' | 'right' } = {}): void {
    const { doc } = this;
    const edge = o.edge ?? 'left';
    const x = edge === 'left' ? this.box.left : this.right;
    const sign = edge === 'left' ? -1 : 1;
    const ticks = niceTicks(this.y.min, this.y.max, o.target ?? 5);
    const dp = decimalsFor(ticks.step);
    let widest = 0;
    doc.save().lineWidth(0.5).strokeColor(COLOUR.ink);
    for (const v of ticks.values) {
      const y = this.py(v);
      doc.moveTo(x, y).lineTo(x + sign * 3, y).stroke();
      const text = fixed(v, dp);
      widest = Math.max(widest, textWidth(doc, text, SIZE.tick));
      label(doc, text, x + sign * 5, y, { size: SIZE.tick, align: edge === 'left' ? 'right' : 'left', valign: 'middle' });
    }
    doc.restore();
    if (title) {
      const tx = x + sign * (widest + 9);
      label(doc, title, tx, this.box.top + this.box.height / 2, { size: SIZE.small, align: 'center', valign: edge === 'left' ? 'baseline' : 'top', rotate: 90, colour: COLOUR.muted });
    }
  }
}
