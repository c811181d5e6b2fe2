import type { Grid } from '../../../shared/grid';
import { gridForLine } from '../../../shared/inversion/grid-for-line';
import { MAX_GRID_NODES } from '../../../shared/limits';
import type { LineGeometry } from '../../../shared/model/edit/defaults';

/**
 * The grid an inversion from the automatic gradient gets, shown on the start form so the node count
 * is seen before starting: the server's own rule (shared/inversion/grid-for-line.ts) — the extent of
 * the model editor's default grid for the line on a finer spacing, by default half the median station
 * spacing taken down to a round spacing and coarsened to at most MAX_DEFAULT_NX columns.
 */
export { MAX_DEFAULT_NX, medianStationSpacing } from '../../../shared/inversion/grid-for-line';

/** The grid for a line at `spacing` (m): the editor's default extent, edges snapped outwards to the spacing. */
export const inversionGrid = (geom: LineGeometry, spacing: number): Grid => gridForLine(geom, spacing).grid;

/** The spacing the server uses when none is given. */
export const defaultInversionSpacing = (geom: LineGeometry): number => gridForLine(geom).spacing;

/** "241 × 61 nodes", and whether it is past the grid limit. */
export function gridSizeWords(grid: Grid): { text: string; tooLarge: boolean } {
  const nodes = grid.nx * grid.nz;
  return { text: `${grid.nx} × ${grid.nz} nodes (${nodes.toLocaleString('en-GB')})`, tooLarge: nodes > MAX_GRID_NODES };
}
