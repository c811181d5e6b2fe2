/**
 * The local update algebra (stencil.ts, inlined by march.ts) reproduces exact times from exact
 * neighbour values:
 * - a plane wave T = p·x (|p| = s) with the plain coefficients, first and second order — the
 *   one-sided differences are exact for linear T (Sethian 1999, ch. 8);
 * - a point source in uniform ground with the factored coefficients (T = s·r exactly; Fomel,
 *   Luo & Zhao 2009, J. Comput. Phys. 228).
 */
import { describe, expect, it } from 'vitest';
import { solveOneAxis, solveTwoAxes } from '../../../shared/eikonal/stencil';

const h = 0.5;
const s = 1 / 800;

describe('stencil', () => {
  it('plane wave, first and second order, plain coefficients', () => {
    const angle = 0.6;
    const px = s * Math.cos(angle);
    const pz = s * Math.sin(angle);
    const T = (x: number, z: number) => px * x + pz * z;
    // Node at (0, 0); upwind neighbours at (−h, 0), (−2h, 0) and (0, −h), (0, −2h).
    const first = solveTwoAxes(1 / h, T(-h, 0) / h, 1 / h, T(0, -h) / h, s);
    expect(first).toBeCloseTo(T(0, 0), 14);
    const second = solveTwoAxes(1.5 / h, (2 * T(-h, 0) - 0.5 * T(-2 * h, 0)) / h, 1.5 / h, (2 * T(0, -h) - 0.5 * T(0, -2 * h)) / h, s);
    expect(second).toBeCloseTo(T(0, 0), 14);
    // Along an axis: T = s·x.
    expect(solveOneAxis(1 / h, (s * 3 * h) / h, s)).toBeCloseTo(s * 4 * h, 14);
  });

  it('point source in uniform ground, factored coefficients', () => {
    const src = { x: 0.13, z: -0.31 };
    const r = (x: number, z: number) => Math.hypot(x - src.x, z - src.z);
    const U = (x: number, z: number) => (s * r(x, z)) / r(x, z); // T/r = s in uniform ground
    const q = { x: 3, z: -2 };
    const rq = r(q.x, q.z);
    const ex = (q.x - src.x) / rq ** 2;
    const ez = (q.z - src.z) / rq ** 2;
    // Neighbours towards the source: (q.x − h, q.z) and (q.x, q.z + h); signed spacings d = q − n.
    const ax = ex + 1 / h;
    const bx = (rq * U(q.x - h, q.z)) / h;
    const az = ez - 1 / h;
    const bz = (rq * U(q.x, q.z + h)) / -h;
    expect(solveTwoAxes(ax, bx, az, bz, s)).toBeCloseTo(s * rq, 14);
  });

  it('no real root gives NaN (never a wrong number)', () => {
    expect(solveTwoAxes(1 / h, 10 / h, 1 / h, 0, s)).toBeNaN();
  });
});
