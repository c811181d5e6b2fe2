/**
 * A line's picks → layer velocities and refractor depths under every geophone, by one of the
 * layer methods. The same code serves the interpretation pages and `npm run layers`.
 */
import { assignRefractors, segmentSide } from './assign';
import { suggestAssignment } from './datum';
import { lineGeophones, refractorBranches, reversedPairs } from './branches';
import { strippedDepth, verticalDepths } from './depth';
import { grm } from './grm';
import { interceptRefractor, type BranchLine } from './intercept';
import { directVelocity } from './overburden';
import { pairFunctions } from './functions';
import { plusMinus, type RefractorTimes } from './plus-minus';
import { median } from './robust-line';
import { shotSides } from './sides';
import { LayerInputError, type GeophoneDepth, type LayerOptions, type LayerResult, type LayerShot, type RefractorFunctions } from './types';

export function interpretLayers(shots: readonly LayerShot[], surfaceZ: (x: number) => number, options: LayerOptions): LayerResult {
  const layers = options.layers;
  const withPicks = shots.filter((s) => s.times.length > 0);
  if (withPicks.length < 2) throw new LayerInputError(`the layer methods need picks from at least two shots, one from each end (there ${withPicks.length === 1 ? 'is one' : 'are none'})`);
  const geophones = lineGeophones(shots);
  const spread = geophones[geophones.length - 1] - geophones[0];
  if (options.xy !== undefined && !(options.xy >= 0 && options.xy <= spread)) {
    throw new LayerInputError(`XY ${options.xy} m must be from 0 to the spread's length (${+spread.toFixed(3)} m)`);
  }
  const assignment = options.assignment ?? assignRefractors(shots, layers);
  // The refractor velocities are read on the split of the curves reduced to a flat datum (datum.ts).
  const forVelocity = options.assignment ?? suggestAssignment(shots, layers, assignment);
  const warnings: string[] = [];
  const v1 = directVelocity(shots, assignment);
  if (!Number.isFinite(v1)) throw new LayerInputError('no direct-wave picks: the top layer\'s velocity needs picks near the shots, before the first slope break');
  const velocities = [v1];
  const spacing = median(geophones.slice(1).map((x, i) => x - geophones[i])) || 1;

  // Per refractor: time-depths per geophone (plus–minus, GRM) or lines under the shots (intercept).
  const timeDepths: Map<number, number>[] = [];
  const interceptLines: BranchLine[][] = [];
  let xy: number | null = null;
  let xyScan: { xy: number; rms: number }[] = [];
  const functions: RefractorFunctions[] = [];
  for (let n = 1; n < layers; n++) {
    const branches = refractorBranches(shots, assignment, n);
    if (!branches.length) {
      throw new LayerInputError(`no travel-time curve reaches refractor ${n}: no shot has ${3} or more picks beyond a slope break${n > 1 ? ` on the ${n + 1}-layer assignment` : ''}`);
    }
    if (options.method === 'intercept') {
      const r = interceptRefractor(branches, velocities[n - 1], n === 1);
      if (!r.lines.length) throw reversedError(n, branches);
      velocities.push(r.velocity);
      interceptLines.push(r.lines);
      continue;
    }
    const pairs = reversedPairs(branches, geophones);
    if (!pairs.length) throw reversedError(n, branches);
    let times: RefractorTimes = plusMinus(pairs);
    if (forVelocity !== assignment) {
      const reduced = reversedPairs(refractorBranches(shots, forVelocity, n), geophones);
      const v = reduced.length ? plusMinus(reduced).velocity : Number.NaN;
      if (Number.isFinite(v)) times = { ...times, velocity: v };
    }
    let usedXY = 0;
    if (options.method === 'grm') {
      const depthGuess = median([...times.timeDepth.values()]) / Math.sqrt(Math.max(1e-12, 1 / velocities[n - 1] ** 2 - 1 / times.velocity ** 2));
      const theory = 2 * depthGuess * velocities[n - 1] / Math.sqrt(Math.max(1e-9, times.velocity ** 2 - velocities[n - 1] ** 2));
      const g = grm(pairs, geophones, options.xy !== undefined ? { xy: options.xy } : { maxXY: Math.min(spread / 4, Math.max(2 * spacing, 1.5 * theory)), step: spacing / 2 }, times.velocity);
      if (g.timeDepth.size) {
        times = g;
        usedXY = g.xy;
        if (n === layers - 1) [xy, xyScan] = [g.xy, g.scan];
      }
    }
    velocities.push(times.velocity);
    timeDepths.push(times.timeDepth);
    functions.push({ refractor: n, xy: usedXY, pairs: pairFunctions(pairs, geophones, usedXY, times.velocity, shots) });
  }

  for (let n = 1; n < layers; n++) {
    if (!(velocities[n] > velocities[n - 1])) {
      warnings.push(`layer ${n + 1} (${Math.round(velocities[n])} m/s) is not faster than the layer above (${Math.round(velocities[n - 1])} m/s): a velocity inversion the layer methods cannot resolve; its depths are not meaningful`);
    }
  }
  warnings.push(...assignmentWarnings(shots, layers));

  const depths = options.method === 'intercept' ? interceptDepths(geophones, surfaceZ, velocities, interceptLines, shots) : delayDepths(geophones, surfaceZ, velocities, timeDepths);
  return { method: options.method, velocities, xy, xyScan, depths, assignment, warnings, functions };
}

function reversedError(n: number, branches: { direction: number }[]): LayerInputError {
  const f = branches.filter((b) => b.direction === 1).length;
  return new LayerInputError(
    `refractor ${n} needs reversed shots: a shot at each end whose picks reach it over the same geophones (found ${f} forward and ${branches.length - f} reverse branches with no geophones in common)`,
  );
}

/** Plus–minus and GRM: normal depths from the time-depths, refractor by refractor, then vertical. */
function delayDepths(geophones: number[], surfaceZ: (x: number) => number, velocities: number[], timeDepths: Map<number, number>[]): GeophoneDepth[] {
  const out: GeophoneDepth[] = [];
  const normalAbove = new Map<number, number[]>();
  timeDepths.forEach((td, k) => {
    const n = k + 1;
    const xs: number[] = [];
    const normal: number[] = [];
    for (const x of geophones) {
      const t = td.get(x);
      const above = normalAbove.get(x) ?? [];
      if (t === undefined || above.length !== n - 1) continue;
      const d = strippedDepth(t, n, velocities, above);
      if (!(d > 0) || !Number.isFinite(d)) continue;
      xs.push(x);
      normal.push(d);
      normalAbove.set(x, [...above, d]);
    }
    const ground = xs.map(surfaceZ);
    const vertical = verticalDepths(xs, ground, normal);
    xs.forEach((x, i) => out.push({ x, groundZ: ground[i], refractor: n, depth: vertical[i], refractorZ: ground[i] - vertical[i], refractorVelocity: velocities[n] }));
  });
  return out;
}

/** Intercept-time: each branch's refractor line under its geophones, averaged where branches overlap. */
function interceptDepths(geophones: number[], surfaceZ: (x: number) => number, velocities: number[], lines: BranchLine[][], shots: readonly LayerShot[]): GeophoneDepth[] {
  const out: GeophoneDepth[] = [];
  const refractorZ: Map<number, number>[] = [];
  lines.forEach((list, k) => {
    const n = k + 1;
    const sums = new Map<number, number[]>();
    for (const line of list) {
      const b = line.branch;
      const sx = b.sourceX;
      const sz = shots[b.shot].source.z;
      // Depths of the refractors above under the shot, from their own lines (nearest geophone).
      const above = refractorZ.map((m) => sz - nearest(m, sx));
      const normal = strippedDepth(line.timeDepth, n, velocities, above);
      if (!(normal > 0)) continue;
      const zUnderShot = sz - normal / Math.cos(line.dip);
      for (const x of geophones) {
        if (x < b.x[0] - 1e-6 || x > b.x[b.x.length - 1] + 1e-6) continue;
        const list2 = sums.get(x) ?? [];
        list2.push(zUnderShot - (x - sx) * Math.tan(line.dip));
        sums.set(x, list2);
      }
    }
    const zs = new Map<number, number>();
    for (const [x, list2] of [...sums].sort((a, b) => a[0] - b[0])) {
      const z = list2.reduce((a, b) => a + b, 0) / list2.length;
      const g = surfaceZ(x);
      if (!(g - z > 0)) continue;
      zs.set(x, z);
      out.push({ x, groundZ: g, refractor: n, depth: g - z, refractorZ: z, refractorVelocity: velocities[n] });
    }
    refractorZ.push(zs);
  });
  return out;
}

function nearest(m: Map<number, number>, x: number): number {
  let best = Number.NaN, d = Infinity;
  for (const [k, v] of m) if (Math.abs(k - x) < d) [d, best] = [Math.abs(k - x), v];
  return best;
}

/** Hidden-layer and blind-zone hints from the shape of the travel-time curves. */
function assignmentWarnings(shots: readonly LayerShot[], layers: number): string[] {
  const sigma = median(shots.flatMap((s) => Array.from(s.sigmas))) || 0.0005;
  const sides = shotSides(shots).filter((s) => s.picks.length >= 8);
  if (!sides.length) return [];
  // Refractor branches per curve when three layers are allowed.
  const counts = sides.map((s) => {
    const f = segmentSide(s, 3, sigma);
    return f.slopes.length - (f.direct ? 1 : 0);
  });
  const warnings: string[] = [];
  if (layers === 2 && counts.filter((c) => c === 2).length > sides.length / 2) {
    warnings.push('most travel-time curves show a second slope break: the ground may have three layers (try three layers)');
  }
  if (layers === 3 && counts.filter((c) => c === 2).length < sides.length / 2) {
    warnings.push('the middle layer shows on fewer than half of the travel-time curves: it may be thin or hidden (a blind zone), and its depths are uncertain');
  }
  return warnings;
}
