/**
 * Debian's poppler-utils, run as separate processes: text extraction, document facts, fonts,
 * images and page rendering. Tests look at the PDF the way a reader's tools do, not at our code.
 */
import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';

const run = (cmd: string, args: string[]): string => execFileSync(cmd, args, { encoding: 'utf8', timeout: 60_000, maxBuffer: 64 * 1024 * 1024 });

/** Text of every page (pdftotext -layout), split at form feeds. */
export function pageTexts(pdf: string): string[] {
  const pages = run('pdftotext', ['-layout', '-enc', 'UTF-8', pdf, '-']).split('\f');
  if (pages.at(-1)?.trim() === '') pages.pop();
  return pages;
}

/** Lines with runs of white space collapsed and true minus signs as hyphen-minus. */
export function normalisedLines(text: string): string[] {
  return text.split('\n').map((l) => l.replace(/\u2212/g, '-').replace(/[\s\u2009\u00a0]+/g, ' ').trim()).filter(Boolean);
}

export function pdfInfo(pdf: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const line of run('pdfinfo', [pdf]).split('\n')) {
    const m = /^([^:]+):\s*(.*)$/.exec(line);
    if (m) out[m[1].trim()] = m[2].trim();
  }
  return out;
}

/** pdffonts rows: name, type, embedded. */
export function pdfFonts(pdf: string): { name: string; type: string; embedded: boolean }[] {
  return run('pdffonts', [pdf])
    .split('\n')
    .slice(2)
    .filter((l) => l.trim())
    .map((l) => {
      const parts = l.trim().split(/\s+/);
      // name, type words…, encoding, emb, sub, uni, object, id
      const emb = parts[parts.length - 5];
      return { name: parts[0], type: parts.slice(1, parts.length - 6).join(' '), embedded: emb === 'yes' };
    });
}

/** pdfimages -list rows: page, width, height. */
export function pdfImages(pdf: string): { page: number; width: number; height: number; type: string }[] {
  return run('pdfimages', ['-list', pdf])
    .split('\n')
    .slice(2)
    .filter((l) => l.trim())
    .map((l) => {
      const p = l.trim().split(/\s+/);
      return { page: Number(p[0]), type: p[2], width: Number(p[3]), height: Number(p[4]) };
    });
}

/** Renders one page with pdftoppm; returns the written file's path. */
export function renderPage(pdf: string, page: number, outPrefix: string, format: 'png' | 'ppm', dpi = 60): string {
  // PPM is pdftoppm's default output; PNG needs its flag.
  run('pdftoppm', [...(format === 'png' ? ['-png'] : []), '-r', String(dpi), '-f', String(page), '-l', String(page), '-singlefile', pdf, outPrefix]);
  return `${outPrefix}.${format}`;
}

/** A binary PPM (P6, maxval 255) as width, height and RGB bytes. */
export function readPpm(path: string): { width: number; height: number; rgb: Uint8Array } {
  const buf = readFileSync(path);
  const header: string[] = [];
  let at = 0;
  while (header.length < 4) {
    while (/\s/.test(String.fromCharCode(buf[at]))) at++;
    let tok = '';
    while (!/\s/.test(String.fromCharCode(buf[at]))) tok += String.fromCharCode(buf[at++]);
    header.push(tok);
  }
  at++; // the single white-space byte after maxval
  if (header[0] !== 'P6' || header[3] !== '255') throw new Error(`not an 8-bit P6 PPM: ${header.join(' ')}`);
  const width = Number(header[1]);
  const height = Number(header[2]);
  return { width, height, rgb: new Uint8Array(buf.buffer, buf.byteOffset + at, width * height * 3) };
}

/** Every word pdftotext finds on one page, with its box in PDF points (origin top left). */
export function wordBoxes(pdf: string, page: number): { text: string; xMin: number; xMax: number; yMin: number; yMax: number }[] {
  const html = run('pdftotext', ['-bbox', '-enc', 'UTF-8', '-f', String(page), '-l', String(page), pdf, '-']);
  const decode = (s: string) => s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&amp;/g, '&');
  return [...html.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)].map((m) => ({
    xMin: Number(m[1]), yMin: Number(m[2]), xMax: Number(m[3]), yMax: Number(m[4]), text: decode(m[5]),
  }));
}

/** The images of one page as pdfimages writes them (PPM for the report's RGB images), in page order. */
export function extractImages(pdf: string, page: number, outPrefix: string): string[] {
  run('pdfimages', ['-f', String(page), '-l', String(page), pdf, outPrefix]);
  const dir = outPrefix.slice(0, outPrefix.lastIndexOf('/'));
  const base = outPrefix.slice(outPrefix.lastIndexOf('/') + 1);
  return readdirSync(dir).filter((f) => f.startsWith(`${base}-`) && f.endsWith('.ppm')).sort().map((f) => `${dir}/${f}`);
}
