/**
 * The grid and ground surface of an inversion from the automatic gradient start: the line's
 * default model grid (shared/model/edit/defaults.ts, defaultGridSpec: stations and shots with a
 * margin, a quarter spread deep) on a finer spacing. Default spacing: half the median station
 * spacing, taken down to the next of the editor's round spacings, and coarsened until the grid has
 * at most MAX_DEFAULT_NX nodes along the line (two nodes per geophone interval resolve what the
 * spread samples; common practice, no source). The API and the pages call the same function, so the
 * page shows the grid the worker will use.
 */
import type { Grid } from '../grid';
import { defaultGridSpec, NICE_SPACINGS, stationSurface, type LineGeometry } from '../model/edit/defaults';
import { gridFromSpec } from '../model/edit/grid-spec';
import { fitPolylineToRange, type Point } from '../model/edit/polyline-edit';

/** The default spacing keeps the grid at most this many nodes along the line. */
export const MAX_DEFAULT_NX = 600;

export interface LineGrid {
  grid: Grid;
  /** Ground surface over the whole grid, from the stations (flat when there are fewer than two). */
  surface: Point[];
  spacing: number;
}

/** Median gap between neighbouring stations (m), or null with fewer than two distinct positions. */
export function medianStationSpacing(stations: LineGeometry['stations']): number | null {
  const xs = stationSurface(stations).map((p) => p[0]);
  if (xs.length < 2) return null;
  const gaps = xs.slice(1).map((x, i) => x - xs[i]).sort((a, b) => a - b);
  const mid = gaps.length >> 1;
  return gaps.length % 2 ? gaps[mid] : (gaps[mid - 1] + gaps[mid]) / 2;
}

const ceilTo = (v: number, step: number): number => Math.ceil(v / step - 1e-9) * step;
const floorTo = (v: number, step: number): number => Math.floor(v / step + 1e-9) * step;
const tidy = (v: number): number => +v.toFixed(6);

/** The grid for a line at `spacing` (dx = dz, m), or at the default spacing when it is absent. */
export function gridForLine(geom: LineGeometry, spacing?: number): LineGrid {
  const base = defaultGridSpec(geom);
  const at = (s: number): Grid => {
    const top = tidy(ceilTo(base.top, s));
    return gridFromSpec({
      xStart: tidy(floorTo(base.xStart, s)),
      xEnd: tidy(ceilTo(base.xEnd, s)),
      top,
      depth: tidy(ceilTo(base.depth + (top - base.top), s)),
      spacing: s,
    });
  };
  let chosen = spacing;
  if (chosen === undefined) {
    const half = (medianStationSpacing(geom.stations) ?? base.spacing * 2) / 2;
    let k = NICE_SPACINGS.findLastIndex((s) => s <= half + 1e-9);
    if (k < 0) k = 0;
    while (k < NICE_SPACINGS.length - 1 && at(NICE_SPACINGS[k]).nx > MAX_DEFAULT_NX) k++;
    chosen = NICE_SPACINGS[k];
  }
  const grid = at(chosen);
  const xEnd = tidy(grid.x0 + (grid.nx - 1) * grid.dx);
  const points = stationSurface(geom.stations);
  const flatZ = points.length === 1 ? points[0][1] : grid.z0 - grid.dz;
  const surface = points.length >= 2 ? fitPolylineToRange(points, grid.x0, xEnd) : [[grid.x0, flatZ], [xEnd, flatZ]] as Point[];
  return { grid, surface, spacing: chosen };
}

