import type { Grid } from '../../../shared/grid';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { defaultGridSpec, NICE_SPACINGS, stationSurface, type LineGeometry } from '../../../shared/model/edit/defaults';
import { gridFromSpec } from '../../../shared/model/edit/grid-spec';

/**
 * The grid an inversion from the automatic gradient gets, shown on the start form so the node count
 * is seen before starting: the extent of the model editor's default grid for the line
 * (shared/model/edit/defaults.ts) on a finer spacing. Default spacing: half the median station
 * spacing (two cells per geophone interval; common practice, no source), taken down to the next of
 * the editor's round spacings and coarsened until the grid has at most MAX_DEFAULT_NX nodes along
 * the line. This is the server's rule for the automatic start (shared/inversion/grid-for-line.ts on
 * the server side of issue 11); once both are merged this file should call that one.
 */

/** The default spacing keeps the grid at most this many nodes along the line (the server's limit for the default). */
export const MAX_DEFAULT_NX = 600;

/** Median distance between neighbouring stations along the line (m); null with fewer than two distinct positions. */
export function medianStationSpacing(stations: LineGeometry['stations']): number | null {
  const xs = stationSurface(stations).map((p) => p[0]);
  if (xs.length < 2) return null;
  const gaps = xs.slice(1).map((x, i) => x - xs[i]!).sort((a, b) => a - b);
  const mid = gaps.length >> 1;
  return gaps.length % 2 ? gaps[mid]! : (gaps[mid - 1]! + gaps[mid]!) / 2;
}

const ceilTo = (v: number, step: number) => +(Math.ceil(v / step - 1e-9) * step).toFixed(6);
const floorTo = (v: number, step: number) => +(Math.floor(v / step + 1e-9) * step).toFixed(6);

/** The grid for a line at `spacing` (m): the editor's default extent, edges snapped outwards to the spacing. */
export function inversionGrid(geom: LineGeometry, spacing: number): Grid {
  const spec = defaultGridSpec(geom);
  const top = ceilTo(spec.top, spacing);
  return gridFromSpec({
    xStart: floorTo(spec.xStart, spacing),
    xEnd: ceilTo(spec.xEnd, spacing),
    top,
    depth: ceilTo(spec.depth + (top - spec.top), spacing),
    spacing,
  });
}

/** The spacing the server uses when none is given: half the median station spacing, down to a round spacing, coarser if the grid would be too long. */
export function defaultInversionSpacing(geom: LineGeometry): number {
  const half = (medianStationSpacing(geom.stations) ?? defaultGridSpec(geom).spacing * 2) / 2;
  let k = NICE_SPACINGS.findLastIndex((s) => s <= half + 1e-9);
  if (k < 0) k = 0;
  while (k < NICE_SPACINGS.length - 1 && inversionGrid(geom, NICE_SPACINGS[k]!).nx > MAX_DEFAULT_NX) k++;
  return NICE_SPACINGS[k]!;
}

/** "241 × 61 nodes", and whether it is past the grid limit. */
export function gridSizeWords(grid: Grid): { text: string; tooLarge: boolean } {
  const nodes = grid.nx * grid.nz;
  return { text: `${grid.nx} × ${grid.nz} nodes (${nodes.toLocaleString('en-GB')})`, tooLarge: nodes > MAX_GRID_NODES };
}
