import type { Grid } from '../../../../shared/grid';

/**
 * Geometry of the drawn section: margins, the plot rectangle, and the mapping from model
 * coordinates (x along the line, elevation z; m) to canvas pixels at a chosen vertical exaggeration.
 */
export interface SectionFrame {
  width: number;
  height: number;
  plot: { left: number; top: number; width: number; height: number };
  xMin: number;
  xMax: number;
  zMin: number;
  zMax: number;
  /** Pixels per metre along x; along z it is this times the exaggeration. */
  pxPerM: number;
  exaggeration: number;
  toPx(x: number, z: number): [number, number];
  toModel(px: number, py: number): { x: number; z: number };
}

export const SECTION_MARGIN = { left: 64, right: 96, top: 28, bottom: 52 };

/** Lay the grid's rectangle (node centres, half a cell of padding) out in `width` pixels. */
export function sectionFrame(grid: Grid, width: number, exaggeration: number, margin = SECTION_MARGIN): SectionFrame {
  const xMin = grid.x0 - grid.dx / 2;
  const xMax = grid.x0 + (grid.nx - 0.5) * grid.dx;
  const zMax = grid.z0 + grid.dz / 2;
  const zMin = grid.z0 - (grid.nz - 0.5) * grid.dz;
  const plotWidth = Math.max(100, width - margin.left - margin.right);
  const pxPerM = plotWidth / (xMax - xMin);
  const plotHeight = Math.max(40, (zMax - zMin) * pxPerM * exaggeration);
  const plot = { left: margin.left, top: margin.top, width: plotWidth, height: plotHeight };
  return {
    width: plot.left + plotWidth + margin.right,
    height: plot.top + plotHeight + margin.bottom,
    plot,
    xMin,
    xMax,
    zMin,
    zMax,
    pxPerM,
    exaggeration,
    toPx: (x, z) => [plot.left + (x - xMin) * pxPerM, plot.top + (zMax - z) * pxPerM * exaggeration],
    toModel: (px, py) => ({ x: xMin + (px - plot.left) / pxPerM, z: zMax - (py - plot.top) / (pxPerM * exaggeration) }),
  };
}

/** Round tick values inside [min, max], about `target` of them (1–2–5 steps; common practice, no source). */
export function niceTicks(min: number, max: number, target = 8): number[] {
  if (!(max > min)) return [];
  const step = nearestNiceStep((max - min) / target);
  const ticks: number[] = [];
  for (let v = Math.ceil(min / step - 1e-9) * step; v <= max + 1e-9 * step; v += step) ticks.push(Math.round(v / step) * step);
  return ticks.map((t) => Number(t.toPrecision(12)));
}

/** The 1–2–5 number nearest `rough` on a log scale (ticks aim at a count, so round either way). */
function nearestNiceStep(rough: number): number {
  if (!(rough > 0) || !Number.isFinite(rough)) return 1;
  const decade = 10 ** Math.floor(Math.log10(rough));
  const candidates = [1, 2, 5, 10].map((m) => m * decade);
  return candidates.reduce((best, c) => (Math.abs(Math.log(c / rough)) < Math.abs(Math.log(best / rough)) ? c : best));
}

/** Value of a grid at a model point, from the nearest node; NaN outside the grid or in air. */
export function sampleNearest(values: ArrayLike<number>, grid: Grid, x: number, z: number): number {
  const ix = Math.round((x - grid.x0) / grid.dx);
  const iz = Math.round((grid.z0 - z) / grid.dz);
  if (ix < 0 || iz < 0 || ix >= grid.nx || iz >= grid.nz) return Number.NaN;
  return values[iz * grid.nx + ix]!;
}
