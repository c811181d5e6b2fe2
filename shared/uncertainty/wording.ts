/**
 * The words an ensemble's results carry, on its page, in its band file and in the report: what the
 * band covers, the cautions, and one sentence of accuracy from the band itself.
 */
import type { DepthBand } from './combine';
import { quantile } from './combine';
import { SPREAD, type EnsembleVariation } from './plan';

export const ENSEMBLE_CAUTION =
  'The band covers only what was varied between the members — not errors in the picks beyond their stated uncertainty, in the station positions, nor the choice of method, grid or rock velocity unless that was varied too. Refraction interpretations are non-unique: calibrate the depths against boreholes or trial pits, have them reviewed by a qualified professional, and follow the local codes that govern their use.';

/** What the members varied, as a list of phrases. */
export function variationWords(vary: EnsembleVariation, rock: { min: number; max: number }): string[] {
  const out: string[] = [];
  if (vary.start) out.push(`the starting gradient (v0 ×/÷ ${SPREAD.v0}, its increase with depth ×/÷ ${SPREAD.k})`);
  if (vary.smoothing) out.push(`the smoothing weight (its schedule started ×/÷ ${SPREAD.smoothing})`);
  if (vary.picks === 'sigma') out.push('each pick within its stated uncertainty');
  if (vary.picks === 'bootstrap') out.push('the shots, resampled with replacement');
  if (rock.max > rock.min) out.push(`the rock velocity v* (${rock.min}–${rock.max} m/s)`);
  return out;
}

export const rockWords = (rock: { min: number; max: number }): string => (rock.max > rock.min ? `${rock.min}–${rock.max} m/s` : `${rock.min} m/s`);

export interface BandSummary {
  /** Stations where the band exists (enough members resolve the depth there). */
  resolved: number;
  stations: number;
  /** Median, smallest and largest width p95 − p5 (m) over those stations. */
  medianWidth: number | null;
  minWidth: number | null;
  maxWidth: number | null;
}

export function summariseBands(bands: readonly DepthBand[]): BandSummary {
  const widths = bands.filter((b) => b.p5 !== null && b.p95 !== null).map((b) => b.p95! - b.p5!).sort((a, b) => a - b);
  return {
    resolved: widths.length,
    stations: bands.length,
    medianWidth: widths.length ? quantile(widths, 0.5) : null,
    minWidth: widths[0] ?? null,
    maxWidth: widths.at(-1) ?? null,
  };
}

/** One sentence of accuracy for a report: "… within ±0.9 m (half the median 5–95 % band, 1.8 m; 0.6–3.4 m) at 34 of 47 stations …". */
export function accuracyStatement(bands: readonly DepthBand[], rock: { min: number; max: number }, used: number): string {
  const s = summariseBands(bands);
  if (!s.resolved || s.medianWidth === null) {
    return `The ensemble (${used} members) resolves the depth of ${rockWords(rock)} at no station: the rays do not reach it often enough to band it.`;
  }
  const m = (v: number) => v.toFixed(1);
  return `Depth to ${rockWords(rock)}: the 5–95 % band of ${used} ensemble members is ${m(s.medianWidth)} m wide at the median station (${m(s.minWidth!)}–${m(s.maxWidth!)} m), about ±${m(s.medianWidth / 2)} m, at the ${s.resolved} of ${s.stations} stations where the rays resolve it.`;
}

/** The band per station as CSV: a '#' preamble with what was varied and the cautions, then one row per station. */
export function depthBandCsv(head: { title: string; rock: { min: number; max: number }; vary: EnsembleVariation; used: number; excluded: number }, bands: readonly (DepthBand & { station: string; groundZ: number })[]): string {
  const cell = (v: number | null) => (v === null ? '' : v.toFixed(2));
  const lines = [
    `# Timefield depth band: ${head.title}`,
    `# depth below ground of ${rockWords(head.rock)}; ${head.used} members used, ${head.excluded} left out for poor fit; varied: ${variationWords(head.vary, head.rock).join('; ') || 'nothing'}`,
    `# ${ENSEMBLE_CAUTION}`,
    'station,x_m,ground_z_m,members_resolving,depth_p5_m,depth_median_m,depth_p95_m,elevation_median_m',
  ];
  for (const b of bands) {
    lines.push([b.station, b.x.toFixed(2), b.groundZ.toFixed(2), b.resolved, cell(b.p5), cell(b.median), cell(b.p95), cell(b.median === null ? null : b.groundZ - b.median)].join(','));
  }
  return `${lines.join('\n')}\n`;
}
