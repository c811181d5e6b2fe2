import type { Grid } from '../../../../shared/grid';

/**
 * Isolines of a gridded field by marching squares: each grid cell whose corners straddle the level
 * gets one segment (two at a saddle, split by the cell's mean value), with end points placed by linear
 * interpolation along the cell edges (Lorensen & Cline, "Marching cubes", SIGGRAPH 1987, reduced to 2-D).
 * Cells with an air corner (NaN) are skipped, so lines stop at the ground surface.
 */

/** Segments as a flat list [x1, z1, x2, z2, …] in model coordinates (m). */
export function isolineSegments(values: ArrayLike<number>, grid: Grid, level: number): number[] {
  const { nx, nz, x0, dx, z0, dz } = grid;
  const out: number[] = [];
  // Corners of the cell (ix, iz): a top-left, b top-right, c bottom-right, d bottom-left (z falls as iz grows).
  for (let iz = 0; iz + 1 < nz; iz++) {
    for (let ix = 0; ix + 1 < nx; ix++) {
      const a = values[iz * nx + ix]!;
      const b = values[iz * nx + ix + 1]!;
      const c = values[(iz + 1) * nx + ix + 1]!;
      const d = values[(iz + 1) * nx + ix]!;
      if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d))) continue;
      const index = (a >= level ? 8 : 0) | (b >= level ? 4 : 0) | (c >= level ? 2 : 0) | (d >= level ? 1 : 0);
      if (index === 0 || index === 15) continue;
      const xl = x0 + ix * dx;
      const zt = z0 - iz * dz;
      const frac = (p: number, q: number) => (q === p ? 0.5 : (level - p) / (q - p));
      // Crossing points on the four edges (computed lazily by edge name).
      const edge = (e: 'top' | 'right' | 'bottom' | 'left'): [number, number] => {
        if (e === 'top') return [xl + frac(a, b) * dx, zt];
        if (e === 'bottom') return [xl + frac(d, c) * dx, zt - dz];
        if (e === 'left') return [xl, zt - frac(a, d) * dz];
        return [xl + dx, zt - frac(b, c) * dz];
      };
      const seg = (e1: Parameters<typeof edge>[0], e2: Parameters<typeof edge>[0]) => {
        const p = edge(e1);
        const q = edge(e2);
        out.push(p[0], p[1], q[0], q[1]);
      };
      const centreAbove = (a + b + c + d) / 4 >= level;
      switch (index) {
        case 1: case 14: seg('left', 'bottom'); break;
        case 2: case 13: seg('bottom', 'right'); break;
        case 3: case 12: seg('left', 'right'); break;
        case 4: case 11: seg('top', 'right'); break;
        case 6: case 9: seg('top', 'bottom'); break;
        case 7: case 8: seg('top', 'left'); break;
        case 5: // b and d above
          if (centreAbove) { seg('top', 'left'); seg('bottom', 'right'); } else { seg('top', 'right'); seg('left', 'bottom'); }
          break;
        case 10: // a and c above
          if (centreAbove) { seg('top', 'right'); seg('left', 'bottom'); } else { seg('top', 'left'); seg('bottom', 'right'); }
          break;
      }
    }
  }
  return out;
}

/**
 * Where to write a level's label: the segment midpoint closest to a line leaving `from` downwards at
 * `angleDeg` below horizontal towards `towardsX`, so the labels of successive wavefronts form a tidy
 * diagonal away from the shot. Null when the level has no segment.
 */
export function labelPoint(segments: readonly number[], from: { x: number; z: number }, towardsX: number, angleDeg = 30): { x: number; z: number } | null {
  const sign = towardsX >= from.x ? 1 : -1;
  const ux = sign * Math.cos((angleDeg * Math.PI) / 180);
  const uz = -Math.sin((angleDeg * Math.PI) / 180);
  let best: { x: number; z: number } | null = null;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (let i = 0; i + 3 < segments.length; i += 4) {
    const mx = (segments[i]! + segments[i + 2]!) / 2;
    const mz = (segments[i + 1]! + segments[i + 3]!) / 2;
    const along = (mx - from.x) * ux + (mz - from.z) * uz;
    if (along <= 0) continue;
    const across = Math.abs((mx - from.x) * uz - (mz - from.z) * ux);
    if (across < bestDistance) {
      bestDistance = across;
      best = { x: mx, z: mz };
    }
  }
  // The line left the ground before meeting this level: any point of it will do.
  if (!best && segments.length >= 4) {
    const i = 4 * Math.floor(segments.length / 8);
    best = { x: (segments[i]! + segments[i + 2]!) / 2, z: (segments[i + 1]! + segments[i + 3]!) / 2 };
  }
  return best;
}
