import type { Grid } from '../../../../shared/grid';
import { msToS } from '../../../../shared/units';
import type { ContourLevels } from './contourLevels';
import { isolineSegments, labelPoint } from './isolines';

export interface Wavefronts {
  /** Segments of every level, flat [x1, z1, x2, z2, …] (m). */
  segments: number[];
  /** One label per level (ms), placed on a diagonal away from the shot. */
  labels: { x: number; z: number; text: string }[];
}

/** The shot's first-arrival wavefronts (field in s, levels in ms) with their label positions. */
export function wavefronts(field: { grid: Grid; values: ArrayLike<number> }, source: { x: number; z: number } | null, levels: ContourLevels): Wavefronts {
  const { grid } = field;
  const left = grid.x0;
  const right = grid.x0 + (grid.nx - 1) * grid.dx;
  const from = source ?? { x: left, z: grid.z0 };
  // Labels run towards the far end of the line from the shot, where there is room for them.
  const towardsX = from.x - left < right - from.x ? right : left;
  const segments: number[] = [];
  const labels: Wavefronts['labels'] = [];
  for (let k = 0; k < levels.count; k++) {
    const levelMs = Math.round((levels.start + k * levels.size) * 1e9) / 1e9;
    const seg = isolineSegments(field.values, grid, msToS(levelMs));
    for (const v of seg) segments.push(v);
    const at = labelPoint(seg, from, towardsX);
    if (at) labels.push({ ...at, text: String(levelMs) });
  }
  return { segments, labels };
}
