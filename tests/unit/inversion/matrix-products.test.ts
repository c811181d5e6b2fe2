/**
 * LSQR's matrix products on two threads (worker/threads/matrix-products.ts) must give exactly
 * what one thread gives (CsrMatrix's own products: the same sums in the same order), and an
 * inversion on the thread pool — forward steps and products on threads — must end on the same
 * model, bit for bit, as the single-thread in-process one. Reference for the products: the
 * definition of A·x and Aᵀ·u (common practice, no source); the single-thread products are
 * checked against a dense library in tests/references/inversion/lsqr.test.ts.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { gradientStart, inProcessModeller, invert } from '../../../shared/inversion';
import { normalDeviates } from '../../../shared/inversion/checkerboard';
import { CsrMatrix } from '../../../shared/inversion/csr';
import { DEFAULT_INVERSION_SETTINGS } from '../../../shared/schemas/inversions';
import { MatrixProductThread } from '../../../worker/threads/matrix-products';
import { SensitivityPool } from '../../../worker/threads/sensitivity-pool';
import { gradientSurvey, inversionGrid } from '../../references/inversion/surveys';

function randomMatrix(rows: number, columns: number, perRow: number, seed: number): CsrMatrix {
  const rand = normalDeviates(seed);
  const rowPtr = new Int32Array(rows + 1);
  const cols: number[] = [];
  const vals: number[] = [];
  for (let r = 0; r < rows; r++) {
    // Rows of very different lengths, so an even split by rows would not be an even split of work.
    const count = r % 7 === 0 ? 0 : Math.round(perRow * (1 + (r % 5)));
    const set = new Set<number>();
    while (set.size < Math.min(count, columns)) set.add(Math.floor(Math.abs(rand() * 1e6)) % columns);
    for (const c of [...set].sort((a, b) => a - b)) {
      cols.push(c);
      vals.push(rand());
    }
    rowPtr[r + 1] = cols.length;
  }
  return new CsrMatrix(rows, columns, rowPtr, Int32Array.from(cols), Float32Array.from(vals));
}

describe('MatrixProductThread', () => {
  const thread = new MatrixProductThread();
  afterAll(() => thread.close());

  it('A·x and Aᵀ·u on two threads equal the single-thread products exactly, step after step', async () => {
    for (const seed of [1, 2]) {
      const A = randomMatrix(300, 2000, 40, seed);
      const At = A.transpose();
      const products = await thread.prepare(A, At);
      const rand = normalDeviates(10 + seed);
      for (let call = 0; call < 3; call++) {
        const x = Float64Array.from({ length: 2000 }, () => rand());
        const u = Float64Array.from({ length: 300 }, () => rand());
        const start = Float64Array.from({ length: 2000 }, () => rand());
        const got = new Float64Array(300);
        products.multiply(x, got);
        expect(got).toEqual(A.multiply(x, new Float64Array(300)));
        const gotT = Float64Array.from(start);
        products.multiplyTransposeAdd(u, gotT);
        expect(gotT).toEqual(At.multiplyAdd(u, Float64Array.from(start)));
      }
      products.release();
    }
  });
});

describe('an inversion on the thread pool', () => {
  it('ends on the same model, bit for bit, as the in-process one (products and forward steps on threads change nothing)', async () => {
    const grid = inversionGrid(20);
    const active = new Uint8Array(grid.nx * grid.nz).fill(1);
    const shots = gradientSurvey(500, 40, 0.0005, 5);
    const settings = { ...DEFAULT_INVERSION_SETTINGS, maxIterations: 3 };
    const start = gradientStart(grid, active, () => 0, shots, settings).velocity;
    const problem = { grid, active, start, shots, settings };
    const single = await invert(problem, inProcessModeller(problem));
    const pool = new SensitivityPool(2);
    try {
      const modeller = pool.modeller(problem);
      expect(modeller.products).toBeDefined();
      const threaded = await invert(problem, modeller);
      expect(threaded.history.map((h) => h.chi2)).toEqual(single.history.map((h) => h.chi2));
      expect(threaded.velocity).toEqual(single.velocity);
    } finally {
      await pool.close();
    }
  }, 120_000);
});
