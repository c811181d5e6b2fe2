/**
 * A text file that is not text: a user drops an image, a PDF, a spreadsheet or a shot record where a
 * CSV or JSON file is wanted. Told in plain words what was dropped, by the file's first bytes (the
 * formats' published signatures; common practice, no source), instead of a parser's complaint about
 * an unexpected character.
 */

/** Control characters other than tab, newline and carriage return, and the replacement character of undecodable bytes. */
const NOT_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\ufffd]/;

/** Signatures as they read once the bytes are decoded as UTF-8 (undecodable bytes become U+FFFD). */
const KINDS: [RegExp, string][] = [
  [/^\ufffdPNG/, 'a PNG image'],
  [/^\ufffd\ufffd\ufffd/, 'an image or other binary file'],
  [/^%PDF-/, 'a PDF document'],
  [/^PK\u0003\u0004/, 'a ZIP archive (for example an .xlsx or .docx file)'],
  [/^GIF8[79]a/, 'a GIF image'],
  [/^(U:|:U)/, 'a SEG-2 shot record (upload it on the Records tab)'],
];

/**
 * What the text's first bytes show it to be when it is not text (null when it is text): "a PNG image",
 * "a PDF document", …, or "a binary file".
 */
export function notTextKind(text: string): string | null {
  const head = text.slice(0, 4096);
  if (!NOT_TEXT.test(head) && !/^(%PDF-|PK\u0003\u0004|GIF8[79]a)/.test(head)) return null;
  for (const [pattern, kind] of KINDS) if (pattern.test(head)) return kind;
  return 'a binary file';
}

/** "the file is a PNG image, not <what>" or null when it is text. */
export function notTextMessage(text: string, what: string): string | null {
  const kind = notTextKind(text);
  return kind ? `the file is ${kind}, not ${what}` : null;
}
