/** The residual CSV of `npm run solve -- --residuals` (FORMATS.md §3): ms at this edge, one row per pick. */
import { sToMs } from '../units';
import type { Residual } from './compute';

export const RESIDUAL_CSV_HEADER = 'shot_id,receiver_x,receiver_z,observed_ms,computed_ms,residual_ms';

// Positions to 1 µm and times to 0.1 µs: finer than any pick, and no binary-float tails like 5.800000000000001.
const metres = (v: number): string => String(+v.toFixed(6));
const ms = (s: number): string => String(+sToMs(s).toFixed(4));
const csvText = (s: string): string => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

export function residualCsvRow(r: Residual): string {
  return [csvText(r.shotId), metres(r.receiverX), metres(r.receiverZ), ms(r.observed), ms(r.computed), ms(r.residual)].join(',');
}

export function formatResidualCsv(residuals: readonly Residual[]): string {
  const lines = [RESIDUAL_CSV_HEADER];
  for (const r of residuals) lines.push(residualCsvRow(r));
  return `${lines.join('\n')}\n`;
}
