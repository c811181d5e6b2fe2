/**
 * Source Sans 3, embedded from the `source-sans` npm package (OFL). The full TrueType files carry
 * every glyph the report needs (χ, ², ≥, −, ±) and Latin, Greek and Cyrillic; the web subsets of
 * other packages do not (STACK-NOTES trap 7). Chinese, Japanese and Korean characters come from the
 * fallback, Noto Sans SC (`@expo-google-fonts/noto-sans-sc`, OFL, TrueType). Files are read once per process.
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

/** The fallback face for each primary face (there is no CJK italic; upright is the custom). */
export const FALLBACK = {
  [FONT.regular]: 'NotoSansSC-Regular',
  [FONT.semibold]: 'NotoSansSC-SemiBold',
  [FONT.italic]: 'NotoSansSC-Regular',
} as const satisfies Record<FontName, string>;
export type FallbackName = (typeof FALLBACK)[FontName];

const FILES: Record<FontName | FallbackName, string> = {
  [FONT.regular]: 'source-sans/TTF/SourceSans3-Regular.ttf',
  [FONT.semibold]: 'source-sans/TTF/SourceSans3-Semibold.ttf',
  [FONT.italic]: 'source-sans/TTF/SourceSans3-It.ttf',
  'NotoSansSC-Regular': '@expo-google-fonts/noto-sans-sc/400Regular/NotoSansSC_400Regular.ttf',
  'NotoSansSC-SemiBold': '@expo-google-fonts/noto-sans-sc/600SemiBold/NotoSansSC_600SemiBold.ttf',
};

export const fontPath = (name: FontName | FallbackName): string => require.resolve(FILES[name]);

const cache = new Map<string, Buffer>();
export function fontData(name: FontName | FallbackName): Buffer {
  let data = cache.get(name);
  if (!data) {
    data = readFileSync(fontPath(name));
    cache.set(name, data);
  }
  return data;
}

export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const name of Object.keys(FILES) as (FontName | FallbackName)[]) doc.registerFont(name, fontData(name));
}
