/**
 * Constant vertical gradient of velocity, v = v0 + g·depth:
 * T = (1/g)·arccosh(1 + g²r²/(2·v_s·v_r))  (Fomel, Luo & Zhao 2009, "Fast sweeping method for
 * the factored eikonal equation", J. Comput. Phys. 228, 6440–6455). Only nodes whose exact
 * circular ray stays inside the grid are compared.
 */
import { describe, expect, it } from 'vitest';
import { gradientErrors } from './gradient-errors';

describe('constant velocity gradient (arccosh formula)', () => {
  const src = { x: 20.13, z: -0.37 }; // off the nodes, just below the surface
  it('second order, 0.5 m cells: mean ≤ 0.05 %, max ≤ 0.5 % beyond two cells', () => {
    const e = gradientErrors(0.5, 2, src, 1.0);
    expect(e.n).toBeGreaterThan(1000);
    expect(e.mean).toBeLessThan(5e-4);
    expect(e.max).toBeLessThan(5e-3);
  });
  it('first order, 0.5 m cells: mean ≤ 1 %', () => {
    const e = gradientErrors(0.5, 1, src, 1.0);
    expect(e.mean).toBeLessThan(1e-2);
  });
  it('a source at depth on a node', () => {
    const e = gradientErrors(0.5, 2, { x: 15, z: -5 }, 1.0);
    expect(e.max).toBeLessThan(5e-3);
  });
});
