/**
 * Colour scales of the report. Velocity: the product's one scale (shared/colour/velocity-scale.ts).
 * Residuals: a diverging scale, blue (observed earlier than computed) – white (0) – brick red
 * (observed later), symmetric about zero.
 */
import type { Stops } from '../../shared/colour/velocity-scale';

export { colourAt, hex, VELOCITY_STOPS, type Rgb, type Stops } from '../../shared/colour/velocity-scale';

export const RESIDUAL_STOPS: Stops = [
  [0, [44, 98, 160]],
  [0.25, [139, 179, 214]],
  [0.5, [255, 255, 255]],
  [0.75, [232, 156, 124]],
  [1, [176, 52, 36]],
];

/** Categorical colours for shots: distinct in hue and lightness, readable as thin lines on white. */
export const SHOT_COLOURS = ['#1f5f8b', '#c0392b', '#2e7d32', '#8e44ad', '#d68910', '#16838f', '#6d4c41', '#c2185b', '#546e7a', '#7cb342'];
export const shotColour = (i: number): string => SHOT_COLOURS[i % SHOT_COLOURS.length];

/**
 * The figure caption's words on the velocity colours: the scale's span and, where it differs, what
 * the section itself holds (velocities past either end take the end colour).
 */
export function colourText(scale: { min: number; max: number }, ground: { min: number; max: number }, where: string): string {
  const r = (v: number) => String(Math.round(v));
  const span = `Colours give the velocity on one scale from ${r(scale.min)} to ${r(scale.max)} m/s`;
  const same = Math.round(scale.min) === Math.round(ground.min) && Math.round(scale.max) === Math.round(ground.max);
  if (same) return `${span}.`;
  const clipped = ground.min < scale.min || ground.max > scale.max ? '; velocities beyond the scale take its end colours' : '';
  return `${span}, the project's scale, so the same colour is the same velocity in every section of the project; velocities in ${where}: ${r(ground.min)} to ${r(ground.max)} m/s${clipped}.`;
}
