/**
 * Ray sensitivities in ground of known answer. In uniform ground the ray is the straight line,
 * so the row of ∂t/∂s sums to the source–receiver distance (to the tracer's 0.1 %) and Σ G·s equals distance / v
 * (geometry; no source needed). In v = v0 + k·depth the starting-model fit recovers v0 and k
 * from exact first-arrival times t = (2/k)·asinh(k·x / 2v0) (Slotnick 1959, "Lessons in Seismic
 * Computing", SEG; from memory).
 */
import { describe, expect, it } from 'vitest';
import { fitGradient, gradientTime } from '../../../shared/inversion/gradient-start';
import { SensitivityWorkspace, shotSensitivity } from '../../../shared/inversion/shot-sensitivity';

describe('ray sensitivity rows', () => {
  const grid = { x0: 0, dx: 1, nx: 61, z0: 0, dz: 1, nz: 21 };
  const n = grid.nx * grid.nz;
  const velocity = new Float32Array(n).fill(1500);
  const active = new Uint8Array(n).fill(1);

  it('sum to the straight-line distance in uniform ground, for buried and surface receivers', () => {
    const source = { x: 10.3, z: -2.2 };
    const receivers = Float64Array.from([50, 0, 30.5, -15.2, 11, -19, 59.5, -7.7]);
    const got = shotSensitivity(new SensitivityWorkspace(grid), velocity, active, source, receivers, 2, 1);
    for (let i = 0; i < 4; i++) {
      const distance = Math.hypot(receivers[2 * i] - source.x, receivers[2 * i + 1] - source.z);
      let length = 0;
      let time = 0;
      for (let k = got.rowPtr[i]; k < got.rowPtr[i + 1]; k++) {
        length += got.vals[k];
        time += got.vals[k] / velocity[got.cols[k]];
      }
      // The traced ray follows the discrete field's gradient: within 0.1 % of the straight line.
      expect(Math.abs(length / distance - 1)).toBeLessThan(1e-3);
      expect(Math.abs(time / (distance / 1500) - 1)).toBeLessThan(1e-3);
      expect(Math.abs(got.times[i] / (distance / 1500) - 1)).toBeLessThan(1e-3);
    }
  });

  it('give no weight to air nodes', () => {
    const air = new Uint8Array(n).fill(1);
    for (let ix = 0; ix < grid.nx; ix++) for (let iz = 0; iz < 5; iz++) air[iz * grid.nx + ix] = 0; // ground from z = −5
    const got = shotSensitivity(new SensitivityWorkspace(grid), velocity, air, { x: 5, z: -5 }, Float64Array.from([55, -5, 40, -12]), 2, 2);
    for (let k = 0; k < got.cols.length; k++) expect(air[got.cols[k]]).toBe(1);
  });
});

describe('automatic starting gradient', () => {
  it('recovers v0 and k from exact times of v = v0 + k·depth', () => {
    const v0 = 450, k = 35;
    const shots = [0, 48, 96].map((sx) => {
      const xs = Array.from({ length: 48 }, (_, i) => 2 * i + 1);
      return {
        shotId: `S${sx}`,
        source: { x: sx, z: 0 },
        receivers: Float64Array.from(xs.flatMap((x) => [x, 0])),
        times: Float64Array.from(xs, (x) => gradientTime(Math.abs(x - sx), v0, k)),
        sigmas: new Float64Array(48).fill(0.0005),
      };
    });
    const fit = fitGradient(shots);
    expect(fit.v0 / v0).toBeCloseTo(1, 2);
    expect(fit.k / k).toBeCloseTo(1, 2);
    expect(fit.rms).toBeLessThan(1e-5);
  });

  it('reduces to x / v0 as k goes to 0', () => {
    expect(gradientTime(100, 500, 0)).toBe(0.2);
    expect(gradientTime(100, 500, 1e-6)).toBeCloseTo(0.2, 9);
  });
});
