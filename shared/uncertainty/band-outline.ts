/**
 * The 5–95 % depth band as closed outlines (x, elevation in m) for drawing: one outline per run of
 * neighbouring stations that have a band, so a fill never bridges a station without one.
 */
import type { DepthBand } from './combine';

export interface BandOutline {
  x: number[];
  /** Elevation: the 5 % depth along the run, then the 95 % depth back. */
  z: number[];
}

export function bandOutlines(bands: readonly DepthBand[], groundZ: (x: number) => number): BandOutline[] {
  const out: BandOutline[] = [];
  let run: DepthBand[] = [];
  const close = () => {
    if (run.length >= 2) {
      const back = [...run].reverse();
      out.push({
        x: [...run.map((b) => b.x), ...back.map((b) => b.x)],
        z: [...run.map((b) => groundZ(b.x) - b.p5!), ...back.map((b) => groundZ(b.x) - b.p95!)],
      });
    }
    run = [];
  };
  for (const b of bands) {
    if (b.p5 === null || b.p95 === null) close();
    else run.push(b);
  }
  close();
  return out;
}
