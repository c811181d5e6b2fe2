/**
 * Uniform ground under a topographic surface, built through the model file and rasteriser as the
 * product does, with exact times from the in-ground shortest path (ground-path.ts). Shots and
 * geophones sit on the surface; times at the geophones are read with sampleTime, as the product
 * reads them (issue 14: 0.5 m grid, surface shots, geophones every 2.5 m).
 */
import { parseModelFile, rasteriseModel, type RasterModel } from '../../shared/model';
import { sampleTime, solveTravelTimes, type Point } from '../../shared/eikonal';
import { groundPathLengths, type Surface } from './ground-path';

export const SURFACE_V = 1500; // m/s
export const SURFACE_SPACING = 0.5; // m
export const GEOPHONE_STEP = 2.5; // m

export interface SurfaceCase {
  name: string;
  surface: Surface;
  raster: RasterModel;
  shots: Point[];
  /** Geophones per shot (the shot itself and those within `minOffset` left out). */
  geophones: Point[];
  minOffset: number;
}

function sampled(width: number, f: (x: number) => number, step = 0.1): Point[] {
  const pts: Point[] = [];
  for (let i = 0; i * step <= width + 1e-9; i++) pts.push({ x: i * step, z: f(i * step) });
  return pts;
}

function build(name: string, surface: Point[], width: number, top: number, bottom: number, shotXs: number[], minOffset: number): SurfaceCase {
  const h = SURFACE_SPACING;
  const parsed = parseModelFile({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: h, nx: Math.round(width / h) + 1, z0: top, dz: h, nz: Math.round((top - bottom) / h) + 1 },
    surface: surface.map((p) => [p.x, p.z]),
    layers: [{ name: 'ground', v_top: SURFACE_V, v_base: SURFACE_V }],
  });
  if (!parsed.ok) throw new Error(`surface bench model is invalid: ${JSON.stringify(parsed.issues)}`);
  const raster = rasteriseModel(parsed.model);
  const on = (x: number): Point => ({ x, z: raster.surfaceZ(x) });
  const geophones: Point[] = [];
  for (let x = 0; x <= width + 1e-9; x += GEOPHONE_STEP) geophones.push(on(x));
  return { name, surface, raster, shots: shotXs.map(on), geophones, minOffset };
}

/** Smooth Gaussian hill 8 m high, σ = 15 m, on a 100 m line (sampled every 0.1 m). */
export function hillCase(): SurfaceCase {
  const s = sampled(100, (x) => 8 * Math.exp(-((x - 50) ** 2) / (2 * 15 * 15)));
  return build('hill', s, 100, 10, -30, [0, 31.3, 50, 77.7], 1);
}

/** V-shaped valley, flanks 20°, 10 m deep, on a 100 m line. */
export function valleyCase(): SurfaceCase {
  const k = Math.tan((20 * Math.PI) / 180);
  const depth = 10;
  const half = depth / k;
  const s: Point[] = [{ x: 0, z: 0 }, { x: 50 - half, z: 0 }, { x: 50, z: -depth }, { x: 50 + half, z: 0 }, { x: 100, z: 0 }];
  return build('valley', s, 100, 2, -40, [0, 20.1, 38.9, 50, 72.4], 1);
}

/** Plane ground sloping `deg` degrees; the shot mid-line, receivers 1–5 m along the surface. */
export function slopeCase(deg: number): SurfaceCase {
  const k = Math.tan((deg * Math.PI) / 180);
  const s: Point[] = [{ x: 0, z: 0 }, { x: 60, z: -60 * k }];
  const c = build(`slope-${deg}deg`, s, 60, 1, -60 * k - 20, [30.13], 0);
  const shot = c.shots[0];
  c.geophones = [];
  for (const d of [1, 1.5, 2, 2.5, 3, 4, 5]) for (const sgn of [-1, 1]) {
    const x = shot.x + (sgn * d) / Math.hypot(1, k);
    c.geophones.push({ x, z: c.raster.surfaceZ(x) });
  }
  return c;
}

export interface SurfaceErrors {
  name: string;
  maxMs: number;
  rmsMs: number;
  maxRel: number;
  /** Most negative computed − exact (ms): an early time, e.g. one taken through air. */
  earliestMs: number;
  count: number;
}

/** Solve every shot of the case and compare the geophone times with the exact ones. */
export function measureSurfaceCase(c: SurfaceCase, order: 1 | 2 = 2): SurfaceErrors {
  const { grid, velocity, active } = c.raster;
  let max = 0;
  let sum2 = 0;
  let maxRel = 0;
  let count = 0;
  let earliest = 0;
  for (const shot of c.shots) {
    const T = solveTravelTimes(grid, velocity, active, shot, { order, surface: c.surface });
    const rec = c.geophones.filter((g) => Math.hypot(g.x - shot.x, g.z - shot.z) > c.minOffset);
    const exact = groundPathLengths(c.surface, shot, rec).map((d) => d / SURFACE_V);
    rec.forEach((g, i) => {
      const signed = sampleTime(grid, T, active, g, shot) - exact[i];
      const e = Math.abs(signed);
      earliest = Math.min(earliest, signed);
      max = Math.max(max, e);
      maxRel = Math.max(maxRel, e / exact[i]);
      sum2 += e * e;
      count++;
    });
  }
  return { name: c.name, maxMs: 1000 * max, rmsMs: 1000 * Math.sqrt(sum2 / count), maxRel, earliestMs: 1000 * earliest, count };
}
