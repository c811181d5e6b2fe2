/**
 * The solve the product runs (model file → rasteriser → shared model → solveShot) hands the
 * ground surface to the solver, so geophones beside a shot on sloping ground get the straight
 * time. Exact: distance / v in uniform ground (the segment under a plane surface stays in the
 * ground). Issue 14 target: ≤ 0.5 % at 1–5 m.
 */
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { shareModel } from '../../../worker/threads/shared-model';
import { solveShot } from '../../../worker/threads/solve-shot';

const V = 1200;
const SLOPE = Math.tan((18 * Math.PI) / 180);

describe('solve of a shot on sloping ground', () => {
  it('geophones 1–5 m away within 0.5 % of distance / v', () => {
    const parsed = parseModelFile({
      format: 'timefield-model/1',
      grid: { x0: 0, dx: 0.5, nx: 81, z0: 1, dz: 0.5, nz: 41 },
      surface: [[0, 0], [40, -40 * SLOPE]],
      layers: [{ name: 'ground', v_top: V, v_base: V }],
    });
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const raster = rasteriseModel(parsed.model);
    const source = { x: 20.37, z: raster.surfaceZ(20.37) };
    const offsets = [-5, -3.2, -1, 1, 2.1, 4.4];
    const receivers = new Float64Array(offsets.flatMap((d) => [source.x + d, raster.surfaceZ(source.x + d)]));
    const r = solveShot({ grid: raster.grid, ...shareModel(raster), source, receivers, order: 2 });
    if (!r.ok) throw new Error(r.message);
    offsets.forEach((_, i) => {
      const exact = Math.hypot(receivers[2 * i] - source.x, receivers[2 * i + 1] - source.z) / V;
      expect(Math.abs(r.times[i] - exact) / exact).toBeLessThanOrEqual(0.005);
    });
  });
});
