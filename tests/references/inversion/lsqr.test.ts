/**
 * LSQR against a dense least-squares solution. Reference: the normal equations solved by a
 * general-purpose matrix library (ml-matrix's QR/SVD solve), on random overdetermined,
 * rank-deficient-free systems; LSQR converges to the same minimiser of ‖Ax − b‖ (Paige &
 * Saunders 1982, ACM TOMS 8(1), §2 and §6).
 */
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { CsrMatrix } from '../../../shared/inversion/csr';
import { lsqr, type LsqrOperator } from '../../../shared/inversion/lsqr';
import { normalDeviates } from '../../../shared/inversion/checkerboard';

function sparseRandom(m: number, n: number, density: number, seed: number) {
  const rand = normalDeviates(seed);
  const rowPtr = new Int32Array(m + 1);
  const cols: number[] = [];
  const vals: number[] = [];
  const dense = Matrix.zeros(m, n);
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < n; c++) {
      // Every row keeps its diagonal-ish entry so the matrix has full column rank.
      if (c === r % n || Math.abs(rand()) < density) {
        const v = rand();
        cols.push(c);
        vals.push(v);
        dense.set(r, c, v);
      }
    }
    rowPtr[r + 1] = cols.length;
  }
  return { csr: new CsrMatrix(m, n, rowPtr, Int32Array.from(cols), Float64Array.from(vals)), dense };
}

const operatorOf = (A: CsrMatrix): LsqrOperator => ({
  m: A.rows,
  n: A.columns,
  apply: (x, out) => void A.multiply(x, out),
  applyTranspose: (y, out) => {
    out.fill(0);
    A.multiplyTransposeAdd(y, out);
  },
});

describe('sparse products against the dense matrix (ml-matrix)', () => {
  it('A·x, Aᵀ·y scattered and Aᵀ·y through the explicit transpose agree with dense products', () => {
    const { csr, dense } = sparseRandom(70, 30, 0.2, 9);
    const rand = normalDeviates(11);
    const x = Float64Array.from({ length: 30 }, () => rand());
    const y = Float64Array.from({ length: 70 }, () => rand());
    const ax = dense.mmul(Matrix.columnVector(Array.from(x))).to1DArray();
    const aty = dense.transpose().mmul(Matrix.columnVector(Array.from(y))).to1DArray();
    const got = csr.multiply(x, new Float64Array(70));
    const scattered = csr.multiplyTransposeAdd(y, new Float64Array(30));
    const gathered = csr.transpose().multiplyAdd(y, new Float64Array(30).fill(1));
    for (let r = 0; r < 70; r++) expect(got[r]).toBeCloseTo(ax[r], 10);
    // The transpose stores Float32 values (as the ray-length matrix does): 6 digits, not 10.
    for (let j = 0; j < 30; j++) {
      expect(scattered[j]).toBeCloseTo(aty[j], 10);
      expect(gathered[j] - 1).toBeCloseTo(aty[j], 5);
    }
  });
});

describe('LSQR (Paige & Saunders 1982)', () => {
  it.each([
    [60, 20, 0.3, 1],
    [200, 50, 0.1, 2],
    [40, 40, 0.5, 3],
  ])('matches the dense least-squares solution on a %i × %i system', (m, n, density, seed) => {
    const { csr, dense } = sparseRandom(m, n, density, seed);
    const rand = normalDeviates(100 + seed);
    const b = Float64Array.from({ length: m }, () => rand());
    const got = lsqr(operatorOf(csr), b, { atol: 1e-12, btol: 1e-12, maxIterations: 10 * n });
    const reference = solve(dense, Matrix.columnVector(Array.from(b)), true).to1DArray();
    for (let j = 0; j < n; j++) expect(got.x[j]).toBeCloseTo(reference[j], 7);
    expect(got.reason).toBeGreaterThan(0);
  });

  it('returns x = 0 at once for b = 0', () => {
    const { csr } = sparseRandom(10, 5, 0.5, 4);
    const got = lsqr(operatorOf(csr), new Float64Array(10));
    expect(got.iterations).toBe(0);
    expect(Array.from(got.x)).toEqual([0, 0, 0, 0, 0]);
  });
});
