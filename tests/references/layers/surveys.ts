/**
 * Refraction surveys with an independent truth for the layer-method tests:
 *  - planar two-layer ground (flat or dipping) with exact first-arrival times: the direct wave
 *    and the head wave t = x·sin(i_c ± δ)/V1 + 2h·cos(i_c)/V1 (h normal to the refractor under
 *    the shot; Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.3, eq. 4.44);
 *  - an undulating refractor under gentle topography, times from the engine on a 0.25 m grid
 *    (four times finer than the product's usual 1 m).
 * Invented geometry: 48 geophones every 2 m (0–94 m), shots every 24 m, just off both ends and
 * 40 m off both ends (far shots put the refractor under every geophone, as in the field).
 * Seeded Gaussian noise of the stated σ on every time.
 */
import { sampleTime, solveTravelTimes } from '../../../shared/eikonal';
import { normalDeviates } from '../../../shared/inversion/checkerboard';
import type { LayerShot } from '../../../shared/layers';
import { evalPolyline, rasteriseModel } from '../../../shared/model';
import type { ModelFile } from '../../../shared/schemas/model';

export const GEOPHONES = Array.from({ length: 48 }, (_, i) => 2 * i);
export const SHOTS = [-40, -4, 23, 47, 71, 98, 134];

export interface Survey {
  shots: LayerShot[];
  surfaceZ: (x: number) => number;
  /** True vertical depth of the refractor below the ground at x. */
  depth: (x: number) => number;
  v1: number;
  v2: number;
}

function shot(sx: number, sz: number, z: (x: number) => number, time: (x: number) => number, sigma: number, noise: () => number): LayerShot {
  const xs = GEOPHONES.filter((x) => Math.abs(x - sx) > 1e-9);
  return {
    shotId: `S${sx}`,
    source: { x: sx, z: sz },
    receivers: Float64Array.from(xs.flatMap((x) => [x, z(x)])),
    times: Float64Array.from(xs, (x) => time(x) + sigma * noise()),
    sigmas: new Float64Array(xs.length).fill(Math.max(sigma, 0.0003)),
  };
}

/** Flat ground at z = 0 over a planar refractor at vertical depth h0 + x·tan(dip) (dip in degrees, > 0 deepening to +x). */
export function planarSurvey(v1: number, v2: number, h0: number, dipDeg: number, sigma: number, seed = 1): Survey {
  const dip = (dipDeg * Math.PI) / 180;
  const ic = Math.asin(v1 / v2);
  const noise = normalDeviates(seed);
  const depth = (x: number) => h0 + x * Math.tan(dip);
  const shots = SHOTS.map((sx) => {
    const normal = depth(sx) * Math.cos(dip);
    return shot(sx, 0, () => 0, (x) => {
      const off = x - sx;
      const direct = Math.abs(off) / v1;
      const down = off > 0 ? dip : -dip;
      const head = (Math.abs(off) * Math.sin(ic + down)) / v1 + (2 * normal * Math.cos(ic)) / v1;
      // The head wave exists beyond the critical distance (2h·tan i_c, flat-layer form is enough here).
      return Math.abs(off) > 2 * normal * Math.tan(ic) ? Math.min(direct, head) : direct;
    }, sigma, noise);
  });
  return { shots, surfaceZ: () => 0, depth, v1, v2 };
}

/** Gentle topography (± `topography` m) over an undulating refractor (`relief` m peak to peak), times from the engine on a 0.25 m grid. */
export function undulatingSurvey(v1: number, v2: number, relief: number, topography: number, sigma: number, seed = 1): Survey {
  const x0 = -44, x1 = 140;
  const surfaceAt = (x: number) => 100 + topography * Math.sin((2 * Math.PI * x) / 130); // 2.5 m: slopes under 7°
  const baseAt = (x: number) => 88 + (relief / 2) * Math.sin((2 * Math.PI * (x - 10)) / 90) - 0.03 * x; // slopes up to 10°
  const xs = Array.from({ length: (x1 - x0) / 2 + 1 }, (_, i) => x0 + 2 * i);
  const model: ModelFile = {
    format: 'timefield-model/1',
    grid: { x0, dx: 0.25, nx: (x1 - x0) / 0.25 + 1, z0: 103, dz: 0.25, nz: 161 },
    surface: xs.map((x): [number, number] => [x, surfaceAt(x)]),
    layers: [
      { name: 'overburden', base: xs.map((x): [number, number] => [x, baseAt(x)]), v_top: v1, v_base: v1 },
      { name: 'refractor', v_top: v2, v_base: v2 },
    ],
  } as ModelFile;
  const raster = rasteriseModel(model);
  const noise = normalDeviates(seed);
  const surfaceZ = (x: number) => evalPolyline(model.surface!, x);
  const shots = SHOTS.map((sx) => {
    const source = { x: sx, z: surfaceZ(sx) };
    const T = solveTravelTimes(raster.grid, raster.velocity, raster.active, source, { cellSlowness: raster.cellSlowness });
    return shot(sx, source.z, surfaceZ, (x) => sampleTime(raster.grid, T, raster.active, { x, z: surfaceZ(x) }), sigma, noise);
  });
  return { shots, surfaceZ, depth: (x) => surfaceZ(x) - evalPolyline(model.layers![0].base!, x), v1, v2 };
}

export function quantile(values: number[], q: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
}
