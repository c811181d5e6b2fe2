/**
 * The display band-pass against the Butterworth magnitude response of a bilinear-transform design
 * with pre-warped corners (Oppenheim, A.V. & Schafer, R.W., 1989, Discrete-Time Signal Processing,
 * §7.1.2, eqs. 7.19–7.26; the analog prototype |H(jΩ)|² = 1 / (1 + (Ω/Ωc)^(2N)), Butterworth 1930):
 * one causal pass has |H(f)|² = 1 / (1 + (tan(πf·dt) / tan(πfc·dt))^(2N)) for the low-pass and the
 * ratio inverted for the high-pass. Measured by filtering long sinusoids and reading the steady-state
 * amplitude, so the check does not reuse the filter's own coefficients.
 */
import { describe, expect, it } from 'vitest';
import { bandPassSections, butterworthSections, filterInPlace, filterZeroPhase } from '../../../src/lib/traces/butterworth';

const DT = 0.00025;

function steadyAmplitude(f: number, run: (x: Float64Array) => void): number {
  const n = 16000;
  const x = Float64Array.from({ length: n }, (_, i) => Math.sin(2 * Math.PI * f * i * DT));
  run(x);
  // RMS over the middle half (away from both ends' transients), × √2 for a sinusoid's amplitude.
  let s = 0;
  for (let i = n / 4; i < (3 * n) / 4; i++) s += x[i] * x[i];
  return Math.sqrt((2 * s) / (n / 2));
}

const lowPassGain = (f: number, fc: number, order: number) => 1 / Math.sqrt(1 + (Math.tan(Math.PI * f * DT) / Math.tan(Math.PI * fc * DT)) ** (2 * order));
const highPassGain = (f: number, fc: number, order: number) => 1 / Math.sqrt(1 + (Math.tan(Math.PI * fc * DT) / Math.tan(Math.PI * f * DT)) ** (2 * order));

describe('Butterworth sections (bilinear transform, pre-warped)', () => {
  for (const order of [2, 4] as const) {
    it(`low-pass of order ${order} follows the published magnitude response`, () => {
      const sections = butterworthSections('low', 200, DT, order);
      for (const f of [20, 100, 200, 300, 600]) {
        expect(steadyAmplitude(f, (x) => filterInPlace(x, sections))).toBeCloseTo(lowPassGain(f, 200, order), 2);
      }
    });
    it(`high-pass of order ${order} follows the published magnitude response`, () => {
      const sections = butterworthSections('high', 30, DT, order);
      for (const f of [10, 20, 30, 60, 300]) {
        expect(steadyAmplitude(f, (x) => filterInPlace(x, sections))).toBeCloseTo(highPassGain(f, 30, order), 2);
      }
    });
  }

  it('is −3 dB at each corner in one pass (1/√2), −6 dB forward and back', () => {
    const low = butterworthSections('low', 150, DT, 4);
    expect(steadyAmplitude(150, (x) => filterInPlace(x, low))).toBeCloseTo(Math.SQRT1_2, 2);
    expect(steadyAmplitude(150, (x) => filterZeroPhase(x, low))).toBeCloseTo(0.5, 2);
  });

  it('band-pass: low cut and high cut together, forward and back, give the product of the two responses squared', () => {
    const sections = bandPassSections({ lowHz: 20, highHz: 250, order: 4 }, DT);
    for (const f of [10, 40, 120, 400]) {
      const expected = (lowPassGain(f, 250, 4) * highPassGain(f, 20, 4)) ** 2;
      expect(steadyAmplitude(f, (x) => filterZeroPhase(x, sections))).toBeCloseTo(expected, 2);
    }
  });

  it('forward and back keeps a symmetric pulse where it was (zero phase)', () => {
    const n = 2001;
    const x = Float64Array.from({ length: n }, (_, i) => Math.exp(-((((i - 1000) * DT) / 0.002) ** 2)));
    filterZeroPhase(x, bandPassSections({ lowHz: 10, highHz: 300, order: 4 }, DT));
    let at = 0;
    for (let i = 1; i < n; i++) if (x[i] > x[at]) at = i;
    expect(at).toBe(1000);
  });

  it('leaves a corner at or beyond Nyquist out rather than making an unstable filter', () => {
    expect(bandPassSections({ lowHz: null, highHz: 2000, order: 2 }, DT)).toHaveLength(0);
    expect(bandPassSections({ lowHz: 0, highHz: null, order: 2 }, DT)).toHaveLength(0);
  });
});
