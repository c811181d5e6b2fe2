/**
 * Piecewise-linear polyline z(x) through points [x, z] with x strictly increasing
 * (checked by shared/model/rules.ts). Outside the first/last point the end value is held;
 * validated files always cover the grid, so that only matters for callers probing beyond it.
 */
export type Polyline = readonly (readonly [number, number])[];

export function evalPolyline(points: Polyline, x: number): number {
  const n = points.length;
  if (x <= points[0][0]) return points[0][1];
  if (x >= points[n - 1][0]) return points[n - 1][1];
  // Binary search for the segment [i, i+1] holding x.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid][0] <= x) lo = mid;
    else hi = mid;
  }
  const [xa, za] = points[lo];
  const [xb, zb] = points[hi];
  return za + ((zb - za) * (x - xa)) / (xb - xa);
}
