/**
 * The depth band against the logged top of rock at the holes: the band at a hole is interpolated
 * linearly between the two stations either side that both have one (none beyond the end stations or
 * next to a station without a band), and the logged depth is inside it, shallower or deeper. The
 * check a geophysicist makes before trusting v*: a log outside the band says v* (or the model) needs
 * calibrating there.
 */
import type { DepthBand } from './combine';

export interface LoggedHole {
  name: string;
  x: number;
  contacts: readonly { depth: number; rockTop?: boolean }[];
}

export interface BandAtX {
  p5: number;
  median: number;
  p95: number;
}

export interface BandTie {
  name: string;
  x: number;
  /** Depth below ground of the contact marked top of rock (m). */
  logged: number;
  band: BandAtX | null;
  verdict: 'inside' | 'shallower' | 'deeper' | 'no band';
}

const banded = (b: DepthBand): b is DepthBand & BandAtX => b.p5 !== null && b.median !== null && b.p95 !== null;

/** The band at x, linear between neighbouring stations (sorted by x) that both have one; null elsewhere. */
export function bandAt(bands: readonly DepthBand[], x: number): BandAtX | null {
  const sorted = [...bands].sort((a, b) => a.x - b.x);
  for (let i = 0; i < sorted.length; i++) {
    const a = sorted[i];
    if (a.x === x) return banded(a) ? { p5: a.p5, median: a.median, p95: a.p95 } : null;
    const b = sorted[i + 1];
    if (!b || !(a.x < x && x < b.x)) continue;
    if (!banded(a) || !banded(b)) return null;
    const f = (x - a.x) / (b.x - a.x);
    const lerp = (u: number, v: number) => u + f * (v - u);
    return { p5: lerp(a.p5, b.p5), median: lerp(a.median, b.median), p95: lerp(a.p95, b.p95) };
  }
  return null;
}

/** One tie per hole with a contact marked top of rock (the first such contact). */
export function bandTies(bands: readonly DepthBand[], holes: readonly LoggedHole[]): BandTie[] {
  return holes.flatMap((h) => {
    const rock = h.contacts.find((c) => c.rockTop);
    if (!rock) return [];
    const band = bandAt(bands, h.x);
    const verdict: BandTie['verdict'] = !band ? 'no band' : rock.depth < band.p5 ? 'shallower' : rock.depth > band.p95 ? 'deeper' : 'inside';
    return [{ name: h.name, x: h.x, logged: rock.depth, band, verdict }];
  });
}
