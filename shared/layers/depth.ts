/**
 * From time-depths to depths. A time-depth (delay time) under a geophone is
 *   t_n = Σ_k h_k · √(1/V_k² − 1/V_n²)   over the layers k above refractor n,
 * so the thicknesses come out layer by layer from the top (layer stripping; Telford, Geldart &
 * Sheriff 1990, §4.3). These are measured normal to the refractor; the vertical depth below the
 * geophone is the normal one divided by the cosine of the refractor's local dip, which is read
 * from the depths of the neighbouring geophones (two passes; common practice, no source).
 */

/** √(1/a² − 1/b²): the vertical slowness in a layer of velocity a for a ray critical at velocity b. */
export const verticalSlowness = (a: number, b: number): number => Math.sqrt(Math.max(0, 1 / (a * a) - 1 / (b * b)));

/**
 * Normal depth of refractor n (1-based) from its time-depth and the normal depths of the
 * refractors above at the same place (`above[k]` = depth of refractor k+1).
 */
export function strippedDepth(timeDepth: number, n: number, velocities: readonly number[], above: readonly number[]): number {
  let t = timeDepth;
  let top = 0;
  for (let k = 0; k < n - 1; k++) {
    const h = above[k] - top;
    t -= h * verticalSlowness(velocities[k], velocities[n]);
    top = above[k];
  }
  const q = verticalSlowness(velocities[n - 1], velocities[n]);
  return q > 0 ? top + t / q : Number.NaN;
}

/** Vertical depths from normal ones along a line of geophones (x ascending). */
export function verticalDepths(xs: readonly number[], groundZ: readonly number[], normal: readonly number[]): number[] {
  let vertical = normal.slice();
  for (let pass = 0; pass < 2; pass++) {
    const z = xs.map((_, i) => groundZ[i] - vertical[i]);
    vertical = normal.map((d, i) => {
      const a = Math.max(0, i - 2), b = Math.min(xs.length - 1, i + 2);
      if (b === a) return d;
      const slope = (z[b] - z[a]) / (xs[b] - xs[a]);
      return d * Math.sqrt(1 + slope * slope); // 1 / cos(atan(slope))
    });
  }
  return vertical;
}
