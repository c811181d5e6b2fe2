/**
 * Small pieces of the PDF renderer checked against published values.
 * - CRC-32 check value: crc32("123456789") = 0xCBF43926 (the standard check value of the
 *   ISO 3309 / ITU-T V.42 CRC used by PNG; W3C PNG Specification 2nd ed. 2003, Annex D, and
 *   Williams (1993), "A painless guide to CRC error detection algorithms" — from memory).
 * - PNG layout: signature 89 50 4E 47 0D 0A 1A 0A, IHDR first with width, height, bit depth 8,
 *   colour type 2 (W3C PNG Specification 2003, §5.2 and §11.2.2); the image data inflates to
 *   one filter byte plus 3 bytes per pixel per row.
 * - Axis ticks on the 1–2–2.5–5 series (common practice for chart axes, no source).
 */
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { crc32, encodeRgbPng } from '../../../worker/report/png';
import { decimalsFor, niceStep, niceTicks } from '../../../worker/report/ticks';
import { fixed, plain } from '../../../worker/report/format';

describe('PNG encoder', () => {
  it('CRC-32 gives the published check value', () => {
    expect(crc32(Buffer.from('123456789', 'ascii'))).toBe(0xcbf43926);
  });

  it('writes signature, IHDR and image data a decoder can read back', () => {
    const w = 3;
    const h = 2;
    const rgb = Uint8Array.from({ length: w * h * 3 }, (_, i) => (i * 37) % 256);
    const png = encodeRgbPng(w, h, rgb);
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.toString('ascii', 12, 16)).toBe('IHDR');
    expect(png.readUInt32BE(16)).toBe(w);
    expect(png.readUInt32BE(20)).toBe(h);
    expect(png[24]).toBe(8);
    expect(png[25]).toBe(2);
    // Every chunk's CRC covers its type and data.
    let at = 8;
    const chunks: string[] = [];
    let idat = Buffer.alloc(0);
    while (at < png.length) {
      const len = png.readUInt32BE(at);
      const type = png.toString('ascii', at + 4, at + 8);
      chunks.push(type);
      expect(png.readUInt32BE(at + 8 + len)).toBe(crc32(png.subarray(at + 4, at + 8 + len)));
      if (type === 'IDAT') idat = Buffer.concat([idat, png.subarray(at + 8, at + 8 + len)]);
      at += 12 + len;
    }
    expect(chunks).toEqual(['IHDR', 'IDAT', 'IEND']);
    const raw = inflateSync(idat);
    expect(raw.length).toBe(h * (1 + 3 * w));
    for (let y = 0; y < h; y++) {
      expect(raw[y * (1 + 3 * w)]).toBe(0);
      expect([...raw.subarray(y * (1 + 3 * w) + 1, (y + 1) * (1 + 3 * w))]).toEqual([...rgb.subarray(y * 3 * w, (y + 1) * 3 * w)]);
    }
  });

  it('refuses sizes that do not match the data', () => {
    expect(() => encodeRgbPng(2, 2, new Uint8Array(11))).toThrow(/12 bytes/);
    expect(() => encodeRgbPng(0, 2, new Uint8Array(0))).toThrow(/size/);
  });
});

describe('ticks and number formats', () => {
  it('round steps from the 1–2–2.5–5 series', () => {
    expect([0.07, 0.3, 1, 1.2, 2.2, 3.1, 7, 12, 430].map(niceStep)).toEqual([0.1, 0.5, 1, 2, 2.5, 5, 10, 20, 500]);
  });

  it('ticks cover the range on multiples of the step', () => {
    expect(niceTicks(-20, 137.5, 8)).toEqual({ step: 20, values: [-20, 0, 20, 40, 60, 80, 100, 120] });
    expect(niceTicks(49.7, 51.6, 5).values).toEqual([50, 50.5, 51, 51.5]);
    expect(decimalsFor(0.25)).toBe(2);
    expect(decimalsFor(20)).toBe(0);
  });

  it('prints a true minus, no negative zero, and a dash for missing values', () => {
    expect(fixed(-1.234, 2)).toBe('\u22121.23');
    expect(fixed(-0.001, 2)).toBe('0.00');
    expect(fixed(null, 2)).toBe('—');
    expect(fixed(Number.NaN, 1)).toBe('—');
    expect(plain(2.5)).toBe('2.5');
    expect(plain(-20)).toBe('\u221220');
  });
});
