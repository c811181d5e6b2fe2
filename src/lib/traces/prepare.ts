import { bandPassSections, filterZeroPhase, type BandPass } from './butterworth';
import { agcInPlace, normalise } from './gain';

/** How the record view processes traces before drawing them (the stored samples never change). */
export interface TraceProcessing {
  band: BandPass;
  /** AGC window (ms); 0: no AGC. */
  agcMs: number;
  normalise: 'trace' | 'record';
}

export interface SampledTrace {
  samples: Float64Array;
  /** Seconds. */
  sampleInterval: number;
  /** Seconds (negative: pre-trigger). */
  delay: number;
}

/** Demean → band-pass → AGC → normalise: one Float32Array per trace, peak 1 (dead traces stay zero). */
export function prepareTraces(traces: SampledTrace[], p: TraceProcessing): Float32Array[] {
  const out = traces.map((t) => {
    const x = Float32Array.from(t.samples);
    let mean = 0;
    for (let i = 0; i < x.length; i++) mean += x[i];
    mean /= Math.max(1, x.length);
    for (let i = 0; i < x.length; i++) x[i] -= mean;
    filterZeroPhase(x, bandPassSections(p.band, t.sampleInterval));
    if (p.agcMs > 0) agcInPlace(x, Math.round(p.agcMs / 1000 / t.sampleInterval));
    return x;
  });
  normalise(out, p.normalise);
  return out;
}
