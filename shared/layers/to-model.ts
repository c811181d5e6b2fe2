/**
 * A layer interpretation as a layered model file (FORMATS.md §1) on the grid and ground surface
 * of the model it was made on: each refractor becomes the base of the layer above it, through
 * the refractor elevations under the geophones and held level beyond the end geophones; each
 * layer carries its velocity, constant with depth.
 */
import type { ModelFile } from '../schemas/model';
import type { LayerResult } from './types';

export function layeredModelFromResult(result: LayerResult, on: Pick<ModelFile, 'grid' | 'surface'>): ModelFile {
  const { grid } = on;
  const x0 = grid.x0, x1 = grid.x0 + (grid.nx - 1) * grid.dx;
  const refractors = result.velocities.length - 1;
  const layers: ModelFile['layers'] = [];
  for (let n = 1; n <= refractors; n++) {
    const points = result.depths.filter((d) => d.refractor === n).sort((a, b) => a.x - b.x);
    const inside = points.filter((p) => p.x > x0 && p.x < x1).map((p): [number, number] => [p.x, +p.refractorZ.toFixed(3)]);
    if (!inside.length) continue;
    const base: [number, number][] = [[x0, inside[0][1]], ...inside, [x1, inside[inside.length - 1][1]]];
    const v = Math.round(result.velocities[n - 1]);
    layers.push({ name: `layer ${n}`, base, v_top: v, v_base: v });
  }
  const last = Math.round(result.velocities[layers.length]);
  layers.push({ name: `layer ${layers.length + 1}`, v_top: last, v_base: last });
  return { format: 'timefield-model/1', grid, ...(on.surface ? { surface: on.surface } : {}), layers } as ModelFile;
}
