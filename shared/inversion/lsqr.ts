/**
 * LSQR: the least-squares solution of A·x ≈ b for a large sparse A, given only the products
 * A·v and Aᵀ·u. Golub–Kahan bidiagonalisation with the QR update of Paige & Saunders (1982),
 * "LSQR: An algorithm for sparse linear equations and sparse least squares", ACM Trans. Math.
 * Software 8(1), 43–71 — the algorithm of their §4 with the stopping rules S1 and S2 of §6
 * (atol, btol) and an iteration limit. Written here because no npm package solves sparse least
 * squares; checked against a dense solver in the tests.
 */
export interface LsqrOperator {
  /** Rows and columns of A. */
  m: number;
  n: number;
  /** out = A·x (overwrite). */
  apply(x: Float64Array, out: Float64Array): void;
  /** out = Aᵀ·y (overwrite). */
  applyTranspose(y: Float64Array, out: Float64Array): void;
}

export interface LsqrOptions {
  /** Relative accuracy of A and of b (Paige & Saunders §6); default 1e-6 each. */
  atol?: number;
  btol?: number;
  maxIterations?: number;
}

export interface LsqrResult {
  x: Float64Array;
  iterations: number;
  /** 1: b ≈ A·x within btol; 2: least-squares optimum within atol; 3: iteration limit; 0: x = 0 is exact. */
  reason: 0 | 1 | 2 | 3;
  /** ‖b − A·x‖ (estimate carried by the recurrence). */
  residualNorm: number;
}

function norm(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return Math.sqrt(s);
}

function scale(v: Float64Array, f: number): void {
  for (let i = 0; i < v.length; i++) v[i] *= f;
}

export function lsqr(A: LsqrOperator, b: Float64Array, options: LsqrOptions = {}): LsqrResult {
  const { m, n } = A;
  const atol = options.atol ?? 1e-6;
  const btol = options.btol ?? 1e-6;
  const maxIterations = options.maxIterations ?? 2 * n;
  const x = new Float64Array(n);
  const u = Float64Array.from(b);
  const v = new Float64Array(n);
  const w = new Float64Array(n);
  const Av = new Float64Array(m);
  const Atu = new Float64Array(n);

  let beta = norm(u);
  if (beta === 0) return { x, iterations: 0, reason: 0, residualNorm: 0 };
  scale(u, 1 / beta);
  A.applyTranspose(u, v);
  let alpha = norm(v);
  if (alpha === 0) return { x, iterations: 0, reason: 2, residualNorm: beta };
  scale(v, 1 / alpha);
  w.set(v);

  const bnorm = beta;
  let phiBar = beta;
  let rhoBar = alpha;
  let anorm2 = 0;
  let iterations = 0;
  let reason: LsqrResult['reason'] = 3;

  while (iterations < maxIterations) {
    iterations++;
    // Bidiagonalisation: β u = A v − α u ; α v = Aᵀ u − β v (each update fused with its norm).
    A.apply(v, Av);
    let su = 0;
    for (let i = 0; i < m; i++) {
      const ui = Av[i] - alpha * u[i];
      u[i] = ui;
      su += ui * ui;
    }
    beta = Math.sqrt(su);
    if (beta > 0) scale(u, 1 / beta);
    anorm2 += alpha * alpha + beta * beta;
    A.applyTranspose(u, Atu);
    let sv = 0;
    for (let j = 0; j < n; j++) {
      const vj = Atu[j] - beta * v[j];
      v[j] = vj;
      sv += vj * vj;
    }
    alpha = Math.sqrt(sv);
    if (alpha > 0) scale(v, 1 / alpha);

    // Plane rotation eliminating β from the lower bidiagonal.
    const rho = Math.hypot(rhoBar, beta);
    const c = rhoBar / rho;
    const s = beta / rho;
    const theta = s * alpha;
    rhoBar = -c * alpha;
    const phi = c * phiBar;
    phiBar = s * phiBar;

    const t1 = phi / rho;
    const t2 = -theta / rho;
    let sx = 0;
    for (let j = 0; j < n; j++) {
      const xj = x[j] + t1 * w[j];
      x[j] = xj;
      sx += xj * xj;
      w[j] = v[j] + t2 * w[j];
    }

    // Stopping rules S1 (compatible system) and S2 (least-squares optimum), Paige & Saunders §6.
    const rnorm = phiBar;
    const anorm = Math.sqrt(anorm2);
    const arnorm = phiBar * alpha * Math.abs(c);
    const xnorm = Math.sqrt(sx);
    if (rnorm <= btol * bnorm + atol * anorm * xnorm) {
      reason = 1;
      break;
    }
    if (arnorm <= atol * anorm * rnorm) {
      reason = 2;
      break;
    }
  }
  return { x, iterations, reason, residualNorm: phiBar };
}
