/**
 * The first-break picker against exact onsets (issue 12, item 3): synthetic gathers whose first
 * arrivals are the engine's travel times and whose causal wavelet starts exactly there
 * (scripts/bench/synthetic-gathers.ts), band-limited noise at a stated SNR, dead and reversed traces.
 * Targets from the issue: at SNR ≥ 5, median |error| ≤ 1 sample (0.25 ms) and 95th percentile
 * ≤ 1 ms; dead traces left unpicked at every SNR. `npm run bench:picker` prints the same figures.
 */
import { describe, expect, it } from 'vitest';
import { isDead, pickTrace } from '../../../shared/picking';
import { measurePicker } from '../../../scripts/bench-picker';

describe('first-break picker accuracy on synthetic gathers', () => {
  for (const snr of [3, 5, 10, 20]) {
    it(`SNR ${snr}: no dead trace is picked`, () => {
      expect(measurePicker(snr).dead_picked).toBe(0);
    });
  }

  it('SNR 20: median |error| ≤ 1 sample and 95th percentile ≤ 1 ms (issue target)', () => {
    const m = measurePicker(20);
    expect(m.unpicked).toBe(0);
    expect(m.median_abs_error_ms).toBeLessThanOrEqual(0.25);
    expect(m.p95_abs_error_ms).toBeLessThanOrEqual(1);
  });

  it('SNR 10: median |error| ≤ 1 sample (issue target)', () => {
    expect(measurePicker(10).median_abs_error_ms).toBeLessThanOrEqual(0.25);
  });

  // Not met yet (docs/records.md has the measured figures for three noise seeds): at SNR 10 the 95th
  // percentile is 0.96–1.66 ms depending on the noise; at SNR 5 the onset comes ~2 samples late and
  // about 1 trace in 12 is picked on a later arrival or a burst of noise.
  it.todo('SNR 10: 95th percentile ≤ 1 ms on every noise seed (measured 0.96, 1.66, 1.38 ms)');
  it.todo('SNR 5: median |error| ≤ 1 sample and 95th percentile ≤ 1 ms (measured 0.46–0.54 ms and 36–42 ms)');

  it('a polarity-reversed trace gets the same pick as the original', () => {
    // The energy ratio and the AIC use squares and variances: sign-blind by construction.
    const x = Float64Array.from({ length: 400 }, (_, i) => (i >= 150 ? Math.sin((i - 150) / 4) * Math.exp(-(i - 150) / 60) : 0) + 0.01 * Math.sin(i * 1.7));
    const a = pickTrace(x, 0.00025, 0), b = pickTrace(x.map((v) => -v), 0.00025, 0);
    expect(a.ok && b.ok && a.pick.time === b.pick.time).toBe(true);
    // Onset at sample 150 (true time 37.5 ms): within one sample (common practice, no source).
    expect(a.ok && Math.abs(a.pick.time - 0.0375)).toBeLessThanOrEqual(0.00025);
  });

  it('flat traces are dead and unpicked', () => {
    expect(isDead(new Float64Array(100))).toBe(true);
    expect(isDead(new Float64Array(100).fill(7))).toBe(true);
    expect(pickTrace(new Float64Array(100).fill(7), 0.001, 0)).toEqual({ ok: false, reason: 'dead' });
  });
});
