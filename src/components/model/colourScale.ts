import { colourAt, VELOCITY_STOPS } from '../../../shared/colour/velocity-scale';

/**
 * The editor's velocity colours: the product's one scale (shared/colour/velocity-scale.ts) sampled
 * into a 256-entry table, so a heatmap of a million cells costs one look-up per cell.
 */
export const LUT_SIZE = 256;
/** 256 colours, r g b per entry. */
export const VELOCITY_LUT: Uint8Array = (() => {
  const lut = new Uint8Array(LUT_SIZE * 3);
  for (let i = 0; i < LUT_SIZE; i++) {
    const c = colourAt(VELOCITY_STOPS, i / (LUT_SIZE - 1));
    for (let k = 0; k < 3; k++) lut[3 * i + k] = Math.round(c[k]);
  }
  return lut;
})();

export const AIR_RGB: [number, number, number] = [236, 241, 244];
/** A velocity that cannot be drawn (≤ 0 or not a number): a loud colour so it is found at once. */
export const INVALID_RGB: [number, number, number] = [0, 200, 90];

export interface VelocityRange {
  lo: number;
  hi: number;
}

/** The colour range for the ground velocities, rounded outwards to a step that suits the spread. */
export function velocityRange(velocity: Float32Array, active: Uint8Array): VelocityRange {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < velocity.length; i++) {
    if (!active[i]) continue;
    const v = velocity[i];
    if (!(v > 0) || !Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!Number.isFinite(lo)) return { lo: 0, hi: 1000 };
  const step = hi - lo > 2000 ? 500 : hi - lo > 500 ? 100 : 50;
  const rlo = Math.floor(lo / step) * step;
  let rhi = Math.ceil(hi / step) * step;
  if (rhi <= rlo) rhi = rlo + step;
  return { lo: rlo, hi: rhi };
}

export function lutIndex(v: number, r: VelocityRange): number {
  const t = (v - r.lo) / (r.hi - r.lo);
  return Math.max(0, Math.min(LUT_SIZE - 1, Math.round(t * (LUT_SIZE - 1))));
}

export const lutCss = (i: number): string => `rgb(${VELOCITY_LUT[3 * i]} ${VELOCITY_LUT[3 * i + 1]} ${VELOCITY_LUT[3 * i + 2]})`;

/** A CSS gradient of the scale, bottom (slow) to top (fast), for the colour bar. */
export function lutGradient(): string {
  const stops = Array.from({ length: 9 }, (_, k) => `${lutCss(Math.round((k / 8) * (LUT_SIZE - 1)))} ${(k / 8) * 100}%`);
  return `linear-gradient(to top, ${stops.join(', ')})`;
}
