import { niceStep } from '../section/contourLevels';

/**
 * A diverging colour scale centred on zero: blue where the pick came earlier than computed
 * (negative residual: the model is too slow there), red where it came later (the model is too fast).
 * Anchors are ColorBrewer's 9-class RdBu scheme (Brewer, Harrower & Penn State, colorbrewer2.org, 2002),
 * reversed so that red is positive; between anchors the colour is interpolated linearly in RGB.
 */
export const RDBU_9 = ['#2166ac', '#4393c3', '#92c5de', '#d1e5f0', '#f7f7f7', '#fddbc7', '#f4a582', '#d6604d', '#b2182b'] as const;

const ANCHORS = RDBU_9.map((hex) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)));

const toHex = (rgb: number[]) => `#${rgb.map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;

/** Colour for `value` on a scale from −limit to +limit (clipped beyond); null for a missing value. */
export function divergingColor(value: number, limit: number): string | null {
  if (!Number.isFinite(value) || !(limit > 0)) return null;
  const t = Math.max(-1, Math.min(1, value / limit)); // −1…1
  const pos = ((t + 1) / 2) * (ANCHORS.length - 1);
  const i = Math.min(ANCHORS.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = ANCHORS[i]!;
  const b = ANCHORS[i + 1]!;
  return toHex(a.map((c, k) => c + (b[k]! - c) * f));
}

/** The scale as plotly wants it: [[0, colour], …, [1, colour]]. */
export const PLOTLY_RDBU: [number, string][] = RDBU_9.map((c, i) => [i / (RDBU_9.length - 1), c]);

/**
 * A round colour limit that covers 95 % of |values|, so one wild pick does not wash out the rest
 * (values beyond are drawn at full colour). Never below `floor`.
 */
export function symmetricLimit(values: readonly number[], floor = 0.1): number {
  const abs = values.filter(Number.isFinite).map(Math.abs).sort((a, b) => a - b);
  if (abs.length === 0) return 1;
  const p95 = abs[Math.min(abs.length - 1, Math.ceil(0.95 * abs.length) - 1)]!;
  return Math.max(floor, niceStep(p95));
}
