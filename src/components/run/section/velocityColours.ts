import { velocityColour, type VelocityColourRange } from '../../../../shared/colour/velocity-scale';

export { finiteRange } from '../../../../shared/colour/velocity-scale';

/** One RGBA pixel per node (air transparent), ready for ImageData: width nx, height nz, iz outer. Colours from the product's one scale. */
export function velocityPixels(values: ArrayLike<number>, range: VelocityColourRange): Uint8ClampedArray<ArrayBuffer> {
  const out = new Uint8ClampedArray(values.length * 4);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue; // alpha stays 0: air
    const [r, g, b] = velocityColour(v, range);
    out[i * 4] = r;
    out[i * 4 + 1] = g;
    out[i * 4 + 2] = b;
    out[i * 4 + 3] = 255;
  }
  return out;
}
