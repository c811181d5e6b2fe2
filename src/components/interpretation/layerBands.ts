import { hex, velocityColour, type VelocityColourRange } from '../../../shared/colour/velocity-scale';
import type { LayerResult } from '../../../shared/layers';

/** One layer as a closed outline (x, z) with its fill colour from the product's velocity scale. */
export interface LayerBand {
  layer: number;
  velocity: number;
  x: number[];
  z: number[];
  colour: string;
}

/** Linear interpolation in a polyline sorted by x; null outside it. */
function at(xs: number[], zs: number[], x: number): number | null {
  if (!xs.length || x < xs[0] || x > xs[xs.length - 1]) return null;
  let k = 1;
  while (k < xs.length && xs[k] < x) k++;
  if (k >= xs.length || xs[k] === x) return zs[Math.min(k, xs.length - 1)];
  const f = (x - xs[k - 1]) / (xs[k] - xs[k - 1]);
  return zs[k - 1] + f * (zs[k] - zs[k - 1]);
}

/**
 * The layers of an interpretation as filled bands: layer 0 between the ground and refractor 1, layer
 * n between refractors n and n + 1, the last down to `bottom`. Each band spans the geophones where
 * its lower boundary was interpreted (the last: where its top was), so nothing is drawn where the
 * interpretation says nothing.
 */
export function layerBands(result: LayerResult, ground: { x: number[]; z: number[] }, bottom: number, range: VelocityColourRange): LayerBand[] {
  const surfaces = [ground];
  for (let n = 1; n < result.velocities.length; n++) {
    const pts = result.depths.filter((d) => d.refractor === n).sort((a, b) => a.x - b.x);
    surfaces.push({ x: pts.map((d) => d.x), z: pts.map((d) => d.refractorZ) });
  }
  const bands: LayerBand[] = [];
  result.velocities.forEach((velocity, layer) => {
    const top = surfaces[layer];
    const base = surfaces[layer + 1];
    const xs = (base ?? top).x;
    const tops = xs.map((x) => at(top.x, top.z, x));
    const bases = base ? base.z : xs.map(() => bottom);
    const keep = xs.map((_, i) => tops[i] !== null);
    const x = xs.filter((_, i) => keep[i]);
    if (x.length < 2) return;
    const upper = tops.filter((_, i) => keep[i]) as number[];
    const lower = bases.filter((_, i) => keep[i]);
    bands.push({ layer, velocity, x: [...x, ...[...x].reverse()], z: [...upper, ...[...lower].reverse()], colour: hex(velocityColour(velocity, range)) });
  });
  return bands;
}
