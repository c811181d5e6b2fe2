/**
 * pdfkit draws a string in one font and has no per-glyph fallback, so text with characters the
 * primary face lacks (e.g. Chinese in a project name) is split into runs by whether the primary
 * face has each character's glyph; the runs without it use the fallback face.
 */
import * as fontkit from 'fontkit';
import { FALLBACK, fontData, type FallbackName, type FontName } from './fonts';

export interface GlyphRun {
  text: string;
  font: FontName | FallbackName;
}

const faces = new Map<FontName, fontkit.Font>();
function face(name: FontName): fontkit.Font {
  let f = faces.get(name);
  if (!f) {
    f = fontkit.create(fontData(name)) as fontkit.Font;
    faces.set(name, f);
  }
  return f;
}

/** Characters that never need a glyph of their own (spaces, line breaks) stay in the current run. */
const NEUTRAL = /[\s\u200b-\u200d]/u;

export function glyphRuns(text: string, primary: FontName): GlyphRun[] {
  const f = face(primary);
  const runs: GlyphRun[] = [];
  for (const ch of text) {
    const prev = runs.at(-1);
    const font = NEUTRAL.test(ch) && prev ? prev.font : f.hasGlyphForCodePoint(ch.codePointAt(0)!) ? primary : FALLBACK[primary];
    if (prev && prev.font === font) prev.text += ch;
    else runs.push({ text: ch, font });
  }
  return runs;
}

/** doc.text in `font` with the fallback face where needed; x and y omitted continue the current text. */
export function drawText(doc: PDFKit.PDFDocument, text: string, font: FontName, x: number | undefined, y: number | undefined, options: PDFKit.Mixins.TextOptions = {}): PDFKit.PDFDocument {
  const runs = glyphRuns(text, font);
  if (runs.length <= 1) {
    doc.font(font);
    return x === undefined ? doc.text(text, options) : doc.text(text, x, y, options);
  }
  runs.forEach((run, i) => {
    doc.font(run.font);
    const o = { ...options, continued: i < runs.length - 1 || options.continued === true };
    if (i === 0 && x !== undefined) doc.text(run.text, x, y, o);
    else doc.text(run.text, o);
  });
  return doc;
}

/** Width of a single line of `text` in `font` at the current size, fallback runs included. */
export function mixedWidth(doc: PDFKit.PDFDocument, text: string, font: FontName): number {
  let w = 0;
  for (const run of glyphRuns(text, font)) w += doc.font(run.font).widthOfString(run.text);
  doc.font(font);
  return w;
}
