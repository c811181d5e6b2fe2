/** Number formatting for plain-words QC messages. */
import { sToMs } from '../units';

/** Metres with at least one decimal and no more than needed up to cm: 40 → "40.0", 40.25 → "40.25". */
export function metres(x: number): string {
  const s = x.toFixed(2);
  return s.endsWith('0') ? s.slice(0, -1) : s;
}

/** Velocity to the nearest m/s; "unbounded" rather than "Infinity". */
export const metresPerSecond = (v: number): string => (Number.isFinite(v) ? String(Math.round(v)) : 'unbounded');

/** Seconds shown as ms with two decimals. */
export const milliseconds = (t: number): string => sToMs(t).toFixed(2);
