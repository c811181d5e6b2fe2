/**
 * Wavefront contours: the travel-time field's level lines by marching squares on the node grid
 * (Lorensen & Cline 1987, "Marching cubes: a high resolution 3D surface construction algorithm",
 * SIGGRAPH '87, in its two-dimensional form). Within a cell each crossing is placed by linear
 * interpolation along the cell edge; the two saddle cases are decided by the mean of the four
 * corners. Cells with an air or unreached corner (non-finite time) draw nothing.
 *
 * Output per level: a Float32Array of segments x1, z1, x2, z2 (m) in model coordinates.
 */
import type { Grid } from '../../shared/grid';

export function isolines(grid: Grid, times: Float64Array, levels: readonly number[]): Float32Array[] {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const out: number[][] = levels.map(() => []);
  const sorted = levels.map((v, i) => ({ v, i })).sort((a, b) => a.v - b.v);
  const ex = [0, 0, 0, 0];
  const ez = [0, 0, 0, 0];
  for (let cz = 0; cz < nz - 1; cz++) {
    for (let cx = 0; cx < nx - 1; cx++) {
      const i = cz * nx + cx;
      const a = times[i]; // top left
      const b = times[i + 1]; // top right
      const c = times[i + nx + 1]; // bottom right
      const d = times[i + nx]; // bottom left
      if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d))) continue;
      const lo = Math.min(a, b, c, d);
      const hi = Math.max(a, b, c, d);
      for (const { v: L, i: li } of sorted) {
        if (L < lo) continue;
        if (L > hi) break;
        const code = (a >= L ? 8 : 0) | (b >= L ? 4 : 0) | (c >= L ? 2 : 0) | (d >= L ? 1 : 0);
        if (code === 0 || code === 15) continue;
        // Crossing points on the four edges in fractional cell coordinates: 0 top, 1 right, 2 bottom, 3 left.
        ex[0] = frac(a, b, L); ez[0] = 0;
        ex[1] = 1; ez[1] = frac(b, c, L);
        ex[2] = frac(d, c, L); ez[2] = 1;
        ex[3] = 0; ez[3] = frac(a, d, L);
        const seg = out[li];
        const add = (e1: number, e2: number): void => {
          seg.push(x0 + (cx + ex[e1]) * dx, z0 - (cz + ez[e1]) * dz, x0 + (cx + ex[e2]) * dx, z0 - (cz + ez[e2]) * dz);
        };
        switch (code) {
          case 1: case 14: add(3, 2); break;
          case 2: case 13: add(2, 1); break;
          case 3: case 12: add(3, 1); break;
          case 4: case 11: add(0, 1); break;
          case 6: case 9: add(0, 2); break;
          case 7: case 8: add(3, 0); break;
          case 5: // b and d above
          case 10: { // a and c above
            const centreAbove = (a + b + c + d) / 4 >= L;
            const isolateAC = (code === 5) === centreAbove;
            if (isolateAC) { add(3, 0); add(1, 2); } else { add(0, 1); add(2, 3); }
            break;
          }
        }
      }
    }
  }
  return out.map((s) => Float32Array.from(s));
}

/** Where the level L falls between corner values p and q, as a fraction from p. */
function frac(p: number, q: number, L: number): number {
  const t = p === q ? 0.5 : (L - p) / (q - p);
  return t < 0 ? 0 : t > 1 ? 1 : t;
}

/** A "nice" contour interval in ms (1, 2, 2.5 or 5 × 10^k) giving about `count` wavefronts up to tMax, and the levels in seconds. */
export function contourLevels(tMaxSeconds: number, count = 12): { stepMs: number; levels: number[] } {
  const tMaxMs = tMaxSeconds * 1000;
  if (!(tMaxMs > 0) || !Number.isFinite(tMaxMs)) return { stepMs: 0, levels: [] };
  const rough = tMaxMs / count;
  const mag = 10 ** Math.floor(Math.log10(rough));
  const stepMs = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= rough) ?? 10 * mag;
  const levels: number[] = [];
  for (let k = 1; k * stepMs < tMaxMs && levels.length < 200; k++) levels.push((k * stepMs) / 1000);
  return { stepMs, levels };
}
