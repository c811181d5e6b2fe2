/**
 * The local upwind update of fast marching in factored form.
 *
 * Along each grid axis the one-sided difference of the travel time at node q, from accepted
 * neighbours n (spacing d, signed q − n) and n₂ beyond it, is written D = α·T_q − β:
 *   first order   α = e/r² + 1/d,     β = r·U_n/d
 *   second order  α = e/r² + 3/(2d),  β = r·(2U_n − U_n₂/2)/d
 * with U = T/r (τ·s₀ of the factored unknown T = τ·s₀·r, r the distance to the source, e the
 * offset along the axis). |∇T|² = s² then reads Σ(α_k·T − β_k)² = s², a quadratic in T whose
 * larger root is the causal one. Setting r ≡ 1, e ≡ 0 recovers the plain (unfactored) scheme.
 * Sources: Sethian (1999), "Level Set Methods and Fast Marching Methods", Cambridge Univ. Press,
 * ch. 8 (upwind quadratic); Rickett & Fomel (1999), "A second-order fast marching eikonal solver",
 * Stanford Exploration Project Report 100 (mixed second order); Fomel, Luo & Zhao (2009),
 * J. Comput. Phys. 228, 6440–6455 (factored form).
 */

/** Two-axis solve; NaN when the quadratic has no real root. */
export function solveTwoAxes(ax: number, bx: number, az: number, bz: number, s: number): number {
  const a = ax * ax + az * az;
  const b = ax * bx + az * bz;
  const c = bx * bx + bz * bz - s * s;
  const disc = b * b - a * c;
  if (disc < 0 || a <= 0) return NaN;
  return (b + Math.sqrt(disc)) / a;
}

/** One-axis solve: the larger root of (α·T − β)² = s². */
export function solveOneAxis(a: number, b: number, s: number): number {
  return a > 0 ? (b + s) / a : (b - s) / a;
}
