/**
 * Travel time at any point (a geophone on the surface or in a borehole) from the node field.
 *
 * Inside ground cells: bicubic convolution (Keys 1981, "Cubic convolution interpolation for
 * digital image processing", IEEE Trans. ASSP 29(6), a = −½) when the 4 × 4 block is all finite,
 * clamped to the range of the four cell corners so a kink (direct wave meeting a head wave)
 * cannot overshoot; bilinear when the block touches air. A cell with air corners (a geophone
 * on the ground surface) is handled by first-order Taylor extrapolation from each ground corner,
 * T(c) + ∇T(c)·(p − c), blended with the bilinear weights of those corners. *
 * Given the source, the time is sampled in factored form: U = T / r (r the distance to the
 * source) is interpolated and multiplied by r at the point. U is smooth where T curves sharply —
 * near the source and along a sloping surface, where T's own interpolation or extrapolation from
 * the grid's staircase is off by up to a tenth of a millisecond at 0.5 m nodes — and constant in
 * uniform ground, where the sample is then exact (the factored form of Fomel, Luo & Zhao 2009).
 */
import type { Grid } from '../grid';
import { EikonalInputError } from './errors';
import { nodeGradient } from './gradient';
import type { Point } from './types';

const EDGE_TOLERANCE = 1e-9;
const grad = { gx: 0, gd: 0 };

function keys(t: number): number {
  // Keys' kernel, a = −1/2, for |t| < 2.
  const a = Math.abs(t);
  if (a < 1) return 1.5 * a * a * a - 2.5 * a * a + 1;
  if (a < 2) return -0.5 * a * a * a + 2.5 * a * a - 4 * a + 2;
  return 0;
}

export function sampleTime(grid: Grid, times: Float64Array, active: Uint8Array, p: Point, source?: Point): number {
  const { x0, dx, nx, z0, dz, nz } = grid;
  if (times.length !== nx * nz || active.length !== nx * nz) {
    throw new EikonalInputError(`travel times (${times.length}) and ground mask (${active.length}) must both have nx × nz = ${nx * nz} values`);
  }
  const fx = (p.x - x0) / dx;
  const fz = (z0 - p.z) / dz;
  if (!(fx >= -EDGE_TOLERANCE && fx <= nx - 1 + EDGE_TOLERANCE && fz >= -EDGE_TOLERANCE && fz <= nz - 1 + EDGE_TOLERANCE)) {
    throw new EikonalInputError(`point x ${p.x} m, z ${p.z} m is outside the model grid`);
  }
  const cx = Math.min(nx - 2, Math.max(0, Math.floor(fx)));
  const cz = Math.min(nz - 2, Math.max(0, Math.floor(fz)));
  const ux = Math.min(1, Math.max(0, fx - cx));
  const uz = Math.min(1, Math.max(0, fz - cz));
  if (source) return factoredSample(grid, times, active, p, source, cx, cz, ux, uz);
  const i = cz * nx + cx;
  const c00 = times[i];
  const c10 = times[i + 1];
  const c01 = times[i + nx];
  const c11 = times[i + nx + 1];

  if (Number.isFinite(c00) && Number.isFinite(c10) && Number.isFinite(c01) && Number.isFinite(c11)) {
    const bilinear = (1 - uz) * ((1 - ux) * c00 + ux * c10) + uz * ((1 - ux) * c01 + ux * c11);
    if (cx < 1 || cz < 1 || cx > nx - 3 || cz > nz - 3) return bilinear;
    let sum = 0;
    for (let kz = -1; kz <= 2; kz++) {
      const wz = keys(uz - kz);
      const row = i + kz * nx;
      for (let kx = -1; kx <= 2; kx++) {
        const t = times[row + kx];
        if (!Number.isFinite(t)) return bilinear;
        sum += wz * keys(ux - kx) * t;
      }
    }
    const lo = Math.min(c00, c10, c01, c11);
    const hi = Math.max(c00, c10, c01, c11);
    return Math.min(hi, Math.max(lo, sum));
  }

  // Some corners are air or unreached: extrapolate from the finite ones.
  let wsum = 0;
  let tsum = 0;
  let anyActive = false;
  let finite = 0;
  for (let k = 0; k < 4; k++) {
    const kx = k & 1;
    const kz = k >> 1;
    const j = i + kx + kz * nx;
    if (active[j]) anyActive = true;
    const t = times[j];
    if (!Number.isFinite(t)) continue;
    finite++;
    nodeGradient(grid, times, cx + kx, cz + kz, grad);
    const est = t + grad.gx * (ux - kx) * dx + grad.gd * (uz - kz) * dz;
    const w = Math.max((kx ? ux : 1 - ux) * (kz ? uz : 1 - uz), 1e-6);
    wsum += w;
    tsum += w * Math.max(est, 0);
  }
  if (finite > 0) return tsum / wsum;
  if (!anyActive) throw new EikonalInputError(`point x ${p.x} m, z ${p.z} m is in the air, above the ground surface`);
  return Infinity; // ground the wave cannot reach (cut off from the source by air)
}

/** T / r at node j (r its distance to the source); at the source itself, the mean of its finite neighbours' values. */
function factoredValue(grid: Grid, times: Float64Array, j: number, source: Point): number {
  const { x0, dx, nx, z0, dz } = grid;
  const ix = j % nx;
  const iz = (j - ix) / nx;
  const r = Math.hypot(x0 + ix * dx - source.x, z0 - iz * dz - source.z);
  if (r > 1e-9 * Math.max(dx, dz)) return times[j] / r;
  let sum = 0, n = 0;
  for (const k of [j - 1, j + 1, j - nx, j + nx]) {
    if (k < 0 || k >= times.length || !Number.isFinite(times[k])) continue;
    const kx = k % nx;
    const kz = (k - kx) / nx;
    sum += times[k] / Math.hypot(x0 + kx * dx - source.x, z0 - kz * dz - source.z);
    n++;
  }
  return n ? sum / n : Number.NaN;
}

function factoredSample(grid: Grid, times: Float64Array, active: Uint8Array, p: Point, source: Point, cx: number, cz: number, ux: number, uz: number): number {
  const { nx, nz } = grid;
  const r = Math.hypot(p.x - source.x, p.z - source.z);
  const i = cz * nx + cx;
  const corners = [i, i + 1, i + nx, i + nx + 1];
  const u = corners.map((j) => (Number.isFinite(times[j]) ? factoredValue(grid, times, j, source) : Number.NaN));
  if (u.every(Number.isFinite)) {
    const bilinear = (1 - uz) * ((1 - ux) * u[0] + ux * u[1]) + uz * ((1 - ux) * u[2] + ux * u[3]);
    if (cx < 1 || cz < 1 || cx > nx - 3 || cz > nz - 3) return bilinear * r;
    let sum = 0;
    for (let kz = -1; kz <= 2; kz++) {
      const wz = keys(uz - kz);
      for (let kx = -1; kx <= 2; kx++) {
        const j = i + kz * nx + kx;
        if (!Number.isFinite(times[j])) return bilinear * r;
        sum += wz * keys(ux - kx) * factoredValue(grid, times, j, source);
      }
    }
    return Math.min(Math.max(...u), Math.max(Math.min(...u), sum)) * r;
  }
  // Some corners are air or unreached: U varies slowly, so the finite corners' values are blended.
  let wsum = 0, usum = 0, anyActive = false;
  corners.forEach((j, k) => {
    if (active[j]) anyActive = true;
    if (!Number.isFinite(u[k])) return;
    const w = Math.max(((k & 1) ? ux : 1 - ux) * ((k >> 1) ? uz : 1 - uz), 1e-6);
    wsum += w;
    usum += w * u[k];
  });
  if (wsum > 0) return (usum / wsum) * r;
  if (!anyActive) throw new EikonalInputError(`point x ${p.x} m, z ${p.z} m is in the air, above the ground surface`);
  return Infinity;
}
