/**
 * Snell's law at a flat interface: sin θ2 / sin θ1 = v2 / v1 for a transmitted ray
 * (Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.2). A ray is traced from a
 * deep receiver in the fast layer back to a shallow source in the slow layer; the angles of its
 * straight parts on each side (away from the interface) are compared within 1°.
 */
import { describe, expect, it } from 'vitest';
import { solveTravelTimes, traceRay } from '../../../shared/eikonal';
import { makeGrid, twoLayers } from './models';

const V1 = 1000;
const V2 = 1500;
const H = 10;
const grid = makeGrid(60, 30, 0.25);
const m = twoLayers(grid, V1, V2, () => H);

/** Direction from vertical (degrees) of the ray points lying between depths d1 and d2. */
function angleBetween(points: Float64Array, d1: number, d2: number): number {
  const sel: [number, number][] = [];
  for (let k = 0; k < points.length / 2; k++) {
    const d = -points[2 * k + 1];
    if (d >= d1 && d <= d2) sel.push([points[2 * k], d]);
  }
  // Least-squares x = a + b·depth; angle from vertical = atan|b|.
  const n = sel.length;
  const sd = sel.reduce((s, p) => s + p[1], 0);
  const sx = sel.reduce((s, p) => s + p[0], 0);
  const sdd = sel.reduce((s, p) => s + p[1] * p[1], 0);
  const sdx = sel.reduce((s, p) => s + p[1] * p[0], 0);
  const b = (n * sdx - sd * sx) / (n * sdd - sd * sd);
  return (Math.atan(Math.abs(b)) * 180) / Math.PI;
}

describe("Snell's law at a flat interface", () => {
  const src = { x: 5, z: -1 };
  const T = solveTravelTimes(grid, m.velocity, m.active, src);
  for (const rx of [14, 20, 26]) {
    it(`receiver at (${rx}, −29): sin θ2/sin θ1 = v2/v1 within 1°`, () => {
      const ray = traceRay(grid, T, m.velocity, m.active, { x: rx, z: -29 }, src);
      const theta1 = angleBetween(ray.points, 2, H - 1);
      const theta2 = angleBetween(ray.points, H + 1, 28);
      const predicted = (Math.asin((V2 / V1) * Math.sin((theta1 * Math.PI) / 180)) * 180) / Math.PI;
      expect(theta1).toBeGreaterThan(5); // a real oblique crossing, below the critical angle (41.8°)
      expect(Math.abs(theta2 - predicted)).toBeLessThan(1);
    });
  }
});
