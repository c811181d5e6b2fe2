/**
 * One linearised step of the regularised least-squares problem (Aster, Borchers & Thurber 2018,
 * "Parameter Estimation and Inverse Problems", 3rd ed., §10.1 Gauss–Newton and §7.2 Occam form;
 * Zelt & Barton 1998, J. Geophys. Res. 103(B4), 7187–7210):
 *
 *   minimise  ‖W(t_obs − t(s_k) − G δ)‖² + αh²‖Dxx(s_k + δ)‖² + αv²‖Dzz(s_k + δ)‖² + μ²‖s_k + δ − s_0‖²
 *
 * W = diag(1/σ) weights each pick by its uncertainty; Dxx and Dzz are second differences along
 * the grid rows and columns (a linear change of slowness with depth, the usual refraction ground,
 * costs nothing); μ damps toward the starting model s_0. The smoothing acts on the model itself
 * (s_k + δ), not on the step, so the result does not depend on how many steps led to it. For a
 * start that carries structure (a saved layered model) it acts on the departure s_k + δ − s_0
 * instead: smoothing the model would wipe out the start's contacts (measured: from layered starts
 * with the contact 1.5 m too shallow, χ² stalled at 38–54; docs/inversion.md).
 * Unknowns are scaled by their column norms before LSQR (a diagonal preconditioner; Paige &
 * Saunders 1982 §7) so cells crossed by many rays and cells crossed by none converge alike.
 * The regularisation rows are applied without building a matrix; the weights and the column
 * scaling are folded into the data values and stencil coefficients once per step.
 */
import { CsrMatrix } from './csr';
import type { LsqrOperator } from './lsqr';
import type { MatrixProducts } from './types';

export interface StepInputs {
  nx: number;
  nz: number;
  /** Unknown index per node, −1 for air. */
  unknownOf: Int32Array;
  /** Node index per unknown. */
  nodeOf: Int32Array;
  /** Ray-length matrix over NODE columns (rows = used picks). */
  G: CsrMatrix;
  /** Per used pick: weight 1/σ (1/s) and residual t_obs − t_calc (s). */
  weight: Float64Array;
  residual: Float64Array;
  /** Current and starting slowness per unknown (s/m). */
  current: Float64Array;
  start: Float64Array;
  alphaH: number;
  alphaV: number;
  mu: number;
  /** Slowness the smoothing measures from (the start's, per unknown), or null: the model itself. */
  smoothFrom: Float64Array | null;
}

/** Triples of consecutive ground nodes (centre and its two neighbours), as unknown indices. */
export interface Stencils {
  horizontal: Int32Array;
  vertical: Int32Array;
}

export function secondDifferenceStencils(nx: number, nz: number, unknownOf: Int32Array): Stencils {
  const h: number[] = [];
  const v: number[] = [];
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0; ix < nx; ix++) {
      const c = unknownOf[iz * nx + ix];
      if (c < 0) continue;
      if (ix > 0 && ix < nx - 1) {
        const a = unknownOf[iz * nx + ix - 1], b = unknownOf[iz * nx + ix + 1];
        if (a >= 0 && b >= 0) h.push(a, c, b);
      }
      if (iz > 0 && iz < nz - 1) {
        const a = unknownOf[(iz - 1) * nx + ix], b = unknownOf[(iz + 1) * nx + ix];
        if (a >= 0 && b >= 0) v.push(a, c, b);
      }
    }
  }
  return { horizontal: Int32Array.from(h), vertical: Int32Array.from(v) };
}

/** The data matrix with its columns renumbered from nodes to unknowns (air columns cannot occur). */
export function toUnknownColumns(G: CsrMatrix, unknownOf: Int32Array, unknowns: number): CsrMatrix {
  const cols = new Int32Array(G.nonZeros);
  for (let k = 0; k < cols.length; k++) cols[k] = unknownOf[G.cols[k]];
  return new CsrMatrix(G.rows, unknowns, G.rowPtr, cols, G.vals);
}

export interface StepSystem {
  operator: LsqrOperator;
  /** The scaled data block of the operator and its transpose (for a products backend). */
  data: CsrMatrix;
  dataT: CsrMatrix;
  /** Runs the data block's products on `products` from now on (e.g. on more threads). */
  useProducts(products: Pick<MatrixProducts, 'multiply' | 'multiplyTransposeAdd'>): void;
  rhs: Float64Array;
  /** δ = columnScale ⊙ y, y the LSQR solution. */
  columnScale: Float64Array;
}

/** A (scaled) and b for LSQR. Row blocks: data, horizontal smoothing, vertical smoothing, damping. */
export function buildStep(inp: StepInputs, stencils: Stencils, Gu: CsrMatrix): StepSystem {
  const n = inp.current.length;
  const nd = Gu.rows;
  const nh = stencils.horizontal.length / 3;
  const nv = stencils.vertical.length / 3;
  const m = nd + nh + nv + n;
  const { alphaH, alphaV, mu, weight } = inp;

  // Column norms of the unscaled operator → preconditioner.
  const colSq = new Float64Array(n);
  Gu.addColumnSquares(weight, colSq);
  const addStencil = (st: Int32Array, alpha: number) => {
    const a2 = alpha * alpha;
    for (let r = 0; r < st.length; r += 3) {
      colSq[st[r]] += a2;
      colSq[st[r + 1]] += 4 * a2;
      colSq[st[r + 2]] += a2;
    }
  };
  addStencil(stencils.horizontal, alphaH);
  addStencil(stencils.vertical, alphaV);
  const columnScale = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const c = colSq[j] + mu * mu;
    columnScale[j] = c > 0 ? 1 / Math.sqrt(c) : 0;
  }

  const rhs = new Float64Array(m);
  for (let r = 0; r < nd; r++) rhs[r] = weight[r] * inp.residual[r];
  let s = inp.current;
  if (inp.smoothFrom) {
    s = new Float64Array(n);
    for (let j = 0; j < n; j++) s[j] = inp.current[j] - inp.smoothFrom[j];
  }
  const stencilRhs = (st: Int32Array, alpha: number, offset: number) => {
    for (let r = 0, row = offset; r < st.length; r += 3, row++) rhs[row] = -alpha * (s[st[r]] - 2 * s[st[r + 1]] + s[st[r + 2]]);
  };
  stencilRhs(stencils.horizontal, alphaH, nd);
  stencilRhs(stencils.vertical, alphaV, nd + nh);
  for (let j = 0; j < n; j++) rhs[nd + nh + nv + j] = -mu * (inp.current[j] - inp.start[j]);

  // The scaled operator A·C with its weights folded in once per step, so LSQR's products do no
  // scaling passes of their own: data rows w·G·C, stencil coefficients α·c·C, damping μ·C.
  const dataVals = new Float32Array(Gu.nonZeros);
  for (let r = 0; r < nd; r++) {
    for (let k = Gu.rowPtr[r]; k < Gu.rowPtr[r + 1]; k++) dataVals[k] = weight[r] * Gu.vals[k] * columnScale[Gu.cols[k]];
  }
  const data = new CsrMatrix(nd, n, Gu.rowPtr, Gu.cols, dataVals);
  // Aᵀ·u gathers along the rows of an explicit transpose: a third faster than scattering along
  // the rows of A (measured at 200 000 unknowns; the transpose costs one pass per step).
  const dataT = data.transpose();
  let products: Pick<MatrixProducts, 'multiply' | 'multiplyTransposeAdd'> = {
    multiply: (x, out) => void data.multiply(x, out),
    multiplyTransposeAdd: (u, out) => void dataT.multiplyAdd(u, out),
  };
  const coefficients = (st: Int32Array, alpha: number) => {
    const c = new Float64Array(st.length);
    for (let r = 0; r < st.length; r += 3) {
      c[r] = alpha * columnScale[st[r]];
      c[r + 1] = -2 * alpha * columnScale[st[r + 1]];
      c[r + 2] = alpha * columnScale[st[r + 2]];
    }
    return c;
  };
  const hc = coefficients(stencils.horizontal, alphaH);
  const vc = coefficients(stencils.vertical, alphaV);
  const damp = Float64Array.from(columnScale, (c) => mu * c);
  const operator: LsqrOperator = {
    m,
    n,
    apply(y, out) {
      products.multiply(y, out); // writes out[0 … nd−1]
      let row = nd;
      const st1 = stencils.horizontal;
      for (let r = 0; r < st1.length; r += 3) out[row++] = hc[r] * y[st1[r]] + hc[r + 1] * y[st1[r + 1]] + hc[r + 2] * y[st1[r + 2]];
      const st2 = stencils.vertical;
      for (let r = 0; r < st2.length; r += 3) out[row++] = vc[r] * y[st2[r]] + vc[r + 1] * y[st2[r + 1]] + vc[r + 2] * y[st2[r + 2]];
      for (let j = 0; j < n; j++) out[row++] = damp[j] * y[j];
    },
    applyTranspose(u, out) {
      const base = nd + nh + nv;
      for (let j = 0; j < n; j++) out[j] = damp[j] * u[base + j];
      products.multiplyTransposeAdd(u, out); // reads u[0 … nd−1]
      let row = nd;
      const st1 = stencils.horizontal;
      for (let r = 0; r < st1.length; r += 3) {
        const q = u[row++];
        out[st1[r]] += hc[r] * q;
        out[st1[r + 1]] += hc[r + 1] * q;
        out[st1[r + 2]] += hc[r + 2] * q;
      }
      const st2 = stencils.vertical;
      for (let r = 0; r < st2.length; r += 3) {
        const q = u[row++];
        out[st2[r]] += vc[r] * q;
        out[st2[r + 1]] += vc[r + 1] * q;
        out[st2[r + 2]] += vc[r + 2] * q;
      }
    },
  };
  return {
    operator,
    rhs,
    columnScale,
    data,
    dataT,
    useProducts: (p) => {
      products = p;
    },
  };
}
