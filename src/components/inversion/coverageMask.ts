import { niceStep } from '../run/section/contourLevels';

/**
 * The ray-coverage mask of an inversion section. A node that few rays cross is set by the smoothing
 * and the starting model, not by the picks, so it is greyed (common practice in refraction
 * tomography, no source). Coverage is the summed ray length per node (m); null marks air.
 */

/** Default threshold: one metre of ray (the suggestion). */
export const DEFAULT_COVERAGE_THRESHOLD_M = 1;

/** 1 where a ground node has less ray than `threshold` metres, 0 for covered ground and for air. */
export function coverageMask(coverage: readonly (number | null)[], threshold: number): Uint8Array {
  const mask = new Uint8Array(coverage.length);
  for (let i = 0; i < coverage.length; i++) {
    const c = coverage[i];
    if (c === null || c === undefined) continue; // air is not "poorly covered"; it is not ground
    if (!(c >= threshold)) mask[i] = 1; // NaN counts as no ray
  }
  return mask;
}

/** Share of the ground nodes that the mask greys (0…1); 0 when there is no ground. */
export function maskedShare(coverage: readonly (number | null)[], mask: Uint8Array): number {
  let ground = 0;
  let masked = 0;
  for (let i = 0; i < coverage.length; i++) {
    if (coverage[i] === null || coverage[i] === undefined) continue;
    ground++;
    masked += mask[i]!;
  }
  return ground ? masked / ground : 0;
}

/** The greyed colour: a light neutral, so masked ground reads as "no information" rather than a velocity. */
export const MASK_RGB: readonly [number, number, number] = [214, 211, 209];
/** How much of the velocity colour stays visible under the mask (a hint of the model, no more). */
const MASK_KEEP = 0.25;

/** Grey the masked nodes of an RGBA image (one pixel per node) in place. */
export function greyMaskedPixels(pixels: Uint8ClampedArray, mask: Uint8Array): void {
  for (let i = 0; i < mask.length; i++) {
    if (!mask[i] || pixels[i * 4 + 3] === 0) continue;
    for (let c = 0; c < 3; c++) pixels[i * 4 + c] = MASK_KEEP * pixels[i * 4 + c]! + (1 - MASK_KEEP) * MASK_RGB[c]!;
  }
}

/**
 * Top of the threshold slider: a round number near the median coverage of the ground, so the
 * slider can grey anything from nothing to about half the section; at least 5 m.
 */
export function thresholdCeiling(coverage: readonly (number | null)[]): number {
  const ground = coverage.filter((c): c is number => typeof c === 'number' && Number.isFinite(c)).sort((a, b) => a - b);
  if (ground.length === 0) return 5;
  const median = ground[Math.floor((ground.length - 1) / 2)]!;
  return Math.max(5, niceStep(median));
}
