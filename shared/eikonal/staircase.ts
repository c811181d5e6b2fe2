/**
 * Sub-cell depth of a gently dipping interface, read from the staircase its point samples make.
 *
 * A node grid samples a dipping refractor as runs of contrast cells along a row, each run one
 * row below the last. Within a run the interface crosses the band between two node rows: near
 * the step up it lies at the top of the band, near the step down at its bottom. Taking the cell's
 * slow fraction f linearly along the run (f = 0 all fast … 1 all slow), its slowness is
 * f·s_top + (1 − f)·s_bottom — unbiased for a straight dipping interface, where a fixed rule is
 * off by half a cell on average. A run with no step at an end keeps f = 1 there: the interface on
 * the lower node row, as the rasteriser places one lying exactly on a row (shared/model); a run
 * with no step at either end is a flat interface on that row (f = 1, the slowness of the top pair).
 * Common practice of sub-cell interface reconstruction in staircased grids; no single source.
 */
import type { Grid } from '../grid';

export function refineStaircase(grid: Grid, slowness: Float64Array, active: Uint8Array, value: Float64Array, contrast: Uint8Array, ratio: number): void {
  const { nx, nz } = grid;
  const ncx = nx - 1;
  const ncz = nz - 1;
  const alike = (a: number, b: number): boolean => (a > b ? a <= b * ratio : b <= a * ratio);
  const top = (cx: number, cz: number): number => 0.5 * (slowness[cz * nx + cx] + slowness[cz * nx + cx + 1]);
  const bottom = (cx: number, cz: number): number => 0.5 * (slowness[(cz + 1) * nx + cx] + slowness[(cz + 1) * nx + cx + 1]);
  /** Contrast cell whose split is horizontal: top pair alike, bottom pair alike, all in the ground. */
  const flat = (cx: number, cz: number): boolean => {
    if (cx < 0 || cx >= ncx || cz < 0 || cz >= ncz || !contrast[cz * ncx + cx]) return false;
    const i = cz * nx + cx;
    if (!active[i] || !active[i + 1] || !active[i + nx] || !active[i + nx + 1]) return false;
    return alike(slowness[i], slowness[i + 1]) && alike(slowness[i + nx], slowness[i + nx + 1]);
  };
  /** Same interface (same pair of media) in two flat contrast cells. */
  const same = (ax: number, az: number, bx: number, bz: number): boolean =>
    flat(bx, bz) && alike(top(ax, az), top(bx, bz)) && alike(bottom(ax, az), bottom(bx, bz));

  for (let cz = 0; cz < ncz; cz++) {
    let cx = 0;
    while (cx < ncx) {
      if (!flat(cx, cz)) {
        cx++;
        continue;
      }
      const a = cx;
      while (cx + 1 < ncx && same(a, cz, cx + 1, cz)) cx++;
      const b = cx;
      cx++;
      // Slow fraction at each end: 0 where the run continues one band up, 1 one band down or no step.
      // Between two runs sits one corner cell of the step (three corners alike), hence the ±2.
      const fL = same(a, cz, a - 2, cz - 1) || same(a, cz, a - 1, cz - 1) ? 0 : 1;
      const fR = same(b, cz, b + 2, cz - 1) || same(b, cz, b + 1, cz - 1) ? 0 : 1;
      // The interface crosses a band boundary inside the step's corner cell, so f runs from fL at the
      // centre of the corner cell before the run to fR at the centre of the one after it.
      const len = b - a + 1;
      for (let k = 0; k < len; k++) {
        const f = fL + ((fR - fL) * (k + 1)) / (len + 1);
        value[cz * ncx + a + k] = f * top(a + k, cz) + (1 - f) * bottom(a + k, cz);
      }
    }
  }
}
