/**
 * Where things go on the section canvas: model metres ↔ CSS pixels. x grows to the right along
 * the line; z is elevation, up. The vertical exaggeration VE scales metres of z against metres
 * of x (VE 2: a metre of depth is drawn twice as tall as a metre along the line).
 */
import type { Grid } from '../../../shared/grid';

export interface SectionLayout {
  width: number;
  height: number;
  plot: { left: number; top: number; width: number; height: number };
  xMin: number;
  xMax: number;
  zMin: number;
  zMax: number;
  /** px per m along x and along z */
  sx: number;
  sz: number;
  /** The exaggeration actually drawn (the requested one unless the height limit stepped in). */
  exaggeration: number;
}

export const MARGIN = { left: 64, right: 18, top: 14, bottom: 50 };
const MIN_PLOT_HEIGHT = 140;
const MAX_PLOT_HEIGHT = 720;

export const EXAGGERATIONS = [1, 2, 3, 5, 10, 20] as const;

export function layoutSection(grid: Grid, width: number, exaggeration: number): SectionLayout {
  const xMin = grid.x0;
  const xMax = grid.x0 + (grid.nx - 1) * grid.dx;
  const zMax = grid.z0;
  const zMin = grid.z0 - (grid.nz - 1) * grid.dz;
  const plotWidth = Math.max(100, width - MARGIN.left - MARGIN.right);
  const sx = plotWidth / (xMax - xMin);
  const wanted = (zMax - zMin) * sx * exaggeration;
  const plotHeight = Math.min(MAX_PLOT_HEIGHT, Math.max(MIN_PLOT_HEIGHT, wanted));
  const sz = plotHeight / (zMax - zMin);
  return {
    width: plotWidth + MARGIN.left + MARGIN.right,
    height: plotHeight + MARGIN.top + MARGIN.bottom,
    plot: { left: MARGIN.left, top: MARGIN.top, width: plotWidth, height: plotHeight },
    xMin, xMax, zMin, zMax, sx, sz,
    exaggeration: sz / sx,
  };
}

/** The listed exaggeration that draws the section closest to 0.4 × as tall as it is wide. */
export function defaultExaggeration(grid: Grid): number {
  const xRange = (grid.nx - 1) * grid.dx;
  const zRange = (grid.nz - 1) * grid.dz;
  const wanted = (0.4 * xRange) / zRange;
  return EXAGGERATIONS.reduce((best, e) => (Math.abs(Math.log(e / wanted)) < Math.abs(Math.log(best / wanted)) ? e : best), 1);
}

export const xToPx = (L: SectionLayout, x: number): number => L.plot.left + (x - L.xMin) * L.sx;
export const zToPx = (L: SectionLayout, z: number): number => L.plot.top + (L.zMax - z) * L.sz;
export const pxToX = (L: SectionLayout, px: number): number => L.xMin + (px - L.plot.left) / L.sx;
export const pxToZ = (L: SectionLayout, py: number): number => L.zMax - (py - L.plot.top) / L.sz;

export const insidePlot = (L: SectionLayout, px: number, py: number): boolean =>
  px >= L.plot.left && px <= L.plot.left + L.plot.width && py >= L.plot.top && py <= L.plot.top + L.plot.height;

/** "Nice" tick values (1, 2, 5 × 10^k apart) covering [lo, hi] with about `count` ticks. */
export function niceTicks(lo: number, hi: number, count: number): number[] {
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return [];
  const rough = (hi - lo) / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= rough) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + 1e-9 * step; v += step) out.push(+v.toFixed(10));
  return out;
}

/** Distance (px) from point p to the segment a–b. */
export function distanceToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const vx = bx - ax;
  const vy = by - ay;
  const len2 = vx * vx + vy * vy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * vx + (py - ay) * vy) / len2)) : 0;
  return Math.hypot(px - (ax + t * vx), py - (ay + t * vy));
}
