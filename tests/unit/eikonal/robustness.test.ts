/**
 * Random models (velocities 100–6000 m/s with jumps, random air pockets, random sources):
 * the solver never returns NaN or a negative time, never beats the straight line at the fastest
 * velocity present (no signal outruns the fastest medium — common practice, no source needed),
 * marks air as Infinity, and rays and samples stay finite. Small grids, fixed seeds.
 */
import { describe, expect, it } from 'vitest';
import { sampleTime, solveTravelTimes, traceRay } from '../../../shared/eikonal';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

describe('random models', () => {
  for (let seed = 1; seed <= 12; seed++) {
    it(`seed ${seed}`, () => {
      const rand = rng(seed);
      const nx = 2 + Math.floor(rand() * 40);
      const nz = 2 + Math.floor(rand() * 25);
      const h = 0.25 + rand() * 2;
      const grid = { x0: -5 + rand() * 10, dx: h, nx, z0: rand() * 20, dz: h * (0.5 + rand()), nz };
      const n = nx * nz;
      const velocity = new Float32Array(n);
      const active = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        velocity[i] = rand() < 0.2 ? 100 + rand() * 5900 : 300 + 200 * Math.floor(i / nx / 4);
        active[i] = rand() < 0.12 ? 0 : 1;
      }
      // Bottom row always ground; pick a source in a cell with a ground corner.
      active.fill(1, (nz - 1) * nx);
      const source = { x: grid.x0 + rand() * (nx - 1) * h, z: grid.z0 - (nz - 1) * grid.dz + rand() * 0.99 * grid.dz };
      for (const order of [1, 2] as const) {
        const T = solveTravelTimes(grid, velocity, active, source, { order });
        let vmax = 0;
        for (let i = 0; i < n; i++) if (active[i]) vmax = Math.max(vmax, velocity[i]);
        for (let i = 0; i < n; i++) {
          const t = T[i];
          expect(Number.isNaN(t)).toBe(false);
          if (!active[i]) {
            expect(t).toBe(Infinity);
            continue;
          }
          expect(t).toBeGreaterThanOrEqual(0);
          const ix = i % nx;
          const iz = (i - ix) / nx;
          const r = Math.hypot(grid.x0 + ix * h - source.x, grid.z0 - iz * grid.dz - source.z);
          if (Number.isFinite(t)) expect(t).toBeGreaterThanOrEqual((r / vmax) * (1 - 1e-9));
        }
        // A ray from a reached bottom-row node, and a sample there, are finite.
        const rx = grid.x0 + Math.floor(rand() * nx) * h;
        const receiver = { x: rx, z: grid.z0 - (nz - 1) * grid.dz };
        const t = sampleTime(grid, T, active, receiver);
        if (Number.isFinite(t)) {
          const ray = traceRay(grid, T, velocity, active, receiver, source);
          expect(Number.isFinite(ray.time)).toBe(true);
          expect(ray.points.every(Number.isFinite)).toBe(true);
        }
      }
    });
  }
});
