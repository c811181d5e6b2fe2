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
