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
 * (s_k + δ), not on the step, so the result does not depend on how many steps led to it.
 * Unknowns are scaled by their column norms before LSQR (a diagonal preconditioner; Paige &
 * Saunders 1982 §7) so cells crossed by many rays and cells crossed by none converge alike.
 * The regularisation rows are applied without building a matrix.
 */
import { CsrMatrix } from './csr';
import type { LsqrOperator } from './lsqr';

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
  const stencilRhs = (st: Int32Array, alpha: number, offset: number) => {
    const s = inp.current;
    for (let r = 0, row = offset; r < st.length; r += 3, row++) rhs[row] = -alpha * (s[st[r]] - 2 * s[st[r + 1]] + s[st[r + 2]]);
  };
  stencilRhs(stencils.horizontal, alphaH, nd);
  stencilRhs(stencils.vertical, alphaV, nd + nh);
  for (let j = 0; j < n; j++) rhs[nd + nh + nv + j] = -mu * (inp.current[j] - inp.start[j]);

  const scaled = new Float64Array(n);
  const dataOut = new Float64Array(nd);
  const operator: LsqrOperator = {
    m,
    n,
    apply(y, out) {
      for (let j = 0; j < n; j++) scaled[j] = columnScale[j] * y[j];
      Gu.multiply(scaled, dataOut);
      for (let r = 0; r < nd; r++) out[r] = weight[r] * dataOut[r];
      let row = nd;
      const st1 = stencils.horizontal;
      for (let r = 0; r < st1.length; r += 3) out[row++] = alphaH * (scaled[st1[r]] - 2 * scaled[st1[r + 1]] + scaled[st1[r + 2]]);
      const st2 = stencils.vertical;
      for (let r = 0; r < st2.length; r += 3) out[row++] = alphaV * (scaled[st2[r]] - 2 * scaled[st2[r + 1]] + scaled[st2[r + 2]]);
      for (let j = 0; j < n; j++) out[row++] = mu * scaled[j];
    },
    applyTranspose(u, out) {
      out.fill(0);
      for (let r = 0; r < nd; r++) dataOut[r] = weight[r] * u[r];
      Gu.multiplyTransposeAdd(dataOut, out);
      let row = nd;
      const st1 = stencils.horizontal;
      for (let r = 0; r < st1.length; r += 3) {
        const q = alphaH * u[row++];
        out[st1[r]] += q;
        out[st1[r + 1]] -= 2 * q;
        out[st1[r + 2]] += q;
      }
      const st2 = stencils.vertical;
      for (let r = 0; r < st2.length; r += 3) {
        const q = alphaV * u[row++];
        out[st2[r]] += q;
        out[st2[r + 1]] -= 2 * q;
        out[st2[r + 2]] += q;
      }
      for (let j = 0; j < n; j++) out[j] += mu * u[row++];
      for (let j = 0; j < n; j++) out[j] *= columnScale[j];
    },
  };
  return { operator, rhs, columnScale };
}
