/**
 * Invented survey data for inversion tests: surface shots and geophones over flat ground (z = 0)
 * where velocity grows linearly with depth, v = v0 + k·depth. In such ground the first arrival at
 * offset x is t = (2/k)·asinh(k·x / (2·v0)) (the diving wave of a linear gradient; Slotnick 1959,
 * "Lessons in Seismic Computing", SEG; the same field as Fomel, Luo & Zhao 2009, J. Comput. Phys.
 * 228 — from memory). Times carry Gaussian noise of the stated sigma from a seeded generator.
 */
export interface GradientSurvey {
  v0: number;
  k: number;
  shotXs: number[];
  receiverXs: number[];
  sigmaMs: number;
  /** Noise added to each time, in units of sigma (0: exact times). */
  noise?: number;
  seed?: number;
}

export const gradientTime = (x: number, v0: number, k: number) => (2 / k) * Math.asinh((k * x) / (2 * v0));

/** mulberry32 (a small public-domain PRNG) and the Box–Muller transform: reproducible N(0, 1) deviates. */
function normals(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** The pick file (FORMATS.md §2) and the number of picks; geophones at a shot's own position are left out. */
export function gradientPicks(s: GradientSurvey): { csv: string; picks: number } {
  const noise = normals(s.seed ?? 11);
  const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  s.shotXs.forEach((sx, i) => {
    for (const rx of s.receiverXs) {
      if (rx === sx) continue;
      const t = gradientTime(Math.abs(rx - sx), s.v0, s.k) * 1000 + (s.noise ?? 1) * s.sigmaMs * noise();
      rows.push(`S${i + 1},${sx},,${rx},,${t.toFixed(4)},${s.sigmaMs}`);
    }
  });
  return { csv: rows.join('\n'), picks: rows.length - 1 };
}

/** A station table (geophones on flat ground at z = 0). */
export const flatStations = (xs: readonly number[]) => xs.map((x, i) => ({ station: i + 1, x, z: 0 }));

export const range = (from: number, to: number, step: number) => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);
