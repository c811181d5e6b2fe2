/**
 * Generalized reciprocal method (Palmer 1980, "The generalized reciprocal method of seismic
 * refraction interpretation", SEG; Palmer 1981, Geophysics 46(11), 1508–1518). For a forward
 * shot A and a reverse shot B on the same refractor, geophones X and Y a distance XY apart and
 * G midway between them:
 *   velocity analysis  t_V = (t_AY − t_BX + t_AB) / 2        (slope 1 / V along the line),
 *   time-depth         t_G = (t_AY + t_BX − (t_AB + XY / V)) / 2.
 * Times at X and Y are read on each branch between picks, so any XY can be tried on irregular
 * spacing. The optimum XY is the one whose velocity-analysis function is simplest — closest to
 * a straight line (Palmer 1980's criterion for the velocity analysis): the smallest RMS of the
 * functions about their Theil–Sen lines, over every shot pair. XY = 0 is the plus–minus method.
 * Only XY up to 1.5 times the two-layer estimate 2h·tan i_c is tried (h from XY = 0): beyond it
 * the functions only get smoother, and the smallest RMS would always lie at the end.
 */
import { pairsForGeophone, timeAt, type ReversedPair } from './branches';
import type { RefractorTimes } from './plus-minus';
import { median, pooledSlope, rmsAbout, theilSen } from './robust-line';

export interface GrmResult extends RefractorTimes {
  xy: number;
  scan: { xy: number; rms: number }[];
}

interface Analysis {
  velocity: number;
  rms: number;
  timeDepth: Map<number, number>;
}

/** Velocity analysis and time-depths at one XY, over every pair. */
function analyse(pairs: readonly ReversedPair[], geophones: readonly number[], xy: number, knownVelocity?: number): Analysis {
  let sq = 0, count = 0;
  const perPair: { p: ReversedPair; g: number[]; tv: number[] }[] = [];
  for (const p of pairs) {
    const g: number[] = [];
    const tv: number[] = [];
    for (const x of geophones) {
      const ty = timeAt(p.forward, x + xy / 2), tx = timeAt(p.reverse, x - xy / 2);
      if (!Number.isFinite(ty) || !Number.isFinite(tx) || x <= p.forward.sourceX || x >= p.reverse.sourceX) continue;
      g.push(x);
      tv.push((ty - tx + p.reciprocal) / 2);
    }
    if (g.length < 3) continue;
    const r = rmsAbout(theilSen(g, tv), g, tv);
    sq += r * r * g.length;
    count += g.length;
    perPair.push({ p, g, tv });
  }
  // The velocity from every pair's function at once, each with its own offset.
  const slope = pooledSlope(perPair.map(({ g, tv }) => ({ x: g, y: tv })));
  const velocity = knownVelocity ?? (slope > 0 ? 1 / slope : Number.NaN);
  const covered = new Map(perPair.map(({ p, g }) => [p, new Set(g)]));
  const timeDepth = new Map<number, number>();
  for (const x of [...new Set(perPair.flatMap(({ g }) => g))].sort((a, b) => a - b)) {
    const use = pairsForGeophone([...covered.keys()], x, (p, g) => covered.get(p)!.has(g));
    const ty = (p: ReversedPair) => timeAt(p.forward, x + xy / 2), tx = (p: ReversedPair) => timeAt(p.reverse, x - xy / 2);
    timeDepth.set(x, median(use.map((p) => (ty(p) + tx(p) - (p.reciprocal + xy / velocity)) / 2)));
  }
  return { velocity, rms: count ? Math.sqrt(sq / count) : Number.NaN, timeDepth };
}

/**
 * GRM at the given XY, or at the optimum over 0 … maxXY in steps of `step`. `knownVelocity`: the
 * refractor velocity when found otherwise (interpret.ts: on the curves reduced to a datum).
 */
export function grm(pairs: readonly ReversedPair[], geophones: readonly number[], choice: { xy: number } | { maxXY: number; step: number }, knownVelocity?: number): GrmResult {
  // Else the refractor velocity from the velocity-analysis function at XY = 0, where each geophone's
  // own delay cancels: at XY > 0 the delays under X and Y differ on uneven ground and tilt the
  // function (measured: +5 % on 2.5 m of topography over a 4 m undulation, +3 % at XY = 0).
  const velocity = knownVelocity ?? analyse(pairs, geophones, 0).velocity;
  if ('xy' in choice) {
    const a = analyse(pairs, geophones, choice.xy, velocity);
    return { velocity: a.velocity, timeDepth: a.timeDepth, xy: choice.xy, scan: [{ xy: choice.xy, rms: a.rms }] };
  }
  const scan: { xy: number; rms: number; a: Analysis }[] = [];
  for (let k = 0; k * choice.step <= choice.maxXY + 1e-9; k++) {
    const xy = +(k * choice.step).toFixed(6);
    const a = analyse(pairs, geophones, xy, velocity);
    if (Number.isFinite(a.rms) && a.timeDepth.size) scan.push({ xy, rms: a.rms, a });
  }
  if (!scan.length) return { velocity: Number.NaN, timeDepth: new Map(), xy: 0, scan: [] };
  const best = scan.reduce((b, s) => (s.rms < b.rms ? s : b));
  return { velocity: best.a.velocity, timeDepth: best.a.timeDepth, xy: best.xy, scan: scan.map(({ xy, rms }) => ({ xy, rms })) };
}
