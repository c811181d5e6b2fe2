/**
 * The per-shot thread task and the pool. Reference: straight-ray time T = r / v in a
 * homogeneous medium (common practice, no source). The pool must give the same numbers as
 * the in-process task (same code on shared memory), in job order.
 */
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { ShotPool, ShotSolveError } from '../../../worker/threads/shot-pool';
import { solveShot } from '../../../worker/threads/solve-shot';

const parsed = parseModelFile(JSON.parse(readFileSync(new URL('../../../fixtures/models/homogeneous.model.json', import.meta.url), 'utf8')));
if (!parsed.ok) throw new Error('fixture must parse');
const model = rasteriseModel(parsed.model);
const shared = <T extends Float32Array | Uint8Array>(a: T): SharedArrayBuffer => {
  const buf = new SharedArrayBuffer(a.byteLength);
  new (a.constructor as new (b: SharedArrayBuffer) => T)(buf).set(a);
  return buf;
};
const receivers = new Float64Array([5, 0, 12.25, 0, 30, -4.5, 40, -10]);
const jobs = [0, 10, 27.5, 40].map((x) => ({ source: { x, z: -1 }, receivers }));

describe('solveShot (in process)', () => {
  it('returns receiver times ≈ r / v', () => {
    const r = solveShot({ grid: model.grid, velocity: shared(model.velocity), active: shared(model.active), source: { x: 10, z: -1 }, receivers, order: 2 });
    if (!r.ok) throw new Error(r.message);
    for (let i = 0; i < r.times.length; i++) {
      const exact = Math.hypot(receivers[2 * i] - 10, receivers[2 * i + 1] + 1) / 1000;
      expect(Math.abs(r.times[i] - exact)).toBeLessThan(1e-5);
    }
  });

  it('reports bad input as a message, not a throw', () => {
    const r = solveShot({ grid: model.grid, velocity: shared(model.velocity), active: shared(model.active), source: { x: 99, z: 0 }, receivers, order: 2 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/outside the model grid/);
  });
});

describe('ShotPool (worker threads, loaded from the test runner)', () => {
  const pool = new ShotPool(2);
  afterAll(() => pool.close(), 60_000);

  it('gives the in-process numbers, in job order', async () => {
    await pool.warmUp();
    const res = await pool.solveAll(model.grid, model, jobs, 2);
    expect(res.times).toHaveLength(jobs.length);
    jobs.forEach((job, k) => {
      const local = solveShot({ grid: model.grid, velocity: shared(model.velocity), active: shared(model.active), source: job.source, receivers, order: 2 });
      if (!local.ok) throw new Error(local.message);
      expect(Array.from(res.times[k])).toEqual(Array.from(local.times));
    });
    expect(res.wallSeconds).toBeGreaterThan(0);
  }, 60_000);

  it('names the failing job', async () => {
    const bad = [...jobs, { source: { x: 20, z: 5 }, receivers }];
    const err = await pool.solveAll(model.grid, model, bad, 1).catch((e) => e);
    expect(err).toBeInstanceOf(ShotSolveError);
    expect(err.jobIndex).toBe(4);
    expect(err.message).toMatch(/outside the model grid/);
  }, 60_000);
});
