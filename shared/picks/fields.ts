/** Splitting one CSV line into fields, and strict decimal numbers. */

/** Fields of one line. Plain commas on the fast path; "quoted, fields" with "" escapes otherwise (no newlines inside quotes). */
export function splitCsvLine(line: string): string[] {
  if (!line.includes('"')) return line.split(',');
  const out: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') { field += '"'; i++; }
      else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') { out.push(field); field = ''; }
    else field += ch;
  }
  out.push(field);
  return out;
}

// Plain decimal or scientific notation; rejects hex, "Infinity", "1,5", blanks.
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The number in a trimmed field, or null when the text is not a finite decimal number. */
export function parseDecimal(text: string): number | null {
  if (!DECIMAL.test(text)) return null;
  const n = Number(text);
  return Number.isFinite(n) ? n : null;
}
