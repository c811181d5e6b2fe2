import type { RunStatus, SolverOrder } from '../../api/types';

/** Wording for run states and figures, shared by every run view. */

export const RUN_STATUS_LABELS: Record<RunStatus, string> = {
  queued: 'Waiting to start',
  running: 'Solving',
  done: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

export const ORDER_LABELS: Record<SolverOrder, string> = {
  1: 'first order',
  2: 'second order',
};

/** "0.51 ms"; a dash for anything that is not a number (never "NaN"). */
export function ms(v: number | null | undefined, digits = 2): string {
  return typeof v === 'number' && Number.isFinite(v) ? `${v.toFixed(digits)} ms` : '–';
}

/** "+0.31" / "−0.31" with a true minus sign, for residuals. */
export function signed(v: number | null | undefined, digits = 2): string {
  if (typeof v !== 'number' || !Number.isFinite(v)) return '–';
  const text = Math.abs(v).toFixed(digits);
  if (Number(text) === 0) return text;
  return `${v < 0 ? '−' : '+'}${text}`;
}

export function num(v: number | null | undefined, digits = 2): string {
  return typeof v === 'number' && Number.isFinite(v) ? v.toFixed(digits) : '–';
}

/** Chainage in m, as short as it can be: "12.5 m". */
export function metres(v: number): string {
  return `${Number(v.toFixed(2))} m`;
}

const timeFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

export function when(iso: string | null | undefined): string {
  if (!iso) return '–';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : timeFormat.format(d);
}

/** "4.2 s" between two instants, or null when either is missing. */
export function duration(fromIso: string | null | undefined, toIso: string | null | undefined): string | null {
  if (!fromIso || !toIso) return null;
  const s = (new Date(toIso).getTime() - new Date(fromIso).getTime()) / 1000;
  return Number.isFinite(s) && s >= 0 ? `${s < 10 ? s.toFixed(1) : Math.round(s)} s` : null;
}
