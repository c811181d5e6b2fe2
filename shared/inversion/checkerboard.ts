/**
 * Checkerboard resolution test (Humphreys & Clayton 1988, J. Geophys. Res. 93(B2), 1073–1085;
 * common practice in refraction tomography, no single source): the final model times a ±A
 * pattern of squares (A = 7 %), synthetic times on the same geometry with noise of each pick's
 * σ, inverted with the same settings starting from the final model; the recovered pattern is
 * v_recovered / v_final − 1. Its correlation with the true pattern over well-covered nodes says
 * how much of a feature of that size the data can resolve.
 */
import type { Grid } from '../grid';
import { mulberry32 } from '../random';

export const CHECKER_AMPLITUDE = 0.07;

/** Automatic square size: a sixth of the grid's width, at least four cells, rounded to the spacing. */
export function autoCheckerSize(grid: Grid): number {
  const width = (grid.nx - 1) * grid.dx;
  return Math.max(4 * Math.max(grid.dx, grid.dz), Math.round(width / 6 / grid.dx) * grid.dx);
}

/** ±amplitude squares counted from the grid's left edge and from the highest ground node of each column (depth). */
export function checkerPattern(grid: Grid, active: Uint8Array, size: number, amplitude: number): Float32Array {
  const out = new Float32Array(grid.nx * grid.nz).fill(Number.NaN);
  for (let ix = 0; ix < grid.nx; ix++) {
    const x = ix * grid.dx;
    let top = -1;
    for (let iz = 0; iz < grid.nz; iz++) {
      const i = iz * grid.nx + ix;
      if (!active[i]) continue;
      if (top < 0) top = iz;
      const depth = (iz - top) * grid.dz;
      const sign = (Math.floor(x / size) + Math.floor(depth / size)) % 2 === 0 ? 1 : -1;
      out[i] = sign * amplitude;
    }
  }
  return out;
}

/** Pearson correlation over nodes where `mask` holds and both values are numbers. */
export function correlation(a: Float32Array, b: Float32Array, mask: (i: number) => boolean): number {
  let n = 0, sa = 0, sb = 0;
  for (let i = 0; i < a.length; i++) {
    if (!mask(i) || !Number.isFinite(a[i]) || !Number.isFinite(b[i])) continue;
    n++;
    sa += a[i];
    sb += b[i];
  }
  if (n < 2) return Number.NaN;
  const ma = sa / n, mb = sb / n;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < a.length; i++) {
    if (!mask(i) || !Number.isFinite(a[i]) || !Number.isFinite(b[i])) continue;
    sab += (a[i] - ma) * (b[i] - mb);
    saa += (a[i] - ma) ** 2;
    sbb += (b[i] - mb) ** 2;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : Number.NaN;
}

/** Seeded normal deviates (mulberry32 + Box–Muller), so a checkerboard test repeats exactly. */
export function normalDeviates(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => {
    const u = Math.max(uniform(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}
