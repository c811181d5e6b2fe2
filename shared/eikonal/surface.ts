/**
 * The ground surface's direction per grid column, read from the ground mask, for the march's
 * update of nodes next to the air (the march, kernel/march.as.ts): a wave that runs along the surface travels along
 * its tangent, so from a neighbour one step away along x it gains s·dx·cos θ, along z s·dz·|sin θ|
 * (θ the surface's dip), not the full s·dx of a stencil that only sees the grid's staircase.
 * The dip comes from least-squares lines through the top ground nodes of the column and its
 * three neighbours on either side (common practice, no source).
 */
import type { Grid } from '../grid';

export interface SurfaceTangents {
  /** Per column: cos θ and |sin θ| of the surface's dip. */
  cos: Float64Array;
  sin: Float64Array;
  /** Per column: elevation of the top ground node relative to the grid's top row (m); NaN for a column of air. */
  top: Float64Array;
}

const HALF_WIDTH = 3;

export function surfaceTangents(grid: Grid, active: Uint8Array): SurfaceTangents {
  const { nx, nz, dx, dz } = grid;
  const top = new Float64Array(nx).fill(Number.NaN);
  for (let ix = 0; ix < nx; ix++) {
    for (let iz = 0; iz < nz; iz++) {
      if (active[iz * nx + ix]) {
        top[ix] = -iz * dz; // elevation relative to the top row
        break;
      }
    }
  }
  const cos = new Float64Array(nx).fill(1);
  const sin = new Float64Array(nx);
  // One line through the column and the three on its left, one through it and the three on its
  // right; cos from the gentler, sin from the steeper, so that at a break in the surface (the
  // edge of a cutting) neither step's gain is taken smaller than either side allows.
  const slope = (from: number, to: number): number => {
    let n = 0, sx = 0, sz = 0, sxx = 0, sxz = 0;
    for (let k = Math.max(0, from); k <= Math.min(nx - 1, to); k++) {
      if (!Number.isFinite(top[k])) continue;
      const x = k * dx;
      n++;
      sx += x;
      sz += top[k];
      sxx += x * x;
      sxz += x * top[k];
    }
    const den = n * sxx - sx * sx;
    return n >= 2 && den > 0 ? (n * sxz - sx * sz) / den : Number.NaN;
  };
  for (let ix = 0; ix < nx; ix++) {
    const ms = [slope(ix - HALF_WIDTH, ix), slope(ix, ix + HALF_WIDTH)].filter(Number.isFinite).map(Math.abs);
    if (!ms.length) continue;
    const gentle = Math.min(...ms), steep = Math.max(...ms);
    cos[ix] = 1 / Math.sqrt(1 + gentle * gentle);
    sin[ix] = steep / Math.sqrt(1 + steep * steep);
  }
  return { cos, sin, top };
}

/**
 * Per column, the steepest rise (m per m of horizontal distance from the source) that a straight
 * line from the source can have there and still stay below the top ground nodes of every column
 * in between (a cell of slack: the true surface lies less than a cell above its top node): a node whose rise from the source is no
 * more than this sees the source through the ground. One sweep each way from the source.
 */
export function sourceHorizon(grid: Grid, top: Float64Array, source: { x: number; z: number }, out: Float64Array): Float64Array {
  const { nx, dx, x0, z0, dz } = grid;
  const zs = source.z - z0; // relative to the top row, like `top`
  const c0 = (source.x - x0) / dx;
  out.fill(Infinity);
  for (const dir of [1, -1]) {
    let limit = Infinity;
    const first = dir > 0 ? Math.floor(c0) + 1 : Math.ceil(c0) - 1;
    for (let c = first; c >= 0 && c < nx; c += dir) {
      out[c] = limit;
      const run = Math.abs(x0 + c * dx - source.x);
      if (run > 0 && Number.isFinite(top[c])) {
        const rise = (top[c] + dz - zs) / run;
        if (rise < limit) limit = rise;
      }
    }
  }
  return out;
}
