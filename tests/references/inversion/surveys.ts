/**
 * Synthetic refraction surveys with an independent truth for the inversion tests: first-arrival
 * times from the exact formula (constant gradient) or from the engine on a grid four times finer
 * than the inversion's (layered ground), plus seeded Gaussian noise of the stated σ.
 * Invented geometry: 49 geophones every 2 m, shots every 12 m and off both ends.
 */
import { sampleTime, solveTravelTimes } from '../../../shared/eikonal';
import { gradientTime } from '../../../shared/inversion/gradient-start';
import { normalDeviates } from '../../../shared/inversion/checkerboard';
import type { InversionShot } from '../../../shared/inversion/types';
import { rasteriseModel } from '../../../shared/model';
import type { ModelFile } from '../../../shared/schemas/model';

export const GEOPHONES = Array.from({ length: 49 }, (_, i) => 2 * i);
export const SHOT_XS = [-6, 0, 12, 24, 36, 48, 60, 72, 84, 96, 102];

function shotOf(sx: number, sz: number, rz: (x: number) => number, time: (rx: number) => number, sigma: number, noise: () => number): InversionShot {
  const xs = GEOPHONES.filter((x) => Math.abs(x - sx) > 1e-9);
  return {
    shotId: `S${sx}`,
    source: { x: sx, z: sz },
    receivers: Float64Array.from(xs.flatMap((x) => [x, rz(x)])),
    times: Float64Array.from(xs, (x) => time(x) + sigma * noise()),
    sigmas: new Float64Array(xs.length).fill(sigma),
  };
}

/** v = v0 + k·depth below a flat surface at z = 0; exact times (Slotnick 1959; from memory). */
export function gradientSurvey(v0: number, k: number, sigma: number, seed = 1): InversionShot[] {
  const noise = sigma > 0 ? normalDeviates(seed) : () => 0;
  return SHOT_XS.map((sx) => shotOf(sx, 0, () => 0, (rx) => gradientTime(Math.abs(rx - sx), v0, k), sigma, noise));
}

/** Flat layers under a flat surface at z = 0: `bases` are the depths of the interfaces (m); nodes every `spacing` m. */
export function layeredModel(velocities: number[], bases: number[], depth: number, spacing = 0.25): ModelFile {
  const x0 = -8, x1 = 104;
  const line = (z: number): [number, number][] => [[x0, z], [x1, z]];
  return {
    format: 'timefield-model/1',
    grid: { x0, dx: spacing, nx: (x1 - x0) / spacing + 1, z0: 0, dz: spacing, nz: depth / spacing + 1 },
    surface: line(0),
    layers: velocities.map((v, i) => ({ name: `layer ${i + 1}`, ...(i < bases.length ? { base: line(-bases[i]) } : {}), v_top: v, v_base: v })),
  } as ModelFile;
}

/** Times from the engine on the fine (0.25 m) layered model. */
export function layeredSurvey(model: ModelFile, sigma: number, seed = 1): InversionShot[] {
  const raster = rasteriseModel(model);
  const noise = normalDeviates(seed);
  return SHOT_XS.map((sx) => {
    const T = solveTravelTimes(raster.grid, raster.velocity, raster.active, { x: sx, z: 0 }, { cellSlowness: raster.cellSlowness });
    return shotOf(sx, 0, () => 0, (rx) => sampleTime(raster.grid, T, raster.active, { x: rx, z: 0 }), sigma, noise);
  });
}

/** The inversion grid: 1 m nodes over x −8…104 m, from z = 0 down to −depth. */
export function inversionGrid(depth: number) {
  return { x0: -8, dx: 1, nx: 113, z0: 0, dz: 1, nz: depth + 1 };
}

/** Depth (m) where a column of the result first reaches `v` going down, linearly interpolated. */
export function isoDepth(velocity: Float32Array, grid: { nx: number; nz: number; dz: number }, ix: number, v: number): number {
  for (let iz = 1; iz < grid.nz; iz++) {
    const a = velocity[(iz - 1) * grid.nx + ix], b = velocity[iz * grid.nx + ix];
    if (a < v && b >= v) return (iz - 1 + (v - a) / (b - a)) * grid.dz;
  }
  return Number.NaN;
}

export const median = (values: number[]): number => {
  const s = [...values].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
