import type { EnsembleSectionView } from '../../../shared/schemas/ensembles';
import { bandOutlines } from '../../../shared/uncertainty/band-outline';

/** The depth band over a section (elevations, m): closed outlines of the 5–95 % band, and the median with gaps where there is no band. */
export function bandShapes(bands: EnsembleSectionView['bands']) {
  const ground = new Map(bands.map((b) => [b.x, b.groundZ]));
  return {
    outlines: bandOutlines(bands, (x) => ground.get(x)!),
    median: { x: bands.map((b) => b.x), z: bands.map((b) => (b.median === null ? null : +(b.groundZ - b.median).toFixed(3))) },
  };
}

/** Node values as plotly heatmap rows (top row first), null where too few members cover the node. */
export function rowsOf(values: readonly (number | null)[], grid: EnsembleSectionView['grid'], scale = 1): (number | null)[][] {
  return Array.from({ length: grid.nz }, (_, iz) => values.slice(iz * grid.nx, (iz + 1) * grid.nx).map((v) => (v === null ? null : v * scale)));
}

/** Smallest and largest non-null value, or null. */
export function extent(values: readonly (number | null)[]): { min: number; max: number } | null {
  let min = Infinity, max = -Infinity;
  for (const v of values) {
    if (v === null) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : null;
}
