/**
 * Ramer–Douglas–Peucker simplification of a polyline (x,z pairs): keeps the points needed so that
 * no dropped point lies farther than `tolerance` from the kept line. Ramer (1972), "An iterative
 * procedure for the polygonal approximation of plane curves", Computer Graphics and Image
 * Processing 1; Douglas & Peucker (1973), The Canadian Cartographer 10(2).
 * Used to store rays compactly: a ray traced in small steps is mostly straight within a cell.
 */
export function simplifyPolyline(points: Float64Array | Float32Array, tolerance: number): Float32Array {
  const n = points.length / 2;
  if (n <= 2) return Float32Array.from(points);
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[n - 1] = 1;
  const stack: number[] = [0, n - 1];
  const tol2 = tolerance * tolerance;
  while (stack.length) {
    const last = stack.pop()!;
    const first = stack.pop()!;
    const ax = points[2 * first], az = points[2 * first + 1];
    const dx = points[2 * last] - ax, dz = points[2 * last + 1] - az;
    const len2 = dx * dx + dz * dz;
    let worst = -1;
    let worstD2 = tol2;
    for (let i = first + 1; i < last; i++) {
      const px = points[2 * i] - ax, pz = points[2 * i + 1] - az;
      // Squared distance to the segment (to the end point when the projection falls outside it).
      const t = len2 > 0 ? Math.min(1, Math.max(0, (px * dx + pz * dz) / len2)) : 0;
      const ex = px - t * dx, ez = pz - t * dz;
      const d2 = ex * ex + ez * ez;
      if (d2 > worstD2) {
        worstD2 = d2;
        worst = i;
      }
    }
    if (worst >= 0) {
      keep[worst] = 1;
      stack.push(first, worst, worst, last);
    }
  }
  let kept = 0;
  for (let i = 0; i < n; i++) kept += keep[i];
  const out = new Float32Array(2 * kept);
  for (let i = 0, j = 0; i < n; i++) {
    if (!keep[i]) continue;
    out[j++] = points[2 * i];
    out[j++] = points[2 * i + 1];
  }
  return out;
}
