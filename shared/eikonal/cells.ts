/**
 * Slowness of each grid cell, and which cells straddle a velocity contrast.
 *
 * Node velocities are point samples. Inside smooth ground the solver keeps the node's own
 * slowness (so the second-order stencil stays second order); a cell whose corner slownesses
 * differ by more than CONTRAST_RATIO holds an interface, and there the cell value below is
 * used instead, while an edge between two cells is travelled at the faster of the two (the
 * head-wave path along a refractor). The rule for contrast cells was chosen by measurement
 * (docs/engine.md, "Interfaces"); see InterfaceRule for the candidates.
 */
import type { Grid } from '../grid';
import { refineStaircase } from './staircase';

/**
 * How a contrast cell's slowness is taken from its active corners:
 * - 'node'    no cell treatment at all (classic node-sampled scheme, for comparison)
 * - 'mean'    arithmetic mean of corner slownesses (= harmonic mean of velocities)
 * - 'fastest' smallest corner slowness
 * - 'slowest' largest corner slowness
 * - 'upper'   mean slowness of the cell's upper row (matches a rasteriser that gives a node
 *             lying exactly on an interface to the layer below it)
 * - 'staircase' horizontal splits read as 'upper' on flat runs and interpolated along the stepped
 *             runs of a dipping interface (staircase.ts); other contrast cells (the corner
 *             cells of steps, steep interfaces) take the 'mean'
 */
export type InterfaceRule = 'node' | 'mean' | 'fastest' | 'slowest' | 'upper' | 'staircase';

export const DEFAULT_INTERFACE_RULE: InterfaceRule = 'staircase';
/** Corner slownesses differing by more than this ratio mark a contrast cell. */
export const CONTRAST_RATIO = 1.25;

export interface CellSlowness {
  /** (nx−1)·(nz−1) values, index cz·(nx−1)+cx; Infinity for cells with no ground corner. */
  value: Float64Array;
  /** 1 where the cell straddles a contrast (value follows the rule), else 0 (value = mean). */
  contrast: Uint8Array;
}

export function cellSlowness(
  grid: Grid,
  slowness: Float64Array,
  active: Uint8Array,
  rule: InterfaceRule = DEFAULT_INTERFACE_RULE,
  ratio: number = CONTRAST_RATIO,
  out?: CellSlowness,
): CellSlowness {
  const { nx, nz } = grid;
  const ncx = nx - 1;
  const count = ncx * (nz - 1);
  const value = out && out.value.length === count ? out.value : new Float64Array(count);
  const contrast = out && out.contrast.length === count ? out.contrast : new Uint8Array(count);
  fillCells(grid, slowness, active, rule, ratio, value, contrast);
  if (rule === 'staircase') refineStaircase(grid, slowness, active, value, contrast, ratio);
  return { value, contrast };
}

/** One pass over the cells (its own function so it is compiled whole, not on the fly per call). */
function fillCells(grid: Grid, slowness: Float64Array, active: Uint8Array, rule: InterfaceRule, ratio: number, value: Float64Array, contrast: Uint8Array): void {
  const { nx, nz } = grid;
  const ncx = nx - 1;
  for (let cz = 0; cz < nz - 1; cz++) {
    for (let cx = 0; cx < ncx; cx++) {
      const c = cz * ncx + cx;
      const i = cz * nx + cx;
      if (active[i] && active[i + 1] && active[i + nx] && active[i + nx + 1]) {
        // Common case, all four corners in the ground: unrolled.
        const a = slowness[i];
        const b = slowness[i + 1];
        const d = slowness[i + nx];
        const e = slowness[i + nx + 1];
        const lo = Math.min(a, b, d, e);
        const hi = Math.max(a, b, d, e);
        const mean = 0.25 * (a + b + d + e);
        if (rule === 'node' || hi <= lo * ratio) {
          value[c] = mean;
          contrast[c] = 0;
        } else {
          contrast[c] = 1;
          value[c] = rule === 'fastest' ? lo : rule === 'slowest' ? hi : rule === 'upper' ? 0.5 * (a + b) : mean;
        }
        continue;
      }
      let lo = Infinity;
      let hi = 0;
      let sum = 0;
      let cnt = 0;
      let upSum = 0;
      let upCnt = 0;
      for (let k = 0; k < 4; k++) {
        const j = i + (k & 1) + (k >> 1) * nx;
        if (!active[j]) continue;
        const sv = slowness[j];
        if (sv < lo) lo = sv;
        if (sv > hi) hi = sv;
        sum += sv;
        cnt++;
        if (k < 2) (upSum += sv), upCnt++;
      }
      if (cnt === 0) {
        value[c] = Infinity;
        contrast[c] = 0;
        continue;
      }
      const mean = sum / cnt;
      const isContrast = rule !== 'node' && hi > lo * ratio;
      contrast[c] = isContrast ? 1 : 0;
      if (!isContrast) value[c] = mean;
      else if (rule === 'fastest') value[c] = lo;
      else if (rule === 'slowest') value[c] = hi;
      else if (rule === 'upper') value[c] = upCnt > 0 ? upSum / upCnt : mean;
      else value[c] = mean;
    }
  }
}
