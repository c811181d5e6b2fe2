/**
 * Layered model files → rasterisation → solver, checked against textbook travel times.
 * These confirm that the layer rules (v_top at the layer top, v_base at its base, linear in
 * depth; interfaces from the base polylines) build the medium the formulas describe.
 *
 * 1. Constant vertical gradient v(d) = v0 + k·d: time between two points
 *    T = (1/k)·arccosh(1 + k²r² / (2·v_a·v_b)), r the straight distance, v_a, v_b the velocities
 *    at the two ends. Slotnick (1959), "Lessons in Seismic Computing", SEG — from memory; the
 *    same formula is the linear-gradient test of Fomel, Luo & Zhao (2009), J. Comput. Phys. 228.
 * 2. Two homogeneous layers, flat interface at depth h: the head wave arrives at offset x at
 *    T = x/v2 + 2h·cos(i_c)/v1, sin(i_c) = v1/v2, and the first arrival is min(direct x/v1, head).
 *    Sheriff & Geldart (1995), "Exploration Seismology", 2nd ed., Cambridge Univ. Press,
 *    chapter on refraction (two-layer case) — from memory.
 * Solves pass the rasteriser's cell slownesses, as every caller in the product does.
 */
import { describe, expect, it } from 'vitest';
import { sampleTime, solveTravelTimes } from '../../../shared/eikonal';
import { parseModelFile, rasteriseModel } from '../../../shared/model';

function surfaceTimes(json: unknown, source: { x: number; z: number }, xs: number[], order: 1 | 2): number[] {
  const r = parseModelFile(json);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  const m = rasteriseModel(r.model);
  const T = solveTravelTimes(m.grid, m.velocity, m.active, source, { order, cellSlowness: m.cellSlowness });
  return xs.map((x) => sampleTime(m.grid, T, m.active, { x, z: m.surfaceZ(x) }));
}
const offsets = Array.from({ length: 20 }, (_, i) => 5 + 5 * i); // 5 … 100 m
const maxRelError = (got: number[], want: number[]) => Math.max(...got.map((t, i) => Math.abs(t - want[i]) / want[i]));

describe('constant-gradient layer (Slotnick 1959)', () => {
  const v0 = 500;
  const k = 20; // 1/s: v_base at 40 m depth = 500 + 20·40 = 1300 m/s
  const model = {
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 0.25, nx: 481, z0: 0, dz: 0.25, nz: 161 },
    layers: [{ name: 'till', v_top: v0, v_base: v0 + k * 40 }],
  };
  const exact = offsets.map((x) => Math.acosh(1 + (k * k * x * x) / (2 * v0 * v0)) / k);

  it('second order within 0.1 %', () => {
    expect(maxRelError(surfaceTimes(model, { x: 0, z: 0 }, offsets, 2), exact)).toBeLessThan(1e-3);
  });
  it('first order within 1 %', () => {
    expect(maxRelError(surfaceTimes(model, { x: 0, z: 0 }, offsets, 1), exact)).toBeLessThan(1e-2);
  });
  it('under a tilted surface the gradient follows depth below the surface: exact for the rotated gradient', () => {
    // v = v0 + k·(surface(x) − z) with a planar surface of slope a is a constant-gradient medium
    // with |∇v| = k·sqrt(1 + a²), normal to the surface; source and receivers on the surface have v = v0.
    const a = 0.5 / 120;
    const tilted = { ...model, grid: { ...model.grid, z0: 1 }, surface: [[0, 0.5], [120, 1]] };
    const kk = k * Math.sqrt(1 + a * a);
    const want = offsets.map((x) => Math.acosh(1 + (kk * kk * (x * x * (1 + a * a))) / (2 * v0 * v0)) / kk);
    expect(maxRelError(surfaceTimes(tilted, { x: 0, z: 0.5 }, offsets, 2), want)).toBeLessThan(5e-3); // 0.5 %: surface receivers sit in cells cut by the surface
  });
});

describe('two layers, head wave (Sheriff & Geldart 1995)', () => {
  const v1 = 500;
  const v2 = 2000;
  const ic = Math.asin(v1 / v2);
  const firstArrival = (x: number, h: number) => Math.min(x / v1, x / v2 + (2 * h * Math.cos(ic)) / v1);
  const twoLayer = (h: number) => ({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 0.25, nx: 481, z0: 0, dz: 0.25, nz: 81 },
    layers: [
      { name: 'dry sand', base: [[0, -h], [120, -h]], v_top: v1, v_base: v1 },
      { name: 'limestone', v_top: v2, v_base: v2 },
    ],
  });

  it('interface on a node row (h = 5 m): second order within 0.1 %, first order within 1 %', () => {
    const exact = offsets.map((x) => firstArrival(x, 5));
    expect(maxRelError(surfaceTimes(twoLayer(5), { x: 0, z: 0 }, offsets, 2), exact)).toBeLessThan(1e-3);
    expect(maxRelError(surfaceTimes(twoLayer(5), { x: 0, z: 0 }, offsets, 1), exact)).toBeLessThan(1e-2);
  });

  // Before the cell slownesses an interface between rows acted on the lower row: up to 3 % late.
  for (const h of [5.02, 5.1, 5.125, 5.2, 7.33]) {
    it(`interface between node rows (h = ${h} m) acts where it is drawn: second order within 0.5 %`, () => {
      const exact = offsets.map((x) => firstArrival(x, h));
      expect(maxRelError(surfaceTimes(twoLayer(h), { x: 0, z: 0 }, offsets, 2), exact)).toBeLessThan(5e-3);
    });
  }

  it('the cell slownesses matter: without them the same model at h = 5.1 m is more than 0.5 % late', () => {
    const r = parseModelFile(twoLayer(5.1));
    if (!r.ok) throw new Error('model must parse');
    const m = rasteriseModel(r.model);
    const T = solveTravelTimes(m.grid, m.velocity, m.active, { x: 0, z: 0 }, { order: 2 });
    const got = offsets.map((x) => sampleTime(m.grid, T, m.active, { x, z: 0 }));
    expect(maxRelError(got, offsets.map((x) => firstArrival(x, 5.1)))).toBeGreaterThan(5e-3);
  });
});
