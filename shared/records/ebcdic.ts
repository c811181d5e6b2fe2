/**
 * EBCDIC (code page 037, the one SEG-Y's textual header uses) ↔ text for the printable characters
 * a textual header holds: letters, digits, blank and common punctuation. Other bytes read as '?'.
 * Source: IBM code page 037 table (from memory; the tests check it against Python's cp037 codec).
 */
const PAIRS: [number, string][] = [
  [0x40, ' '], [0x4b, '.'], [0x4c, '<'], [0x4d, '('], [0x4e, '+'], [0x4f, '|'], [0x50, '&'], [0x5a, '!'],
  [0x5b, '$'], [0x5c, '*'], [0x5d, ')'], [0x5e, ';'], [0x60, '-'], [0x61, '/'], [0x6b, ','], [0x6c, '%'],
  [0x6d, '_'], [0x6e, '>'], [0x6f, '?'], [0x79, '`'], [0x7a, ':'], [0x7b, '#'], [0x7c, '@'], [0x7d, "'"],
  [0x7e, '='], [0x7f, '"'], [0xa1, '~'], [0xba, '['], [0xbb, ']'], [0xc0, '{'], [0xd0, '}'], [0xe0, '\\'], [0xb0, '^'],
];
const range = (from: number, text: string) => [...text].forEach((c, i) => PAIRS.push([from + i, c]));
range(0x81, 'abcdefghi');
range(0x91, 'jklmnopqr');
range(0xa2, 'stuvwxyz');
range(0xc1, 'ABCDEFGHI');
range(0xd1, 'JKLMNOPQR');
range(0xe2, 'STUVWXYZ');
range(0xf0, '0123456789');

const TO_TEXT: string[] = new Array(256).fill('?');
const TO_BYTE = new Map<string, number>();
for (const [b, c] of PAIRS) {
  TO_TEXT[b] = c;
  TO_BYTE.set(c, b);
}
TO_TEXT[0x00] = ' ';

export const ebcdicToText = (bytes: Uint8Array): string => Array.from(bytes, (b) => TO_TEXT[b]).join('');

/** Text → EBCDIC; characters without a code become '?'. */
export const textToEbcdic = (text: string): Uint8Array => Uint8Array.from(text, (c) => TO_BYTE.get(c) ?? 0x6f);

/**
 * EBCDIC or ASCII? In EBCDIC blanks are 0x40 and letters and digits lie above 0x80; in ASCII blanks
 * are 0x20 and digits and small letters lie below 0x80.
 */
export function isEbcdic(bytes: Uint8Array): boolean {
  let ebcdic = 0, ascii = 0;
  for (const b of bytes) {
    if (b >= 0x80 || b === 0x40) ebcdic++;
    else if (b === 0x20 || (b >= 0x30 && b <= 0x39) || (b >= 0x61 && b <= 0x7a)) ascii++;
  }
  return ebcdic > ascii;
}
