/**
 * Numbers as the report prints them. A true minus sign (U+2212) for negatives, a fixed number of
 * decimals per quantity, and an em dash where a figure does not exist (no picks, never reached).
 */
export const NONE = '—';

export function fixed(v: number | null | undefined, decimals: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return NONE;
  const s = v.toFixed(decimals);
  // "-0.00" reads as a negative zero: print it as zero.
  if (/^-0(\.0+)?$/.test(s)) return s.slice(1);
  return s.startsWith('-') ? `\u2212${s.slice(1)}` : s;
}

/** Positions and plain values: as few decimals as they need, up to `max`. */
export function plain(v: number, max = 2): string {
  if (!Number.isFinite(v)) return NONE;
  const s = String(Number(v.toFixed(max)));
  return s.startsWith('-') ? `\u2212${s.slice(1)}` : s;
}

/** Whole numbers with a thin space between thousands (SI style): 53 126. */
export function count(n: number): string {
  return Math.round(n).toString().replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
}

export const ms = (v: number | null | undefined): string => fixed(v, 2);

/** Calendar date in ISO 8601 (unambiguous across countries), UTC. */
export const isoDate = (d: Date): string => d.toISOString().slice(0, 10);
