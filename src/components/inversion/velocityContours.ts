import type { Grid } from '../../../shared/grid';
import { niceStep } from '../run/section/contourLevels';
import { isolineSegments } from '../run/section/isolines';
import type { Wavefronts } from '../run/section/wavefronts';

/**
 * Iso-velocity contours of an inversion section. Levels are round numbers from the 1–2–5 series
 * (common practice for contour maps, no source), strictly inside the section's velocity range so
 * every level is drawn somewhere.
 */

/** Contour levels (m/s) for velocities between `min` and `max`, about `target` of them. */
export function isoVelocityLevels(min: number, max: number, target = 7): number[] {
  if (!(Number.isFinite(min) && Number.isFinite(max)) || !(max > min)) return [];
  const step = niceStep((max - min) / target);
  const levels: number[] = [];
  for (let v = Math.floor(min / step + 1) * step; v < max - 1e-9 * step; v += step) levels.push(Number(v.toPrecision(12)));
  return levels;
}

/**
 * Where to write a level's label: the segment midpoint nearest the vertical at `atX`; levels take
 * turns at a quarter, half and three quarters of the way along, so labels of nearby levels do not stack.
 */
export function contourLabelPoint(segments: readonly number[], atX: number): { x: number; z: number } | null {
  let best: { x: number; z: number } | null = null;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (let i = 0; i + 3 < segments.length; i += 4) {
    const mx = (segments[i]! + segments[i + 2]!) / 2;
    const d = Math.abs(mx - atX);
    if (d < bestDistance) {
      bestDistance = d;
      best = { x: mx, z: (segments[i + 1]! + segments[i + 3]!) / 2 };
    }
  }
  return best;
}

const LABEL_PLACES = [0.5, 0.25, 0.75];

/** Segments and labels of every level, in the same shape the run section draws wavefronts in. */
export function isoVelocityContours(values: ArrayLike<number>, grid: Grid, levels: readonly number[]): Wavefronts {
  const segments: number[] = [];
  const labels: Wavefronts['labels'] = [];
  const span = (grid.nx - 1) * grid.dx;
  levels.forEach((level, k) => {
    const seg = isolineSegments(values, grid, level);
    for (const v of seg) segments.push(v);
    const at = contourLabelPoint(seg, grid.x0 + LABEL_PLACES[k % LABEL_PLACES.length]! * span);
    if (at) labels.push({ ...at, text: String(level) });
  });
  return { segments, labels };
}
