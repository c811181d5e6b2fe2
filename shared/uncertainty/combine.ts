/**
 * An ensemble's members combined into what a client reads (issue 20 item 2): mean and standard
 * deviation of velocity over the ground the rays cover, the probability that ground is faster than a
 * chosen velocity, and per station the depth of that velocity as a median with a 5–95 % band.
 * Members whose fit is poor (χ² per datum above 1.2) are left out and counted: they do not explain
 * the picks, so they say nothing about what the picks allow.
 */
import type { Grid } from '../grid';
import { evalPolyline } from '../model/polyline';
import { raySupport, resolvedIsoDepth } from '../model/resolved-iso-depth';

export interface MemberSection {
  /** m/s per node, NaN in the air. */
  velocity: Float32Array;
  /** Summed ray length per node (m). */
  coverage: Float32Array;
  /** DOI elevation per column (m), NaN where no ray passes. */
  doi: Float64Array;
  chi2: number;
  /** This member's rock velocity v*, when the ensemble draws it from a range (else the options' one). */
  rockVelocity?: number;
}

export interface DepthBand {
  x: number;
  /** Members in which the depth is resolved at x. */
  resolved: number;
  median: number | null;
  p5: number | null;
  p95: number | null;
}

export interface EnsembleSummary {
  used: number;
  /** Members left out for χ² per datum above the limit (or not finite). */
  excluded: number;
  /** Per node: members covering it, and over those the mean, standard deviation and share faster than `rockVelocity`. */
  covering: Uint16Array;
  mean: Float32Array;
  std: Float32Array;
  probabilityFaster: Float32Array;
  bands: DepthBand[];
}

/** Quantile p of sorted values, linear between order statistics: Hyndman & Fan (1996), definition 7 (the default of R and NumPy). */
export function quantile(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export const MAX_MEMBER_CHI2 = 1.2;

/**
 * The χ² against the observed picks a member must reach to be used: 1.2, or 25 % above the base
 * inversion's χ² when that is larger. A member refitted to moved picks fits part of the move, so it
 * explains the observed picks a little worse than the base (measured on a three-layer line whose base
 * reached 1.06: members at 1.15–1.39); and where the base itself stopped above 1.2 (a smooth model
 * against a sharp refractor: the demo line, 1.51) a fixed 1.2 would leave every member out.
 */
export function memberChi2Limit(baseChi2: number | null | undefined): number {
  return Number.isFinite(baseChi2) ? Math.max(MAX_MEMBER_CHI2, 1.25 * baseChi2!) : MAX_MEMBER_CHI2;
}

export function combineMembers(
  members: readonly MemberSection[],
  grid: Grid,
  surface: [number, number][],
  options: { threshold: number; rockVelocity: number; stationXs: readonly number[]; maxChi2?: number },
): EnsembleSummary {
  const maxChi2 = options.maxChi2 ?? MAX_MEMBER_CHI2;
  const used = members.filter((m) => Number.isFinite(m.chi2) && m.chi2 <= maxChi2);
  const n = grid.nx * grid.nz;
  const covering = new Uint16Array(n);
  const sum = new Float64Array(n), sumSq = new Float64Array(n), faster = new Float64Array(n);
  for (const m of used) {
    for (let i = 0; i < n; i++) {
      const v = m.velocity[i];
      if (!Number.isFinite(v) || !(m.coverage[i] >= options.threshold)) continue;
      covering[i]++;
      sum[i] += v;
      sumSq[i] += v * v;
      if (v > (m.rockVelocity ?? options.rockVelocity)) faster[i]++;
    }
  }
  const mean = new Float32Array(n).fill(Number.NaN), std = new Float32Array(n).fill(Number.NaN), probabilityFaster = new Float32Array(n).fill(Number.NaN);
  // A node counts when at least half the members cover it (and two at least, for a spread).
  const enough = Math.max(2, Math.ceil(used.length / 2));
  for (let i = 0; i < n; i++) {
    const c = covering[i];
    if (c < enough) continue;
    mean[i] = sum[i] / c;
    // Sample standard deviation (n − 1), clamped at 0 against rounding.
    std[i] = Math.sqrt(Math.max(0, (sumSq[i] - (sum[i] * sum[i]) / c) / (c - 1)));
    probabilityFaster[i] = faster[i] / c;
  }
  const surfaceZ = (x: number) => evalPolyline(surface, x);
  const supports = used.map((m) => ({ support: raySupport(grid, m.velocity, m.coverage, m.doi, options.threshold, surfaceZ), rock: m.rockVelocity ?? options.rockVelocity }));
  const bands = options.stationXs.map((x): DepthBand => {
    const depths = supports
      .map((s) => resolvedIsoDepth(s.support, s.rock, x))
      .filter((r) => r.status === 'resolved' && r.result?.depth != null)
      .map((r) => r.result!.depth!)
      .sort((a, b) => a - b);
    if (depths.length < enough) return { x, resolved: depths.length, median: null, p5: null, p95: null };
    return { x, resolved: depths.length, median: quantile(depths, 0.5), p5: quantile(depths, 0.05), p95: quantile(depths, 0.95) };
  });
  return { used: used.length, excluded: members.length - used.length, covering, mean, std, probabilityFaster, bands };
}
