/**
 * Dipping refractor (Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.3.3):
 * apparent velocities V1/sin(ic + φ) shooting down-dip and V1/sin(ic − φ) shooting up-dip, and
 * the usual inversion of the pair back to V2 and φ:
 *   ic + φ = asin(V1/Vd),  ic − φ = asin(V1/Vu).
 */
import { describe, expect, it } from 'vitest';
import { sampleTime, solveTravelTimes, traceRay } from '../../../shared/eikonal';
import { dippingSurfaceTime } from '../../../scripts/bench/exact';
import { makeGrid, twoLayers } from './models';

const V1 = 500;
const V2 = 2000;
const DIP = (6 * Math.PI) / 180;
const D0 = 6; // refractor depth at x = 0
const grid = makeGrid(160, 28, 0.5);
const model = twoLayers(grid, V1, V2, (x) => D0 + x * Math.tan(DIP));
const ic = Math.asin(V1 / V2);

function apparentVelocity(sourceX: number, xa: number, xb: number): number {
  const T = solveTravelTimes(grid, model.velocity, model.active, { x: sourceX, z: 0 });
  const ta = sampleTime(grid, T, model.active, { x: xa, z: 0 });
  const tb = sampleTime(grid, T, model.active, { x: xb, z: 0 });
  return Math.abs(xb - xa) / Math.abs(tb - ta);
}

describe('dipping refractor', () => {
  const vDown = apparentVelocity(0, 90, 150); // shot at the shallow end, receivers down-dip
  const vUp = apparentVelocity(160, 70, 10); // shot at the deep end, receivers up-dip

  it('down-dip apparent velocity V1/sin(ic + φ) within 1 %', () => {
    const expected = V1 / Math.sin(ic + DIP);
    expect(Math.abs(vDown - expected) / expected).toBeLessThan(0.01);
  });

  it('up-dip apparent velocity V1/sin(ic − φ) within 1 %', () => {
    const expected = V1 / Math.sin(ic - DIP);
    expect(Math.abs(vUp - expected) / expected).toBeLessThan(0.01);
  });

  it('the two apparent velocities give back V2 within 1 % and the dip within 0.5°', () => {
    const a = Math.asin(V1 / vDown);
    const b = Math.asin(V1 / vUp);
    const icEst = (a + b) / 2;
    const dipEst = (a - b) / 2;
    expect(Math.abs(V1 / Math.sin(icEst) - V2) / V2).toBeLessThan(0.01);
    expect(Math.abs(dipEst - DIP) * (180 / Math.PI)).toBeLessThan(0.5);
  });

  it('surface times within 1 % of the plane-refractor first arrival, both directions', () => {
    const src = 80;
    const T = solveTravelTimes(grid, model.velocity, model.active, { x: src, z: 0 });
    let max = 0;
    for (let ix = 0; ix < grid.nx; ix++) {
      const x = ix * grid.dx;
      if (Math.abs(x - src) <= 2 * grid.dx) continue;
      const exact = dippingSurfaceTime(V1, V2, D0, DIP, src, x);
      max = Math.max(max, Math.abs(T[ix] - exact) / exact);
    }
    expect(max).toBeLessThan(0.01);
  });

  it('rays of head waves reach the source in both directions; Σ length × slowness within 1 %', () => {
    const src = { x: 80, z: 0 };
    const T = solveTravelTimes(grid, model.velocity, model.active, src);
    for (const rx of [10, 150]) {
      const ray = traceRay(grid, T, model.velocity, model.active, { x: rx, z: 0 }, src);
      const exact = dippingSurfaceTime(V1, V2, D0, DIP, src.x, rx);
      expect(Math.abs(ray.time - exact) / exact).toBeLessThan(0.01);
      const n = ray.points.length / 2;
      // The traced part ends within 3 cell diagonals (smooth ground around the source), then a straight segment.
      expect(ray.points[2 * n - 2]).toBe(src.x);
      expect(ray.points[2 * n - 1]).toBe(src.z);
      expect(Math.hypot(ray.points[2 * n - 4] - src.x, ray.points[2 * n - 3] - src.z)).toBeLessThanOrEqual(3 * Math.SQRT2 * grid.dx * 1.01);
    }
  });
});
