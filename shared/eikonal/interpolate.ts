/**
 * Travel time at any point (a geophone on the surface or in a borehole) from the node field.
 *
 * Inside ground cells: bicubic convolution (Keys 1981, "Cubic convolution interpolation for
 * digital image processing", IEEE Trans. ASSP 29(6), a = −½) when the 4 × 4 block is all finite,
 * clamped to the range of the four cell corners so a kink (direct wave meeting a head wave)
 * cannot overshoot; bilinear when the block touches air. A cell with air corners (a geophone
 * on the ground surface) is handled by first-order Taylor extrapolation from each ground corner,
 * T(c) + ∇T(c)·(p − c), blended with the bilinear weights of those corners. Given the source, it
 * extrapolates the factored time τ = T/r instead (r the distance to the source) and returns r·τ:
 * τ is smooth where T is a cone, so a geophone a metre from a shot on sloping ground is not
 * bent by the cone's curvature (factored form as in source.ts; exact in uniform ground).
 */
import type { Grid } from '../grid';
import { EikonalInputError } from './errors';
import { nodeGradient, oneAxis } from './gradient';
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
    const est = source ? factoredEstimate(grid, times, cx + kx, cz + kz, p, source) : taylorEstimate(grid, times, cx + kx, cz + kz, ux - kx, uz - kz);
    const w = Math.max((kx ? ux : 1 - ux) * (kz ? uz : 1 - uz), 1e-6);
    wsum += w;
    tsum += w * Math.max(est, 0);
  }
  if (finite > 0) return tsum / wsum;
  if (!anyActive) throw new EikonalInputError(`point x ${p.x} m, z ${p.z} m is in the air, above the ground surface`);
  return Infinity; // ground the wave cannot reach (cut off from the source by air)
}

function taylorEstimate(grid: Grid, times: Float64Array, ix: number, iz: number, du: number, dv: number): number {
  nodeGradient(grid, times, ix, iz, grad);
  return times[iz * grid.nx + ix] + grad.gx * du * grid.dx + grad.gd * dv * grid.dz;
}

/** r(p)·(τ(c) + ∇τ(c)·(p − c)) with τ = T/r; plain Taylor when c sits on the source. */
function factoredEstimate(grid: Grid, times: Float64Array, ix: number, iz: number, p: Point, s: Point): number {
  const { x0, dx, nx, nz, z0, dz } = grid;
  const tau = (jx: number, jz: number): number => {
    if (jx < 0 || jx >= nx || jz < 0 || jz >= nz) return Infinity;
    const r = Math.hypot(x0 + jx * dx - s.x, z0 - jz * dz - s.z);
    return times[jz * nx + jx] / r; // Infinity for air or an unreached node
  };
  const xc = x0 + ix * dx;
  const zc = z0 - iz * dz;
  const rc = Math.hypot(xc - s.x, zc - s.z);
  if (rc < 1e-9 * Math.max(dx, dz)) return taylorEstimate(grid, times, ix, iz, (p.x - xc) / dx, (zc - p.z) / dz);
  const t = tau(ix, iz);
  const gx = oneAxis(tau(ix - 1, iz), t, tau(ix + 1, iz), dx);
  const gd = oneAxis(tau(ix, iz - 1), t, tau(ix, iz + 1), dz);
  return Math.hypot(p.x - s.x, p.z - s.z) * (t + gx * (p.x - xc) + gd * (zc - p.z));
}
