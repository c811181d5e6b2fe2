/**
 * The layered model along one vertical line x (FORMATS.md §1): where each layer starts and ends
 * there, which layer holds an elevation z, and its velocity at z. Shared by the node rasteriser
 * and the sub-cell sampler so both read the model by the same rules.
 */
import type { ModelLayer } from '../schemas/model';
import { evalPolyline } from './polyline';

export interface LayerColumn {
  /** Clipped top and base elevation (m) of each layer at this x; the last layer's base is the grid bottom. */
  tops: Float64Array;
  bases: Float64Array;
}

export function newLayerColumn(layerCount: number): LayerColumn {
  return { tops: new Float64Array(layerCount), bases: new Float64Array(layerCount) };
}

/** Fills `col` for x. Pinch-out: a base above the layer's top is clipped to it. */
export function layerColumnAt(layers: readonly ModelLayer[], x: number, zSurface: number, zBottom: number, col: LayerColumn): void {
  const last = layers.length - 1;
  let top = zSurface;
  for (let k = 0; k <= last; k++) {
    const base = layers[k].base;
    const b = k < last && base ? Math.min(evalPolyline(base, x), top) : zBottom;
    col.tops[k] = top;
    col.bases[k] = b;
    top = b;
  }
}

/**
 * Layer holding elevation z, searching down from layer `from` (callers walking down a column pass
 * the last answer). A point on an interface (within eps) belongs to the layer below.
 */
export function layerIndexAt(col: LayerColumn, z: number, eps: number, from = 0): number {
  const last = col.bases.length - 1;
  let k = from;
  while (k < last && z <= col.bases[k] + eps) k++;
  return k;
}

/** Velocity (m/s) of layer k at z: linear from v_top at its top to v_base at its base. */
export function layerVelocityAt(layer: ModelLayer, col: LayerColumn, k: number, z: number, eps: number): number {
  const thickness = col.tops[k] - col.bases[k];
  const frac = thickness > eps ? Math.min(1, Math.max(0, (col.tops[k] - z) / thickness)) : 0;
  return layer.v_top + (layer.v_base - layer.v_top) * frac;
}
