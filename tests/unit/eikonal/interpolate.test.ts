/**
 * sampleTime: exact for fields that are linear in x and z (bilinear and cubic-convolution
 * interpolation reproduce linear functions; Keys 1981, IEEE Trans. ASSP 29(6)), including at a
 * point on the ground surface whose cell has air corners (first-order extrapolation from the
 * ground corners is exact for a linear field).
 */
import { describe, expect, it } from 'vitest';
import { EikonalInputError, sampleTime } from '../../../shared/eikonal';

const grid = { x0: 10, dx: 0.5, nx: 21, z0: 5, dz: 0.5, nz: 11 };
const n = grid.nx * grid.nz;
const linear = (x: number, z: number): number => 0.002 * x - 0.0013 * z + 0.05;

function field(active: Uint8Array): Float64Array {
  const T = new Float64Array(n);
  for (let iz = 0; iz < grid.nz; iz++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      const i = iz * grid.nx + ix;
      T[i] = active[i] ? linear(grid.x0 + ix * grid.dx, grid.z0 - iz * grid.dz) : Infinity;
    }
  }
  return T;
}

describe('sampleTime', () => {
  const all = new Uint8Array(n).fill(1);
  it('reproduces a linear field inside the grid and on its borders', () => {
    const T = field(all);
    for (const p of [{ x: 13.37, z: 2.21 }, { x: 10, z: 5 }, { x: 20, z: 0 }, { x: 11.1, z: 4.9 }, { x: 19.8, z: 0.2 }]) {
      expect(sampleTime(grid, T, all, p)).toBeCloseTo(linear(p.x, p.z), 12);
    }
  });

  it('works for a geophone on a sloping ground surface with air above it', () => {
    // Surface z = 4.1 − 0.1·(x − 10): nodes above it are air.
    const surface = (x: number) => 4.1 - 0.1 * (x - 10);
    const active = new Uint8Array(n);
    for (let iz = 0; iz < grid.nz; iz++) {
      for (let ix = 0; ix < grid.nx; ix++) active[iz * grid.nx + ix] = grid.z0 - iz * grid.dz <= surface(grid.x0 + ix * grid.dx) ? 1 : 0;
    }
    const T = field(active);
    for (const x of [10.3, 12.0, 14.77, 19.9]) {
      const p = { x, z: surface(x) };
      const t = sampleTime(grid, T, active, p);
      expect(Number.isFinite(t)).toBe(true);
      expect(t).toBeCloseTo(linear(p.x, p.z), 10);
    }
  });

  it('says so for a point in the air and returns Infinity for ground the wave never reached', () => {
    const active = new Uint8Array(n).fill(1);
    for (let i = 0; i < 3 * grid.nx; i++) active[i] = 0;
    const T = field(active);
    expect(() => sampleTime(grid, T, active, { x: 12, z: 4.8 })).toThrow(EikonalInputError);
    const unreached = new Float64Array(n).fill(Infinity);
    expect(sampleTime(grid, unreached, all, { x: 12, z: 2 })).toBe(Infinity);
  });
});
