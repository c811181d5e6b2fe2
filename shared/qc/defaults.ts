/**
 * Default QC thresholds. None of these comes from a published standard:
 * they are common practice for shallow engineering refraction, no source.
 */
export const QC_DEFAULTS = {
  /** Reciprocal times of a shot pair should agree within about one or two sample intervals: 2 ms (common practice, no source). */
  reciprocalToleranceS: 0.002,
  /** A receiver counts as "at" a source position within a quarter metre (common practice, no source). */
  positionToleranceM: 0.25,
  /** Slower than ~100 m/s is below dry loose soil; almost certainly a late pick (common practice, no source). */
  vMin: 100,
  /** Faster than ~8000 m/s is beyond any near-surface rock; almost certainly an early pick (common practice, no source). */
  vMax: 8000,
  /** Flag a pick only when it breaks a rule by more than 2·√(σ₁² + σ₂²) of the two picks' uncertainties (common practice, no source). */
  sigmaAllowance: 2,
} as const;

/**
 * Receivers closer than this (m) count as the same station: no velocity is formed between them.
 * Our own choice, far below any geophone spacing and above rounding of positions written to cm.
 */
export const SAME_STATION_M = 0.001;

/**
 * Slack (s) on the reciprocal comparison so that a difference equal to the tolerance, once
 * rounded through ms → s conversion, is not flagged. 1 ns is far below any pick precision.
 */
export const TIME_ROUNDING_S = 1e-9;
