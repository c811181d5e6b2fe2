/**
 * Wavefront contour levels for a travel-time field, in ms (the trade reads times in ms).
 * Intervals come from the 1–2–5 series so labels read as round numbers
 * (common practice for chart axes and contour maps, no source).
 */

export interface ContourLevels {
  start: number;
  end: number;
  size: number;
  count: number;
}

/** Intervals offered to the user (ms). */
export const CONTOUR_INTERVALS_MS = [0.5, 1, 2, 5, 10, 20, 50, 100] as const;

/** Fewest and most wavefronts worth drawing: fewer says nothing, more turns into a grey smear. */
export const MIN_CONTOURS = 3;
export const MAX_CONTOURS = 80;

/** The smallest 1–2–5 number ≥ `rough` (e.g. 3.2 → 5, 0.07 → 0.1). */
export function niceStep(rough: number): number {
  if (!(rough > 0) || !Number.isFinite(rough)) return 1;
  const decade = 10 ** Math.floor(Math.log10(rough));
  const scaled = rough / decade;
  const mantissa = scaled <= 1 + 1e-9 ? 1 : scaled <= 2 + 1e-9 ? 2 : scaled <= 5 + 1e-9 ? 5 : 10;
  return round12(mantissa * decade);
}

/** An interval that draws about `target` wavefronts between 0 and the field's latest time. */
export function defaultContourInterval(maxMs: number, target = 12): number {
  return niceStep(maxMs / target);
}

/**
 * Levels k·size strictly after the shot instant (t = 0) up to the latest time. Null when the
 * interval is unusable or would draw more than MAX_CONTOURS lines.
 */
export function contourLevels(maxMs: number, sizeMs: number): ContourLevels | null {
  if (!(sizeMs > 0) || !Number.isFinite(sizeMs) || !(maxMs > 0) || !Number.isFinite(maxMs)) return null;
  const count = Math.floor(maxMs / sizeMs + 1e-9);
  if (count < 1 || count > MAX_CONTOURS) return null;
  return { start: sizeMs, end: round12(count * sizeMs), size: sizeMs, count };
}

/** The offered intervals that give a readable number of wavefronts for this field. */
export function usableIntervals(maxMs: number): number[] {
  return CONTOUR_INTERVALS_MS.filter((s) => {
    const levels = contourLevels(maxMs, s);
    return levels !== null && levels.count >= MIN_CONTOURS;
  });
}

/** Largest finite value of a field (NaN marks air). */
export function finiteMax(values: ArrayLike<number>): number {
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v > max) max = v; // NaN compares false and is skipped
  }
  return max;
}

function round12(v: number): number {
  return Math.round(v * 1e12) / 1e12;
}
