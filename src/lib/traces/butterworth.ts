/**
 * Butterworth band-pass for display, designed by the bilinear transform with pre-warped corners
 * (Oppenheim, A.V. & Schafer, R.W., 1989, Discrete-Time Signal Processing, §7.1.2), as a cascade of
 * second-order sections: `order` low-cut (high-pass) and `order` high-cut (low-pass) poles.
 * The record is filtered forward and then backward, so the arrivals keep their times (zero phase);
 * the magnitude response is then the square of one pass:
 *   |H(f)|² per pass = 1 / (1 + (tan(πf·dt) / tan(πfc·dt))^(2n)) for the high-cut,
 *   and with the ratio inverted for the low-cut.
 */
export interface Biquad {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

export interface BandPass {
  /** Low-cut corner (Hz); 0 or null: no low cut. */
  lowHz: number | null;
  /** High-cut corner (Hz); null: no high cut. */
  highHz: number | null;
  /** Poles per side, even (2 or 4). */
  order: 2 | 4;
}

/** Second-order sections of a Butterworth low-pass (kind 'low') or high-pass ('high') at `cornerHz`. */
export function butterworthSections(kind: 'low' | 'high', cornerHz: number, dt: number, order: 2 | 4): Biquad[] {
  // Pre-warp so the digital corner lands exactly on cornerHz.
  const k = Math.tan(Math.PI * cornerHz * dt);
  const sections: Biquad[] = [];
  for (let i = 0; i < order / 2; i++) {
    // Analog pole pair angle for a Butterworth of this order: q = 1 / (2 sin((2i+1)π / 2n)).
    const q = 1 / (2 * Math.sin(((2 * i + 1) * Math.PI) / (2 * order)));
    const norm = 1 / (1 + k / q + k * k);
    const a1 = 2 * (k * k - 1) * norm;
    const a2 = (1 - k / q + k * k) * norm;
    if (kind === 'low') sections.push({ b0: k * k * norm, b1: 2 * k * k * norm, b2: k * k * norm, a1, a2 });
    else sections.push({ b0: norm, b1: -2 * norm, b2: norm, a1, a2 });
  }
  return sections;
}

/** The sections of a band-pass, or none when both corners are off or outside (0, Nyquist). */
export function bandPassSections(band: BandPass, dt: number): Biquad[] {
  const nyquist = 0.5 / dt;
  const sections: Biquad[] = [];
  if (band.lowHz && band.lowHz > 0 && band.lowHz < nyquist) sections.push(...butterworthSections('high', band.lowHz, dt, band.order));
  if (band.highHz && band.highHz > 0 && band.highHz < nyquist) sections.push(...butterworthSections('low', band.highHz, dt, band.order));
  return sections;
}

/** One causal pass of the cascade, in place (direct form II transposed). */
export function filterInPlace(x: Float32Array | Float64Array, sections: Biquad[]): void {
  for (const s of sections) {
    let z1 = 0, z2 = 0;
    for (let i = 0; i < x.length; i++) {
      const v = x[i];
      const y = s.b0 * v + z1;
      z1 = s.b1 * v - s.a1 * y + z2;
      z2 = s.b2 * v - s.a2 * y;
      x[i] = y;
    }
  }
}

/** Forward then backward: zero phase, magnitude squared. */
export function filterZeroPhase(x: Float32Array | Float64Array, sections: Biquad[]): void {
  if (!sections.length) return;
  filterInPlace(x, sections);
  x.reverse();
  filterInPlace(x, sections);
  x.reverse();
}
