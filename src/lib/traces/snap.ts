import { aicOnset } from '../../../shared/picking';
import type { SampledTrace } from './prepare';

/**
 * Snap a hand pick to the onset: the AIC minimum (Maeda 1985, as the automatic picker uses) in a
 * window around the pick. Returns the onset time in ms after the shot, or the pick unchanged when
 * the window holds too few samples.
 */
export function snapToOnset(trace: SampledTrace, timeMs: number, windowMs = 6): number {
  const dtMs = trace.sampleInterval * 1000, delayMs = trace.delay * 1000;
  const n = trace.samples.length;
  const centre = Math.round((timeMs - delayMs) / dtMs);
  const half = Math.max(4, Math.round(windowMs / dtMs));
  const lo = Math.max(0, centre - half), hi = Math.min(n, centre + half);
  if (hi - lo < 8) return timeMs;
  const x = new Float64Array(hi - lo);
  let mean = 0;
  for (let i = lo; i < hi; i++) mean += trace.samples[i];
  mean /= hi - lo;
  for (let i = lo; i < hi; i++) x[i - lo] = trace.samples[i] - mean;
  return delayMs + (lo + aicOnset(x, 0, x.length)) * dtMs;
}
