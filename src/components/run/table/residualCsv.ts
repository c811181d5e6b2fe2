import type { ResidualRow } from '../../../api/types';

/**
 * Residual rows as CSV (RFC 4180: CRLF line ends; a field holding a comma, quote or line break
 * is quoted, with quotes doubled — Shafranovich, "Common Format and MIME Type for CSV Files", 2005).
 * Times stay in ms, as the pick file carries them.
 */

export const RESIDUAL_CSV_HEADER = [
  'shot_id',
  'receiver_x',
  'receiver_z',
  'observed_ms',
  'computed_ms',
  'residual_ms',
  'sigma_ms',
  'normalised',
  'excluded',
  'flags',
] as const;

function quote(field: string): string {
  return /[",\r\n]/.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
}

/**
 * Text that a spreadsheet would run as a formula (=, +, -, @ first) gets a leading apostrophe,
 * unless it is simply a number (OWASP, "CSV Injection", common practice).
 */
function textCell(text: string): string {
  const risky = /^[=+\-@\t\r]/.test(text) && !/^[+-]?\d+(\.\d+)?$/.test(text);
  return quote(risky ? `'${text}` : text);
}

/** Up to `digits` decimals, trailing zeros dropped; never "NaN" (an empty cell instead). */
export function numberCell(v: number, digits: number): string {
  if (!Number.isFinite(v)) return '';
  const fixed = v.toFixed(digits);
  const trimmed = fixed.includes('.') ? fixed.replace(/0+$/, '').replace(/\.$/, '') : fixed;
  return trimmed === '-0' ? '0' : trimmed;
}

export function residualsToCsv(rows: readonly ResidualRow[]): string {
  const lines = [RESIDUAL_CSV_HEADER.join(',')];
  for (const r of rows) {
    lines.push(
      [
        textCell(r.shotId),
        numberCell(r.receiverX, 3),
        numberCell(r.receiverZ, 3),
        numberCell(r.observedMs, 4),
        numberCell(r.computedMs, 4),
        numberCell(r.residualMs, 4),
        numberCell(r.sigmaMs, 4),
        numberCell(r.normalised, 4),
        r.excluded ? 'yes' : 'no',
        textCell(r.flags.join(';')),
      ].join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** A file name that says what it holds, e.g. "tq-l1-residuals-run-1a2b3c4d.csv". */
export function residualCsvName(lineName: string, runId: string): string {
  const slug = lineName.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'line';
  return `${slug}-residuals-run-${runId.slice(0, 8)}.csv`;
}
