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

export interface CombineOptions {
  threshold: number;
  rockVelocity: number;
  stationXs: readonly number[];
  maxChi2?: number;
}

/**
 * The combination one member at a time, so a worker holds a few node-sized sums and each member's
 * depths at the stations, never every member's section at once (256 members of a 2 M-node grid
 * would not fit in a worker's memory otherwise).
 */
export class EnsembleAccumulator {
  private readonly n: number;
  private readonly maxChi2: number;
  private readonly covering: Uint16Array;
  private readonly sum: Float64Array;
  private readonly sumSq: Float64Array;
  private readonly faster: Float64Array;
  private readonly depths: number[][];
  private readonly surfaceZ: (x: number) => number;
  private used = 0;
  private excluded = 0;

  constructor(private readonly grid: Grid, surface: [number, number][], private readonly options: CombineOptions) {
    this.n = grid.nx * grid.nz;
    this.maxChi2 = options.maxChi2 ?? MAX_MEMBER_CHI2;
    this.covering = new Uint16Array(this.n);
    this.sum = new Float64Array(this.n);
    this.sumSq = new Float64Array(this.n);
    this.faster = new Float64Array(this.n);
    this.depths = options.stationXs.map(() => []);
    this.surfaceZ = (x: number) => evalPolyline(surface, x);
  }

  add(m: MemberSection): void {
    if (!(Number.isFinite(m.chi2) && m.chi2 <= this.maxChi2)) {
      this.excluded++;
      return;
    }
    this.used++;
    const { threshold } = this.options;
    const rock = m.rockVelocity ?? this.options.rockVelocity;
    for (let i = 0; i < this.n; i++) {
      const v = m.velocity[i];
      if (!Number.isFinite(v) || !(m.coverage[i] >= threshold)) continue;
      this.covering[i]++;
      this.sum[i] += v;
      this.sumSq[i] += v * v;
      if (v > rock) this.faster[i]++;
    }
    const support = raySupport(this.grid, m.velocity, m.coverage, m.doi, threshold, this.surfaceZ);
    this.options.stationXs.forEach((x, k) => {
      const r = resolvedIsoDepth(support, rock, x);
      if (r.status === 'resolved' && r.result?.depth != null) this.depths[k].push(r.result.depth);
    });
  }

  finish(): EnsembleSummary {
    const { n, covering, sum, sumSq, faster } = this;
    const mean = new Float32Array(n).fill(Number.NaN), std = new Float32Array(n).fill(Number.NaN), probabilityFaster = new Float32Array(n).fill(Number.NaN);
    // A node counts when at least half the members cover it (and two at least, for a spread).
    const enough = Math.max(2, Math.ceil(this.used / 2));
    for (let i = 0; i < n; i++) {
      const c = covering[i];
      if (c < enough) continue;
      mean[i] = sum[i] / c;
      // Sample standard deviation (n − 1), clamped at 0 against rounding.
      std[i] = Math.sqrt(Math.max(0, (sumSq[i] - (sum[i] * sum[i]) / c) / (c - 1)));
      probabilityFaster[i] = faster[i] / c;
    }
    const bands = this.options.stationXs.map((x, k): DepthBand => {
      const depths = [...this.depths[k]].sort((a, b) => a - b);
      if (depths.length < enough) return { x, resolved: depths.length, median: null, p5: null, p95: null };
      return { x, resolved: depths.length, median: quantile(depths, 0.5), p5: quantile(depths, 0.05), p95: quantile(depths, 0.95) };
    });
    return { used: this.used, excluded: this.excluded, covering, mean, std, probabilityFaster, bands };
  }
}

/** All members at once (tests, studies): the same as adding them one by one. */
export function combineMembers(members: readonly MemberSection[], grid: Grid, surface: [number, number][], options: CombineOptions): EnsembleSummary {
  const acc = new EnsembleAccumulator(grid, surface, options);
  for (const m of members) acc.add(m);
  return acc.finish();
}
