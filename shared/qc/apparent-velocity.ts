/**
 * Apparent velocity of one travel-time branch: an ordinary least-squares line t = a + b·x through
 * the picks of ONE shot with xMin ≤ receiver x ≤ xMax (excluded and non-finite picks ignored).
 * Choose the window on one side of the source: a window straddling it fits a V and means nothing.
 * Unweighted on purpose — the slope of a branch is what the user reads off the chart.
 * Centred sums (two passes) keep the fit exact to rounding for x in the thousands of metres.
 */
import { sToMs } from '../units';
import type { QcPick } from './types';
import { isFinitePick } from './shots';

export interface ApparentVelocityFit {
  /** 1/|slope|, m/s. */
  velocity: number;
  /** s/m; positive when time grows with x (source to the left of the window). */
  slope: number;
  /** s, t at x = 0 of the line. */
  intercept: number;
  /** Picks used. */
  n: number;
  /** Coefficient of determination, 1 − SSres/SStot. */
  r2: number;
  /** Receiver x range of the picks used (not the requested window), m. */
  xMin: number;
  xMax: number;
  /** RMS of the line misfit, ms (a display figure). */
  rmsMs: number;
}

/** |slope| below this (s/m), i.e. faster than 10⁷ m/s, is a flat line with no velocity (our own choice). */
const FLAT_SLOPE = 1e-7;

export function fitApparentVelocity(picks: readonly QcPick[], xMin: number, xMax: number): ApparentVelocityFit | null {
  const lo = Math.min(xMin, xMax);
  const hi = Math.max(xMin, xMax);
  const used: number[] = [];
  let shotId: string | null = null;
  for (let i = 0; i < picks.length; i++) {
    const p = picks[i];
    if (p.excluded || !isFinitePick(p) || !(p.receiverX >= lo && p.receiverX <= hi)) continue;
    if (shotId === null) shotId = p.shotId;
    else if (p.shotId !== shotId) throw new Error(`fitApparentVelocity takes the picks of one shot; got ${shotId} and ${p.shotId}`);
    used.push(i);
  }
  const n = used.length;
  if (n < 2) return null;

  let sx = 0;
  let st = 0;
  let x0 = Infinity;
  let x1 = -Infinity;
  for (const i of used) {
    sx += picks[i].receiverX;
    st += picks[i].time;
    x0 = Math.min(x0, picks[i].receiverX);
    x1 = Math.max(x1, picks[i].receiverX);
  }
  const mx = sx / n;
  const mt = st / n;
  let sxx = 0;
  let sxt = 0;
  let stt = 0;
  for (const i of used) {
    const dx = picks[i].receiverX - mx;
    const dt = picks[i].time - mt;
    sxx += dx * dx;
    sxt += dx * dt;
    stt += dt * dt;
  }
  if (!(sxx > 0)) return null; // all picks at one x: no slope
  const slope = sxt / sxx;
  if (!(Math.abs(slope) >= FLAT_SLOPE)) return null;
  const intercept = mt - slope * mx;

  let ssRes = 0;
  for (const i of used) {
    const r = picks[i].time - (intercept + slope * picks[i].receiverX);
    ssRes += r * r;
  }
  const r2 = stt > 0 ? Math.max(0, 1 - ssRes / stt) : 1;
  // Finite but absurd inputs (say 1e200 m) can overflow the sums: no fit rather than NaN.
  if (![slope, intercept, r2, ssRes].every(Number.isFinite)) return null;
  return { velocity: 1 / Math.abs(slope), slope, intercept, n, r2, xMin: x0, xMax: x1, rmsMs: sToMs(Math.sqrt(ssRes / n)) };
}
