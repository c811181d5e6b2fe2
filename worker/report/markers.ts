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

/** A small filled (or hollow) circle, e.g. a pick. */
export function dot(doc: PDFKit.PDFDocument, x: number, y: number, r: number, colour: string, hollow = false): void {
  doc.save();
  if (hollow) doc.lineWidth(0.6).strokeColor(colour).circle(x, y, r).stroke();
  else doc.fillColor(colour).circle(x, y, r).fill();
  doc.restore();
}
