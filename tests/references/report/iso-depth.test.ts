/**
 * Depth to an iso-velocity surface against answers fixed by the model definition itself
 * (FORMATS.md §1 and shared/model/rasterise.ts: v = v_top + (v_base − v_top)·(top − z)/(top − base)
 * inside a layer; a node on a base belongs to the layer below).
 *
 * 1. One layer whose velocity grows linearly with depth from v_top at the ground to v_base at the
 *    grid bottom: gradient g = (v_base − v_top)/H, so v* is reached at depth (v* − v_top)/g
 *    (elementary algebra on the model definition). Linear interpolation between nodes of a
 *    linear function is exact, so only Float32 rounding of the node velocities remains.
 * 2. The same with a sloping ground surface: the layer's gradient hangs from the surface at each x,
 *    so at node columns depth = (v* − v_top)·(surface − bottom)/(v_base − v_top).
 * 3. Two uniform layers with a dipping interface drawn between node rows: the crossing of any
 *    v* between the two velocities lies within one row spacing dz of the drawn interface (the
 *    rasteriser resolves interfaces to dz; model definition).
 */
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel, evalPolyline } from '../../../shared/model';
import { isoVelocityDepth, isoVelocityProfile } from '../../../shared/model/iso-depth';

function raster(json: unknown) {
  const r = parseModelFile(json);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return rasteriseModel(r.model);
}

describe('linear gradient below a flat ground surface', () => {
  const vTop = 500;
  const vBase = 2500;
  const H = 25; // grid top 100 m to bottom 75 m
  const m = raster({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 2, nx: 21, z0: 100, dz: 0.5, nz: 51 },
    layers: [{ name: 'graded till', v_top: vTop, v_base: vBase }],
  });
  const g = (vBase - vTop) / H; // 80 1/s

  it.each([700, 1234, 1500, 2111.5])('v* = %d m/s lies at depth (v* − v_top)/g', (vStar) => {
    const want = (vStar - vTop) / g;
    for (const x of [0, 3.3, 17, 40]) {
      const got = isoVelocityDepth(m, vStar, x);
      expect(got.depth).not.toBeNull();
      expect(Math.abs(got.depth! - want)).toBeLessThan(1e-4);
      expect(Math.abs(got.elevation! - (100 - want))).toBeLessThan(1e-4);
      expect(got.groundZ).toBe(100);
    }
  });

  it('a velocity the layer never reaches gives null', () => {
    expect(isoVelocityDepth(m, vBase + 1, 10)).toEqual({ x: 10, groundZ: 100, depth: null, elevation: null });
  });
});

describe('linear gradient hanging from a sloping ground surface', () => {
  const vTop = 400;
  const vBase = 2000;
  const surface = [[0, 98], [20, 99.3], [40, 96.1]] as [number, number][];
  const bottom = 80; // z0 100, nz 41, dz 0.5
  const m = raster({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 1, nx: 41, z0: 100, dz: 0.5, nz: 41 },
    surface,
    layers: [{ v_top: vTop, v_base: vBase }],
  });

  it('at node columns depth = (v* − v_top)·(surface − bottom)/(v_base − v_top)', () => {
    const vStar = 1300;
    const xs = [0, 5, 12, 20, 27, 33, 40];
    for (const got of isoVelocityProfile(m, vStar, xs)) {
      const s = evalPolyline(surface, got.x);
      const want = ((vStar - vTop) * (s - bottom)) / (vBase - vTop);
      expect(got.groundZ).toBeCloseTo(s, 9);
      expect(Math.abs(got.depth! - want)).toBeLessThan(1e-4);
      expect(got.elevation! + got.depth!).toBeCloseTo(s, 9);
    }
  });
});

describe('two uniform layers, dipping interface between node rows', () => {
  const base = [[0, 95.13], [60, 88.77]] as [number, number][];
  const dz = 0.4;
  const m = raster({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 1.5, nx: 41, z0: 100, dz, nz: 51 },
    layers: [
      { name: 'sand', base, v_top: 600, v_base: 600 },
      { name: 'rock', v_top: 2600, v_base: 2600 },
    ],
  });

  it.each([700, 1600, 2550])('v* = %d m/s is found within dz of the drawn interface', (vStar) => {
    for (let x = 0; x <= 60; x += 2.5) {
      const got = isoVelocityDepth(m, vStar, x);
      const zInterface = evalPolyline(base, x);
      expect(Math.abs(got.elevation! - zInterface)).toBeLessThanOrEqual(dz + 1e-9);
      expect(got.depth!).toBeCloseTo(100 - got.elevation!, 9);
    }
  });
});
