/**
 * Colour scales. Velocity: pale sand (slow) through sage and sky to a mid slate blue (fast); the
 * lightness falls steadily and never gets dark, so black wavefronts and red rays stay readable.
 * Residuals: a diverging scale, blue (observed earlier than computed) – white (0) – brick red
 * (observed later), symmetric about zero.
 */
export type Rgb = readonly [number, number, number];
export type Stops = readonly (readonly [number, Rgb])[];

export const VELOCITY_STOPS: Stops = [
  [0, [247, 236, 206]],
  [0.25, [226, 232, 190]],
  [0.5, [184, 217, 205]],
  [0.75, [143, 187, 214]],
  [1, [104, 142, 190]],
];

export const RESIDUAL_STOPS: Stops = [
  [0, [44, 98, 160]],
  [0.25, [139, 179, 214]],
  [0.5, [255, 255, 255]],
  [0.75, [232, 156, 124]],
  [1, [176, 52, 36]],
];

/** Colour at position t ∈ [0, 1] (clipped; NaN → start), linear between stops. */
export function colourAt(stops: Stops, t: number): Rgb {
  const u = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 0;
  for (let i = 1; i < stops.length; i++) {
    const [t1, c1] = stops[i];
    if (u <= t1) {
      const [t0, c0] = stops[i - 1];
      const f = t1 === t0 ? 0 : (u - t0) / (t1 - t0);
      return [c0[0] + (c1[0] - c0[0]) * f, c0[1] + (c1[1] - c0[1]) * f, c0[2] + (c1[2] - c0[2]) * f];
    }
  }
  return stops[stops.length - 1][1];
}

export const hex = (c: Rgb): string => `#${c.map((v) => Math.round(v).toString(16).padStart(2, '0')).join('')}`;

/** Categorical colours for shots: distinct in hue and lightness, readable as thin lines on white. */
export const SHOT_COLOURS = ['#1f5f8b', '#c0392b', '#2e7d32', '#8e44ad', '#d68910', '#16838f', '#6d4c41', '#c2185b', '#546e7a', '#7cb342'];
export const shotColour = (i: number): string => SHOT_COLOURS[i % SHOT_COLOURS.length];
