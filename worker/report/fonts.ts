/**
 * Source Sans 3, embedded from the `source-sans` npm package (OFL). The full TrueType files carry
 * every glyph the report needs (χ, ², ≥, −, ±); the web subsets of other packages do not
 * (STACK-NOTES trap 7). Files are read once per process.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

export const FONT = {
  regular: 'SourceSans3-Regular',
  semibold: 'SourceSans3-Semibold',
  italic: 'SourceSans3-It',
} as const;
export type FontName = (typeof FONT)[keyof typeof FONT];

export const fontPath = (name: FontName): string => require.resolve(`source-sans/TTF/${name}.ttf`);

const cache = new Map<FontName, Buffer>();
export function fontData(name: FontName): Buffer {
  let data = cache.get(name);
  if (!data) {
    data = readFileSync(fontPath(name));
    cache.set(name, data);
  }
  return data;
}

export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const name of Object.values(FONT)) doc.registerFont(name, fontData(name));
}
