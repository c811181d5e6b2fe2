/**
 * Across-axis slope of a reference travel time near the source, for the provisional one-axis
 * update of nodes beside the grid lines through the source (the march, kernel/march.as.ts).
 *
 * The reference is the exact time in the linear-velocity medium v = v_s + G·(x − x_s) that
 * matches the velocity and its gradient at the source:
 *   T₀ = (1/|G|)·arccosh(1 + |G|²r²/(2·v_s·v)),   ∇T₀ = |G|·(2e/v − r²G/v²) / (2·v_s·√(A²−1)),
 * A the arccosh argument, e = x − x_s (Fomel, Luo & Zhao 2009, J. Comput. Phys. 228, 6440–6455,
 * constant gradient of velocity). Returned is ∂(ln T₀)/∂axis, which with |G| → 0 becomes e_axis/r²,
 * the plain point-source factor. Its rays bend as the medium's do, so the guess of the slope
 * across the source line stays right a few cells out, where a straight-ray guess is already off.
 */
export function referenceLogSlope(ex: number, ez: number, gx: number, gz: number, vs: number, alongX: boolean): number {
  const r2 = ex * ex + ez * ez;
  const e = alongX ? ez : ex; // the axis across the line: a row node needs ∂/∂z, a column node ∂/∂x
  const g2 = gx * gx + gz * gz;
  const v = vs + gx * ex + gz * ez;
  if (g2 * r2 < 1e-12 * vs * vs || !(v > 0)) return e / r2;
  const g = Math.sqrt(g2);
  const w = (g2 * r2) / (2 * vs * v); // A − 1
  const root = Math.sqrt(w * (w + 2)); // √(A² − 1)
  const t0 = Math.log1p(w + root) / g;
  const ga = alongX ? gz : gx;
  const grad = (g * ((2 * e) / v - (r2 * ga) / (v * v))) / (2 * vs * root);
  return grad / t0;
}
