/**
 * Rays traced back down the travel-time gradient.
 * - Uniform ground: rays are straight lines (Fermat's principle; Sethian 1999, §8.5).
 * - v = v0 + g·depth: rays are circular arcs centred on the line depth = −v0/g where the
 *   velocity would vanish (property of linear-velocity media; Telford, Geldart & Sheriff 1990,
 *   Applied Geophysics, 2nd ed., §4.3; Fomel, Luo & Zhao 2009 for the time formula).
 * - Σ length × slowness along the ray reproduces the travel time (within 0.5 %).
 */
import { describe, expect, it } from 'vitest';
import { solveTravelTimes, traceRay } from '../../../shared/eikonal';
import { gradientTime } from '../../../scripts/bench/exact';
import { makeGrid, sampleModel } from './models';

describe('rays in uniform ground', () => {
  const V = 1500;
  const grid = makeGrid(60, 20, 0.5);
  const m = sampleModel(grid, () => V);
  const src = { x: 10.3, z: -2.2 };
  const T = solveTravelTimes(grid, m.velocity, m.active, src);
  for (const rec of [{ x: 55, z: 0 }, { x: 40.25, z: -17.6 }, { x: 2, z: -19 }]) {
    it(`straight from (${rec.x}, ${rec.z}), time = r/v within 0.5 %`, () => {
      const ray = traceRay(grid, T, m.velocity, m.active, rec, src);
      const p = ray.points;
      expect(p[0]).toBe(rec.x);
      expect(p[1]).toBe(rec.z);
      expect(p[p.length - 2]).toBe(src.x);
      expect(p[p.length - 1]).toBe(src.z);
      // Distance of every point from the chord, in cells.
      const L = Math.hypot(src.x - rec.x, src.z - rec.z);
      let worst = 0;
      for (let k = 0; k < p.length / 2; k++) {
        const cross = Math.abs((src.x - rec.x) * (p[2 * k + 1] - rec.z) - (src.z - rec.z) * (p[2 * k] - rec.x)) / L;
        worst = Math.max(worst, cross);
      }
      expect(worst).toBeLessThan(0.25 * grid.dx);
      expect(Math.abs(ray.time - L / V) / (L / V)).toBeLessThan(0.005);
      // Per-cell lengths add up to the path length, and every cell index is a real cell.
      const total = ray.lengths.reduce((a, b) => a + b, 0);
      expect(Math.abs(total - L) / L).toBeLessThan(1e-3);
      for (const c of ray.cells) expect(c >= 0 && c < (grid.nx - 1) * (grid.nz - 1)).toBe(true);
    });
  }
});

describe('rays in a constant velocity gradient are circular arcs', () => {
  const V0 = 500;
  const G = 25;
  const grid = makeGrid(60, 20, 0.25);
  const m = sampleModel(grid, (_x, d) => V0 + G * d);
  const src = { x: 5.1, z: -0.3 };
  const T = solveTravelTimes(grid, m.velocity, m.active, src);
  for (const rec of [{ x: 50, z: 0 }, { x: 35, z: -8 }]) {
    it(`receiver (${rec.x}, ${rec.z}): points within 0.5 cell of the exact arc, time within 0.5 %`, () => {
      const ray = traceRay(grid, T, m.velocity, m.active, rec, src);
      // Exact arc: centre (xc, +v0/g) in elevation, through source and receiver.
      const zc = V0 / G;
      const xc = (rec.x ** 2 - src.x ** 2 + (rec.z - zc) ** 2 - (src.z - zc) ** 2) / (2 * (rec.x - src.x));
      const R = Math.hypot(src.x - xc, src.z - zc);
      let worst = 0;
      for (let k = 0; k < ray.points.length / 2; k++) worst = Math.max(worst, Math.abs(Math.hypot(ray.points[2 * k] - xc, ray.points[2 * k + 1] - zc) - R));
      expect(worst).toBeLessThan(0.5 * grid.dx);
      const exact = gradientTime(V0, G, src.x, src.z, rec.x, rec.z);
      expect(Math.abs(ray.time - exact) / exact).toBeLessThan(0.005);
    });
  }
});
