/**
 * `npm run bench:invert`: the inversion's speed and memory on a survey of production size —
 * 48 shots × 96 geophones on a 1000 × 200 grid (0.5 m), 10 iterations, shots on all cores —
 * with the split between forward solves and rays, matrix build and LSQR. The picks are exact
 * times in v = 400 + 30·depth (asinh formula) with σ = 0.02 ms, so the misfit target is out of
 * reach and every iteration runs. Peak memory is the process's resident maximum (threads
 * included). The demo line through the queue, POST to done, is `npm run bench:invert:queue`.
 */
import { resourceUsage } from 'node:process';
import { parseArgs } from 'node:util';
import { gradientStart, invert } from '../shared/inversion';
import { gradientTime } from '../shared/inversion/gradient-start';
import type { InversionShot } from '../shared/inversion/types';
import { DEFAULT_INVERSION_SETTINGS } from '../shared/schemas/inversions';
import { SensitivityPool } from '../worker/threads/sensitivity-pool';

const { values } = parseArgs({ options: { json: { type: 'boolean', default: false }, iterations: { type: 'string', default: '10' } } });

async function largeSurvey() {
  const grid = { x0: -10, dx: 0.5, nx: 1000, z0: 0, dz: 0.5, nz: 200 };
  const n = grid.nx * grid.nz;
  const geophones = Array.from({ length: 96 }, (_, i) => 5 * i);
  const shots: InversionShot[] = Array.from({ length: 48 }, (_, s) => {
    const sx = -2.5 + 10 * s;
    return {
      shotId: `S${s + 1}`,
      source: { x: sx, z: 0 },
      receivers: Float64Array.from(geophones.flatMap((x) => [x, 0])),
      times: Float64Array.from(geophones, (x) => gradientTime(Math.abs(x - sx), 400, 30)),
      sigmas: new Float64Array(geophones.length).fill(0.00002),
    };
  });
  const active = new Uint8Array(n).fill(1);
  const settings = { ...DEFAULT_INVERSION_SETTINGS, maxIterations: Number(values.iterations) };
  const start = gradientStart(grid, active, () => 0, shots, settings).velocity.map((v) => v * 1.15);
  const problem = { grid, active, start, shots, settings };
  const pool = new SensitivityPool();
  const t0 = performance.now();
  try {
    const result = await invert(problem, pool.modeller(problem));
    const seconds = (performance.now() - t0) / 1000;
    return {
      case: 'invert-48x96-1000x200',
      shots: shots.length,
      picks: shots.length * 96,
      nx: grid.nx,
      nz: grid.nz,
      threads: pool.threads,
      iterations: result.history.length - 1,
      stop_reason: result.stopReason,
      chi2_history: result.history.map((h) => +h.chi2.toFixed(3)),
      seconds: +seconds.toFixed(2),
      forward_steps: result.timings.forwardSteps,
      forward_and_rays_seconds: +result.timings.forwardSeconds.toFixed(2),
      matrix_seconds: +result.timings.matrixSeconds.toFixed(2),
      lsqr_seconds: +result.timings.lsqrSeconds.toFixed(2),
      peak_rss_mb: Math.round(resourceUsage().maxRSS / 1024),
    };
  } finally {
    await pool.close();
  }
}

const result = await largeSurvey();
process.stdout.write(values.json ? `${JSON.stringify(result)}\n` : `${JSON.stringify(result, null, 2)}\n`);
