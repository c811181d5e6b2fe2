/**
 * Layer interfaces of a layered model as the rasteriser reads them: each base clipped to the one
 * above (pinch-out), broken where a layer has no thickness, simplified for drawing.
 */
import { simplifyPolyline } from '../../shared/geometry/simplify';
import { nodeX } from '../../shared/grid';
import { evalPolyline, type ModelFile, type RasterModel } from '../../shared/model';

export interface LayerOutline {
  name: string;
  vTop: number;
  vBase: number;
  /** Clipped base as pieces of x, z pairs (m); empty for the last layer. */
  base: number[][];
  /** Clipped top and base elevation at x (the last layer's base is the grid bottom). */
  topAt(x: number): number;
  baseAt(x: number): number;
}

export function layerOutlines(file: ModelFile, model: RasterModel): LayerOutline[] {
  const layers = file.layers ?? [];
  const { grid } = model;
  const zBottom = grid.z0 - (grid.nz - 1) * grid.dz;
  const tolerance = 0.25 * Math.min(grid.dx, grid.dz);
  // Clipped base of layer k at x: min(base_k(x), clipped base of k−1), starting from the surface.
  const clippedBase = (k: number, x: number): number => {
    let top = model.surfaceZ(x);
    for (let j = 0; j <= k; j++) {
      const b = layers[j].base;
      top = j < layers.length - 1 && b ? Math.min(evalPolyline(b as [number, number][], x), top) : zBottom;
    }
    return top;
  };
  return layers.map((layer, k) => {
    const topAt = (x: number) => (k === 0 ? model.surfaceZ(x) : clippedBase(k - 1, x));
    const baseAt = (x: number) => clippedBase(k, x);
    const pieces: number[][] = [];
    if (k < layers.length - 1) {
      let piece: number[] = [];
      for (let ix = 0; ix < grid.nx; ix++) {
        const x = nodeX(grid, ix);
        const z = baseAt(x);
        if (topAt(x) - z > 1e-6 * grid.dz) piece.push(x, z);
        else if (piece.length) {
          pieces.push(piece);
          piece = [];
        }
      }
      if (piece.length) pieces.push(piece);
    }
    return {
      name: layer.name ?? `layer ${k + 1}`,
      vTop: layer.v_top,
      vBase: layer.v_base,
      base: pieces.filter((p) => p.length >= 4).map((p) => Array.from(simplifyPolyline(Float64Array.from(p), tolerance))),
      topAt,
      baseAt,
    };
  });
}
