/**
 * Exact travel times the benchmark and the reference tests compare against.
 * Each formula names its published source.
 */

/** Uniform velocity v: T = r / v (straight rays). */
export function homogeneousTime(v: number, xs: number, zs: number, x: number, z: number): number {
  return Math.hypot(x - xs, z - zs) / v;
}

/**
 * Constant vertical gradient v(depth) = v0 + g·depth, depth = −z (z elevation, 0 at the top):
 * T = (1/g)·arccosh(1 + g²r²/(2·v_s·v_r)), v_s and v_r the velocities at source and receiver.
 * Fomel, Luo & Zhao (2009), "Fast sweeping method for the factored eikonal equation",
 * J. Comput. Phys. 228, 6440–6455, eq. for the constant-gradient-of-velocity medium.
 */
export function gradientTime(v0: number, g: number, xs: number, zs: number, x: number, z: number): number {
  const vs = v0 - g * zs;
  const vr = v0 - g * z;
  const r2 = (x - xs) ** 2 + (z - zs) ** 2;
  return Math.acosh(1 + (g * g * r2) / (2 * vs * vr)) / g;
}

/**
 * Rays in v = v0 + g·depth are circular arcs centred on the line where v would vanish,
 * depth = −v0/g (a property of linear-velocity media, e.g. Telford, Geldart & Sheriff,
 * Applied Geophysics, 2nd ed., 1990, §4.3). Returns the deepest depth (m, positive down)
 * the arc between the two points reaches, so a benchmark can keep only nodes whose exact
 * ray stays inside its grid.
 */
export function gradientRayMaxDepth(v0: number, g: number, xs: number, zs: number, x: number, z: number): number {
  const a = v0 / g; // centre line at depth −a
  const ds = -zs + a; // source, receiver depths below the centre line
  const dr = -z + a;
  if (Math.abs(x - xs) < 1e-12) return Math.max(-zs, -z);
  // Centre (xc, −a): (xs − xc)² + ds² = (x − xc)² + dr²
  const xc = (x * x - xs * xs + dr * dr - ds * ds) / (2 * (x - xs));
  const radius = Math.hypot(xs - xc, ds);
  const lo = Math.min(xs, x);
  const hi = Math.max(xs, x);
  if (xc > lo && xc < hi) return radius - a; // the arc passes its lowest point between the two
  return Math.max(-zs, -z);
}

/**
 * Flat two-layer refraction first arrival at a surface receiver at offset x from a surface
 * source: the direct wave x/V1 or the head wave x/V2 + 2h·cos(ic)/V1 (sin ic = V1/V2), whichever
 * is first; the head wave exists only beyond the critical distance 2h·tan(ic).
 * Telford, Geldart & Sheriff (1990), Applied Geophysics, 2nd ed., Cambridge Univ. Press, §4.3.
 */
export function twoLayerSurfaceTime(v1: number, v2: number, h: number, offset: number): number {
  const x = Math.abs(offset);
  const direct = x / v1;
  const ic = Math.asin(v1 / v2);
  if (x < 2 * h * Math.tan(ic)) return direct;
  return Math.min(direct, x / v2 + (2 * h * Math.cos(ic)) / v1);
}

/** Crossover distance where the head wave overtakes the direct wave: 2h·√((V2+V1)/(V2−V1)) (same source). */
export function crossoverDistance(v1: number, v2: number, h: number): number {
  return 2 * h * Math.sqrt((v2 + v1) / (v2 - v1));
}

/**
 * Plane refractor of dip φ (deepening towards +x) at depth d0 below x = 0, flat surface z = 0.
 * Head wave between two surface points: T = L/V2 + (h_s + h_r)·cos(ic)/V1, L the distance along
 * the refractor between the feet of the perpendiculars, h the perpendicular depths; it exists
 * when L ≥ (h_s + h_r)·tan(ic). This equals the dipping-layer form x·sin(ic ± φ)/V1 + 2h_s·cos(ic)/V1
 * (Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.3.3); first arrival = min with
 * the direct wave.
 */
export function dippingSurfaceTime(v1: number, v2: number, d0: number, dip: number, xs: number, x: number): number {
  const ic = Math.asin(v1 / v2);
  const c = Math.cos(dip);
  const s = Math.sin(dip);
  const along = (px: number): number => px * c - d0 * s;
  const perp = (px: number): number => px * s + d0 * c;
  const direct = Math.abs(x - xs) / v1;
  const L = Math.abs(along(x) - along(xs));
  const hs = perp(xs);
  const hr = perp(x);
  if (L < (hs + hr) * Math.tan(ic)) return direct;
  return Math.min(direct, L / v2 + ((hs + hr) * Math.cos(ic)) / v1);
}

/** Telford's dipping-layer head-wave time, offset > 0 shooting down-dip (+φ), < 0 up-dip (−φ). */
export function dippingHeadTelford(v1: number, v2: number, hs: number, dip: number, offset: number): number {
  const ic = Math.asin(v1 / v2);
  const angle = offset >= 0 ? ic + dip : ic - dip;
  return (Math.abs(offset) * Math.sin(angle)) / v1 + (2 * hs * Math.cos(ic)) / v1;
}
