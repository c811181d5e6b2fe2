/**
 * Convergence with grid spacing in the constant-gradient medium (exact: arccosh formula,
 * Fomel, Luo & Zhao 2009, J. Comput. Phys. 228). Halving the spacing should divide the error by
 * about 2¹ for the first-order scheme and 2² for the second-order one; the observed order is
 * log2(e_h / e_h/2). Errors are taken beyond a fixed 4 m from the source so every grid measures
 * the same region.
 */
import { describe, expect, it } from 'vitest';
import { gradientErrors } from './gradient-errors';

const src = { x: 20.13, z: -0.37 };
const SPACINGS = [1, 0.5, 0.25];

function observedOrders(order: 1 | 2): number[] {
  const errs = SPACINGS.map((h) => gradientErrors(h, order, src, 4).mean);
  return errs.slice(1).map((e, k) => Math.log2(errs[k] / e));
}

describe('observed order of convergence', () => {
  it('first order ≈ 1', () => {
    for (const p of observedOrders(1)) {
      expect(p).toBeGreaterThan(0.8);
      expect(p).toBeLessThan(1.3);
    }
  });
  it('second order ≈ 2', () => {
    for (const p of observedOrders(2)) {
      expect(p).toBeGreaterThan(1.7);
      expect(p).toBeLessThan(2.8);
    }
  });
});
