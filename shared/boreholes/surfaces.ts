import type { ModelFile } from '../schemas/model';
import { evalPolyline } from '../model/polyline';

/**
 * The surface a layered model offers for ties to the logs: the top of its deepest layer (the base
 * of the layer above it), as depth below the ground at x (m), or null outside that interface. Null
 * altogether for a model of one layer. `groundZ` gives the model's ground elevation at x.
 */
export function deepestInterfaceDepth(model: Pick<ModelFile, 'layers'>, groundZ: (x: number) => number): ((x: number) => number | null) | null {
  const layers = model.layers ?? [];
  const above = layers.length > 1 ? layers[layers.length - 2]?.base : null;
  if (!above || above.length < 2) return null;
  const base = above as [number, number][];
  return (x) => (x < base[0][0] || x > base[base.length - 1][0] ? null : +(groundZ(x) - evalPolyline(base, x)).toFixed(3));
}

/** What to call that surface beside the ties: "the top of <deepest layer's name>". */
export const deepestLayerName = (model: Pick<ModelFile, 'layers'>): string => `the top of ${model.layers?.[model.layers.length - 1]?.name ?? 'the deepest layer'}`;

/**
 * Depth (m) at x from depths given at points (e.g. a refractor under the geophones), linear between
 * neighbouring points, null outside them: the layer methods interpret nothing beyond their geophones.
 */
export function depthBetween(points: readonly { x: number; depth: number }[]): (x: number) => number | null {
  const p = [...points].sort((a, b) => a.x - b.x);
  return (x) => {
    if (!p.length || x < p[0].x || x > p[p.length - 1].x) return null;
    let k = 0;
    while (k < p.length - 1 && p[k + 1].x < x) k++;
    const a = p[k], b = p[Math.min(k + 1, p.length - 1)];
    const d = b.x > a.x ? a.depth + ((x - a.x) / (b.x - a.x)) * (b.depth - a.depth) : a.depth;
    return +d.toFixed(3);
  };
}
