/**
 * The one velocity colour scale of the product: every section (model editor, forward run,
 * inversion, comparison, report PDF) maps a velocity to a colour through these stops, so the same
 * velocity has the same colour everywhere once the range is the same. Pale sand (slow) through sage
 * and sky to a mid slate blue (fast): lightness falls steadily and never gets dark, so black
 * wavefronts, red rays, station marks and interface lines stay readable on top.
 */
export type Rgb = readonly [number, number, number];
export type Stops = readonly (readonly [number, Rgb])[];

export interface VelocityColourRange {
  /** m/s at the slow end of the scale (drawn in the first colour, and everything slower too). */
  min: number;
  /** m/s at the fast end (and everything faster). */
  max: number;
}

export const VELOCITY_STOPS: Stops = [
  [0, [246, 231, 200]],
  [0.3, [223, 232, 201]],
  [0.6, [181, 214, 214]],
  [1, [127, 169, 201]],
];

/**
 * A new project's range: dry topsoil (~200 m/s) to fresh crystalline rock (~5000 m/s) spans the
 * ground a shallow refraction survey meets (common practice, no source). Each project can set its own.
 */
export const DEFAULT_VELOCITY_COLOURS: VelocityColourRange = { min: 200, max: 5000 };

/** Limits a project's range must lie within (m/s): below air's sound speed or above steel is a typo. */
export const VELOCITY_COLOUR_LIMITS = { min: 50, max: 10000 } as const;

/** Colour at position t ∈ [0, 1] on stops (clipped; NaN → start), linear between stops in sRGB. */
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

/** The colour of velocity v (m/s) on a range: clipped at both ends. */
export function velocityColour(v: number, range: VelocityColourRange): Rgb {
  const span = range.max - range.min;
  return colourAt(VELOCITY_STOPS, span > 0 ? (v - range.min) / span : 0.5);
}

export const hex = (c: Rgb): string => `#${c.map((v) => Math.round(v).toString(16).padStart(2, '0')).join('')}`;

/** The stops as CSS colours, position 0…1 first (for canvas gradients and CSS). */
export const VELOCITY_CSS_STOPS: readonly (readonly [number, string])[] = VELOCITY_STOPS.map(([t, c]) => [t, hex(c)] as const);

/** Smallest and largest finite value (air NaN skipped); null when there is none. */
export function finiteRange(values: ArrayLike<number>): VelocityColourRange | null {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : null;
}

/** A range with room in it: a uniform section gets ±10 % so its one colour sits mid-scale. */
export function widenUniform(range: VelocityColourRange): VelocityColourRange {
  return range.max > range.min ? range : { min: range.min * 0.9, max: range.max * 1.1 || 1 };
}

/** Why a range cannot be a project's colour range, or null when it can. */
export function velocityRangeProblem(range: VelocityColourRange): string | null {
  const { min, max } = VELOCITY_COLOUR_LIMITS;
  if (!Number.isFinite(range.min) || !Number.isFinite(range.max)) return 'Both ends of the colour range must be numbers.';
  if (range.min < min || range.max > max) return `The colour range must lie between ${min} and ${max} m/s.`;
  if (!(range.max > range.min)) return 'The fast end of the colour range must be above the slow end.';
  return null;
}
