/** Symbols used in every figure: a station (triangle pointing down to the ground), a shot (star). */
import { COLOUR } from './style';

/** Station: apex on the ground at (x, y). */
export function stationMark(doc: PDFKit.PDFDocument, x: number, y: number, size = 4, colour: string = COLOUR.ink): void {
  doc.save().fillColor(colour).polygon([x, y], [x - size / 2, y - size], [x + size / 2, y - size]).fill().restore();
}

/** Shot: a five-pointed star centred on (x, y). */
export function shotMark(doc: PDFKit.PDFDocument, x: number, y: number, r = 4.5, colour: string = COLOUR.shot): void {
  const points: [number, number][] = [];
  for (let k = 0; k < 10; k++) {
    const a = -Math.PI / 2 + (k * Math.PI) / 5;
    const rr = k % 2 === 0 ? r : r * 0.45;
    points.push([x + rr * Math.cos(a), y + rr * Math.sin(a)]);
  }
  doc.save().lineWidth(0.5).fillColor(colour).strokeColor('#ffffff').polygon(...points).fillAndStroke().restore();
}

/**
 * Borehole or trial pit: a dark column from the ground at (x, top) down to its deepest contact at
 * `bottom`, a tick at each contact (longer at the top of rock), drawn with a white edge so it reads on
 * any colour, its name above.
 */
export function holeMark(doc: PDFKit.PDFDocument, x: number, top: number, bottom: number, contacts: { y: number; rockTop: boolean }[]): void {
  doc.save().lineCap('butt');
  doc.lineWidth(3.2).strokeColor('#ffffff').moveTo(x, top).lineTo(x, Math.max(bottom, top + 2)).stroke();
  doc.lineWidth(1.8).strokeColor(COLOUR.ink).moveTo(x, top).lineTo(x, Math.max(bottom, top + 2)).stroke();
  for (const c of contacts) {
    const half = c.rockTop ? 5 : 3;
    doc.lineWidth(c.rockTop ? 1.4 : 0.8).strokeColor(COLOUR.ink).moveTo(x - half, c.y).lineTo(x + half, c.y).stroke();
  }
  doc.restore();
}

/** A small filled (or hollow) circle, e.g. a pick. */
export function dot(doc: PDFKit.PDFDocument, x: number, y: number, r: number, colour: string, hollow = false): void {
  doc.save();
  if (hollow) doc.lineWidth(0.6).strokeColor(colour).circle(x, y, r).stroke();
  else doc.fillColor(colour).circle(x, y, r).fill();
  doc.restore();
}
