/**
 * Flat two-layer refraction (Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed.,
 * Cambridge Univ. Press, §4.3): head wave T = x/V2 + 2h·cos(ic)/V1, sin ic = V1/V2, starting at
 * the critical distance 2h·tan(ic); it overtakes the direct wave x/V1 at the crossover distance
 * 2h·√((V2+V1)/(V2−V1)). Brief's case: 500 over 2000 m/s, interface 10 m deep, 0.5 m cells.
 */
import { describe, expect, it } from 'vitest';
import { sampleTime, solveTravelTimes, traceRay } from '../../../shared/eikonal';
import { crossoverDistance, twoLayerSurfaceTime } from '../../../scripts/bench/exact';
import { makeGrid, twoLayers } from './models';

const V1 = 500;
const V2 = 2000;
const H = 10;
const grid = makeGrid(120, 20, 0.5);
const model = twoLayers(grid, V1, V2, () => H);
const source = { x: 0, z: 0 };
const T = solveTravelTimes(grid, model.velocity, model.active, source, { order: 2 });
const ic = Math.asin(V1 / V2);

describe('two-layer head wave', () => {
  it('surface times within 0.5 % of the first-arrival formula beyond two cells', () => {
    let max = 0;
    for (let ix = 3; ix < grid.nx; ix++) {
      const exact = twoLayerSurfaceTime(V1, V2, H, ix * grid.dx);
      max = Math.max(max, Math.abs(T[ix] - exact) / exact);
    }
    expect(max).toBeLessThan(0.005);
  });

  it('apparent velocity beyond crossover is V2 (slope of the travel-time curve)', () => {
    const x1 = 60;
    const x2 = 110;
    const slope = (sampleTime(grid, T, model.active, { x: x2, z: 0 }) - sampleTime(grid, T, model.active, { x: x1, z: 0 })) / (x2 - x1);
    expect(1 / slope).toBeGreaterThan(V2 * 0.995);
    expect(1 / slope).toBeLessThan(V2 * 1.005);
  });

  it('intercept time 2h·cos(ic)/V1 from the straight line through far receivers', () => {
    const t60 = sampleTime(grid, T, model.active, { x: 60, z: 0 });
    const t110 = sampleTime(grid, T, model.active, { x: 110, z: 0 });
    const intercept = t60 - (60 * (t110 - t60)) / 50;
    expect(intercept).toBeCloseTo((2 * H * Math.cos(ic)) / V1, 4); // 38.7 ms, to 0.05 ms
  });

  it('crossover distance from the intersection of the two straight branches (field practice), within one cell', () => {
    // Least-squares lines through the direct branch (x ≤ 20 m) and the head-wave branch (x ≥ 40 m).
    const fit = (lo: number, hi: number): [number, number] => {
      let n = 0, sx = 0, st = 0, sxx = 0, sxt = 0;
      for (let ix = 0; ix < grid.nx; ix++) {
        const x = ix * grid.dx;
        if (x < lo || x > hi) continue;
        n++; sx += x; st += T[ix]; sxx += x * x; sxt += x * T[ix];
      }
      const slope = (n * sxt - sx * st) / (n * sxx - sx * sx);
      return [slope, (st - slope * sx) / n];
    };
    const [a1, b1] = fit(2, 20);
    const [a2, b2] = fit(40, 120);
    const xCross = (b2 - b1) / (a1 - a2);
    expect(Math.abs(xCross - crossoverDistance(V1, V2, H))).toBeLessThan(grid.dx); // 25.82 m
  });

  it('before the crossover the first-arrival ray is the direct wave along the surface (never reaches the refractor)', () => {
    const ray = traceRay(grid, T, model.velocity, model.active, { x: 20, z: 0 }, source);
    for (let k = 0; k < ray.points.length / 2; k++) expect(ray.points[2 * k + 1]).toBeGreaterThan(-1e-6 - grid.dz);
  });

  it('the ray of a far receiver runs along the refractor from h·tan(ic) after the source to h·tan(ic) before the receiver', () => {
    const rx = 80;
    const ray = traceRay(grid, T, model.velocity, model.active, { x: rx, z: 0 }, source);
    const xs: number[] = [];
    for (let k = 0; k < ray.points.length / 2; k++) if (ray.points[2 * k + 1] <= -H + 1e-6) xs.push(ray.points[2 * k]);
    const crit = H * Math.tan(ic); // 2.58 m: half the critical distance
    expect(Math.abs(Math.min(...xs) - crit)).toBeLessThan(2 * grid.dx);
    expect(Math.abs(Math.max(...xs) - (rx - crit))).toBeLessThan(2 * grid.dx);
    // Σ length × slowness reproduces the head-wave time.
    const exact = twoLayerSurfaceTime(V1, V2, H, rx);
    expect(Math.abs(ray.time - exact) / exact).toBeLessThan(0.005);
  });
});
