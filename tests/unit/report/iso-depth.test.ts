/**
 * Edge cases of the iso-velocity depth (shared/model/iso-depth.ts); the exact-answer checks are in
 * tests/references/report/iso-depth.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { isoVelocityDepth } from '../../../shared/model/iso-depth';

function raster(layers: unknown[], surface?: [number, number][]) {
  const r = parseModelFile({ format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 11, z0: 50, dz: 1, nz: 21 }, surface, layers });
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return rasteriseModel(r.model);
}
const flat = (z: number): [number, number][] => [[0, z], [10, z]];

describe('isoVelocityDepth', () => {
  it('only the first crossing counts: a slow layer below a fast one does not move it', () => {
    const m = raster([
      { base: flat(45.5), v_top: 500, v_base: 500 },
      { base: flat(40.5), v_top: 2500, v_base: 2500 },
      { v_top: 1000, v_base: 1000 },
    ]);
    // Nodes at 46 (500) and 45 (2500): linear interpolation puts 1500 m/s half-way, at 45.5 m.
    const got = isoVelocityDepth(m, 1500, 5);
    expect(got.elevation).toBeCloseTo(45.5, 9);
    expect(got.depth).toBeCloseTo(4.5, 9);
  });

  it('rock at the surface gives depth 0', () => {
    const m = raster([{ base: flat(45.5), v_top: 3000, v_base: 3000 }, { v_top: 800, v_base: 800 }], flat(48.2));
    expect(isoVelocityDepth(m, 2000, 3)).toEqual({ x: 3, groundZ: 48.2, depth: 0, elevation: 48.2 });
  });

  it('depth is measured from the ground surface, not the grid top', () => {
    const m = raster([{ base: flat(40), v_top: 600, v_base: 600 }, { v_top: 1800, v_base: 1800 }], flat(47));
    // Node 40 is rock (a node on a base belongs to the layer below), node 41 sand: 1200 m/s half-way.
    const got = isoVelocityDepth(m, 1200, 2);
    expect(got.elevation).toBeCloseTo(40.5, 9);
    expect(got.depth).toBeCloseTo(6.5, 9);
  });

  it('blends the two node columns either side of x', () => {
    const r = parseModelFile({ format: 'timefield-model/1', grid: { x0: 0, dx: 2, nx: 2, z0: 10, dz: 1, nz: 11 }, velocity: [
      ...[500, 500], ...[500, 500], ...[500, 500], ...[500, 500], ...[1000, 500], ...[1000, 1000], ...[1000, 1000],
      ...[1000, 1000], ...[1000, 1000], ...[1000, 1000], ...[1000, 1000],
    ] });
    if (!r.ok) throw new Error('model');
    const m = rasteriseModel(r.model);
    // At x = 1 the column reads 500 (z 7), 750 (z 6), 1000 (z 5): 750 m/s is met at z 6.
    expect(isoVelocityDepth(m, 750, 1).elevation).toBeCloseTo(6, 9);
    expect(isoVelocityDepth(m, 750, 0).elevation).toBeCloseTo(6.5, 9);
    expect(isoVelocityDepth(m, 750, 2).elevation).toBeCloseTo(5.5, 9);
  });

  it('refuses positions off the grid and velocities that are not > 0', () => {
    const m = raster([{ v_top: 500, v_base: 900 }]);
    expect(() => isoVelocityDepth(m, 700, -0.5)).toThrow(/outside the model/);
    expect(() => isoVelocityDepth(m, 700, Number.NaN)).toThrow(/outside the model/);
    expect(() => isoVelocityDepth(m, Number.NaN, 3)).toThrow(/iso-velocity/);
    expect(() => isoVelocityDepth(m, 0, 3)).toThrow(/iso-velocity/);
    expect(isoVelocityDepth(m, 700, 10).depth).not.toBeNull(); // the last column is inside
  });
});
