/** Colour bars as vector gradients, with round-number ticks and a title carrying the unit. */
import { hex, type Stops } from './colour';
import { fixed } from './format';
import { label, textWidth } from './text';
import { COLOUR, SIZE } from './style';
import { decimalsFor, niceTicks } from './ticks';

export interface BarSpec {
  stops: Stops;
  min: number;
  max: number;
  title: string;
  /** Explicit tick values (default: round numbers). */
  ticks?: number[];
}

function fillGradient(doc: PDFKit.PDFDocument, spec: BarSpec, x: number, y: number, w: number, h: number, vertical: boolean): void {
  const g = vertical ? doc.linearGradient(x, y + h, x, y) : doc.linearGradient(x, y, x + w, y);
  for (const [t, c] of spec.stops) g.stop(t, hex(c));
  doc.save().rect(x, y, w, h).fill(g).restore();
  doc.save().lineWidth(0.5).strokeColor(COLOUR.ink).rect(x, y, w, h).stroke().restore();
}

function tickValues(spec: BarSpec, target: number): { values: number[]; dp: number } {
  if (spec.ticks) return { values: spec.ticks, dp: Math.max(...spec.ticks.map((v) => decimalsFor(Math.abs(v) || 1))) };
  const t = niceTicks(spec.min, spec.max, target);
  return { values: t.values, dp: decimalsFor(t.step) };
}

/** Bar from (x, top) downwards, max at the top; labels and the rotated title to its right. */
export function verticalColourBar(doc: PDFKit.PDFDocument, spec: BarSpec, x: number, top: number, width: number, height: number): void {
  fillGradient(doc, spec, x, top, width, height, true);
  const { values, dp } = tickValues(spec, 5);
  let widest = 0;
  doc.save().lineWidth(0.5).strokeColor(COLOUR.ink);
  for (const v of values) {
    const y = top + height - ((v - spec.min) / (spec.max - spec.min)) * height;
    doc.moveTo(x + width, y).lineTo(x + width + 3, y).stroke();
    const text = fixed(v, dp);
    widest = Math.max(widest, textWidth(doc, text, SIZE.tick));
    label(doc, text, x + width + 5, y, { size: SIZE.tick, valign: 'middle' });
  }
  doc.restore();
  label(doc, spec.title, x + width + widest + 10, top + height / 2, { size: SIZE.small, align: 'center', valign: 'top', rotate: 90, colour: COLOUR.muted });
}

/** Bar from (x, top) to the right, min at the left; labels below, title under them. */
export function horizontalColourBar(doc: PDFKit.PDFDocument, spec: BarSpec, x: number, top: number, width: number, height: number): void {
  fillGradient(doc, spec, x, top, width, height, false);
  const { values, dp } = tickValues(spec, 6);
  doc.save().lineWidth(0.5).strokeColor(COLOUR.ink);
  for (const v of values) {
    const px = x + ((v - spec.min) / (spec.max - spec.min)) * width;
    doc.moveTo(px, top + height).lineTo(px, top + height + 3).stroke();
    label(doc, fixed(v, dp), px, top + height + 5, { size: SIZE.tick, align: 'center', valign: 'top' });
  }
  doc.restore();
  label(doc, spec.title, x + width / 2, top + height + 17, { size: SIZE.small, align: 'center', valign: 'top', colour: COLOUR.muted });
}
