import type { InversionIterationView } from '../../../shared/schemas/inversions';

/**
 * The convergence chart's data: χ² per datum and RMS misfit (ms) after every iteration, iteration 0
 * being the starting model. χ² = 1 is the target: the model then fits the picks as well as their
 * stated uncertainties allow, no better (the discrepancy principle; Aster, Borchers & Thurber,
 * Parameter Estimation and Inverse Problems, 3rd ed. 2018, §4.2 — from memory).
 */
export interface ConvergenceSeries {
  iterations: number[];
  chi2: number[];
  rmsMs: number[];
  /** χ² axis: logarithmic when the values span more than a decade (starting models often fit 10–100× worse). */
  chi2Log: boolean;
}

export const CHI2_TARGET = 1;
/** The band in which the engine stops for a good fit (issue 11: χ² within [0.9, 1.1]). */
export const CHI2_BAND: readonly [number, number] = [0.9, 1.1];

export function convergenceSeries(history: readonly InversionIterationView[]): ConvergenceSeries {
  const rows = [...history].filter((h) => Number.isFinite(h.chi2) && Number.isFinite(h.rmsMs)).sort((a, b) => a.iteration - b.iteration);
  const chi2 = rows.map((h) => h.chi2);
  const positive = chi2.filter((c) => c > 0);
  const lo = Math.min(CHI2_TARGET, ...positive);
  const hi = Math.max(CHI2_TARGET, ...positive);
  return {
    iterations: rows.map((h) => h.iteration),
    chi2,
    rmsMs: rows.map((h) => h.rmsMs),
    chi2Log: positive.length === chi2.length && hi / lo > 10,
  };
}

/** One sentence on where the fit stands, for the chart's caption and screen readers. */
export function convergenceWords(series: ConvergenceSeries): string {
  const n = series.iterations.length;
  if (n === 0) return 'No iteration has finished yet.';
  const last = series.chi2[n - 1]!;
  const first = series.chi2[0]!;
  const lastIteration = series.iterations[n - 1]!;
  const where =
    last >= CHI2_BAND[0] && last <= CHI2_BAND[1]
      ? 'within the target band around 1'
      : last < CHI2_BAND[0]
        ? 'below 1: the model fits the picks more closely than their uncertainties justify'
        : 'above 1: the model does not yet explain the picks within their uncertainties';
  const from = lastIteration === 0 ? 'The starting model has' : `After iteration ${lastIteration}, χ² went from ${first.toFixed(2)} to`;
  return `${from} ${lastIteration === 0 ? `χ² ${last.toFixed(2)}` : last.toFixed(2)} (RMS ${series.rmsMs[n - 1]!.toFixed(2)} ms), ${where}.`;
}
