/**
 * The automatic starting model: one velocity law v = v0 + k·depth below the ground surface,
 * fitted to all travel-time curves at once. In such ground the first arrival at source–receiver
 * distance x is t = (2/k)·asinh(k·x / (2·v0)) (the diving wave of a linear gradient; Slotnick
 * 1959, "Lessons in Seismic Computing", Soc. Expl. Geophys.; the same field as Fomel, Luo & Zhao
 * 2009, J. Comput. Phys. 228; from memory). Fitted by weighted least squares (weights 1/σ²) with
 * a coarse-to-fine search over log v0 and log k, which cannot be caught by a local minimum.
 */
import type { Grid } from '../grid';
import type { InversionSettings, InversionShot } from './types';

export interface GradientFit {
  /** Velocity at the ground surface, m/s. */
  v0: number;
  /** Increase with depth, 1/s (m/s per m). */
  k: number;
  /** Weighted RMS misfit of the fit, s. */
  rms: number;
}

/** First-arrival time at distance x in v = v0 + k·depth (k → 0: x / v0). */
export function gradientTime(x: number, v0: number, k: number): number {
  if (k < 1e-9) return x / v0;
  return (2 / k) * Math.asinh((k * x) / (2 * v0));
}

export function fitGradient(shots: readonly InversionShot[]): GradientFit {
  const xs: number[] = [];
  const ts: number[] = [];
  const ws: number[] = [];
  for (const s of shots) {
    for (let i = 0; i < s.times.length; i++) {
      const x = Math.hypot(s.receivers[2 * i] - s.source.x, s.receivers[2 * i + 1] - s.source.z);
      if (!(x > 0) || !(s.times[i] > 0)) continue;
      xs.push(x);
      ts.push(s.times[i]);
      ws.push(1 / (s.sigmas[i] * s.sigmas[i]));
    }
  }
  if (xs.length < 2) throw new Error('the automatic starting model needs at least two picks away from their shots');
  const misfit = (v0: number, k: number): number => {
    let sum = 0;
    for (let i = 0; i < xs.length; i++) {
      const r = ts[i] - gradientTime(xs[i], v0, k);
      sum += ws[i] * r * r;
    }
    return sum;
  };
  // Search log v0 in [50, 10 000] m/s and log k in [0.01, 1000] 1/s (k = 0 tried on its own).
  let lo = [Math.log(50), Math.log(0.01)];
  let hi = [Math.log(10_000), Math.log(1000)];
  let best = { v0: 0, k: 0, f: Infinity };
  const steps = 24;
  for (let round = 0; round < 5; round++) {
    for (let a = 0; a <= steps; a++) {
      const v0 = Math.exp(lo[0] + ((hi[0] - lo[0]) * a) / steps);
      for (let b = 0; b <= steps; b++) {
        const k = Math.exp(lo[1] + ((hi[1] - lo[1]) * b) / steps);
        const f = misfit(v0, k);
        if (f < best.f) best = { v0, k, f };
      }
      const f0 = misfit(v0, 0);
      if (f0 < best.f) best = { v0, k: 0, f: f0 };
    }
    // Zoom in to four grid steps around the best point.
    const lv = Math.log(best.v0);
    const lk = Math.log(Math.max(best.k, 0.01));
    const hv = (2 * (hi[0] - lo[0])) / steps;
    const hk = (2 * (hi[1] - lo[1])) / steps;
    lo = [lv - hv, lk - hk];
    hi = [lv + hv, lk + hk];
  }
  let wsum = 0;
  for (const w of ws) wsum += w;
  return { v0: best.v0, k: best.k, rms: Math.sqrt(best.f / wsum) };
}

/** The fitted law hung below the ground surface, clipped to the velocity bounds; air nodes get v0. */
export function gradientStart(
  grid: Grid,
  active: Uint8Array,
  surfaceZ: (x: number) => number,
  shots: readonly InversionShot[],
  settings: Pick<InversionSettings, 'vMin' | 'vMax'>,
): { velocity: Float32Array; v0: number; k: number } {
  const { v0, k } = fitGradient(shots);
  return { velocity: gradientVelocity(grid, active, surfaceZ, v0, k, settings), v0, k };
}

/** v = v0 + k·depth below the ground surface at every ground node, clipped to the bounds; air nodes get v0. */
export function gradientVelocity(grid: Grid, active: Uint8Array, surfaceZ: (x: number) => number, v0: number, k: number, settings: Pick<InversionSettings, 'vMin' | 'vMax'>): Float32Array {
  const velocity = new Float32Array(grid.nx * grid.nz);
  for (let ix = 0; ix < grid.nx; ix++) {
    const top = surfaceZ(grid.x0 + ix * grid.dx);
    for (let iz = 0; iz < grid.nz; iz++) {
      const i = iz * grid.nx + ix;
      const depth = Math.max(0, top - (grid.z0 - iz * grid.dz));
      velocity[i] = active[i] ? Math.min(settings.vMax, Math.max(settings.vMin, v0 + k * depth)) : v0;
    }
  }
  return velocity;
}
