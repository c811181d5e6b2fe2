import type { Grid } from '../../../shared/grid';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { defaultGridSpec, type LineGeometry } from '../../../shared/model/edit/defaults';
import { gridFromSpec } from '../../../shared/model/edit/grid-spec';

/**
 * The grid an inversion from the automatic gradient gets when the user does not choose a spacing:
 * the extent of the model editor's default grid for the line (shared/model/edit/defaults.ts) on a
 * spacing of half the median station spacing, so every geophone interval holds two cells (a common
 * choice for refraction tomography; common practice, no source). Shown on the form so the user
 * sees the node count before starting; the server applies its own copy of the rule.
 */

/** Median distance between neighbouring stations along the line (m); null with fewer than two distinct positions. */
export function medianStationSpacing(stations: LineGeometry['stations']): number | null {
  const xs = [...new Set(stations.map((s) => s.x).filter(Number.isFinite))].sort((a, b) => a - b);
  const gaps = xs.slice(1).map((x, i) => x - xs[i]!);
  if (gaps.length === 0) return null;
  gaps.sort((a, b) => a - b);
  const mid = gaps.length / 2;
  return gaps.length % 2 ? gaps[Math.floor(mid)]! : (gaps[mid - 1]! + gaps[mid]!) / 2;
}

/** Half the median station spacing, to the millimetre; null without a station spacing. */
export function defaultInversionSpacing(stations: LineGeometry['stations']): number | null {
  const s = medianStationSpacing(stations);
  return s === null ? null : Math.round((s / 2) * 1000) / 1000;
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

/** "241 × 61 nodes", and whether it is past the grid limit. */
export function gridSizeWords(grid: Grid): { text: string; tooLarge: boolean } {
  const nodes = grid.nx * grid.nz;
  return { text: `${grid.nx} × ${grid.nz} nodes (${nodes.toLocaleString('en-GB')})`, tooLarge: nodes > MAX_GRID_NODES };
}
