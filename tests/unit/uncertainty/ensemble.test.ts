/**
 * The pieces of an ensemble (issue 20): member plans, perturbed picks and the combination, against
 * NumPy (a general-purpose reference library, installed with python3-segyio) for the statistics and
 * against exact depths for the band: in a member whose velocity is v = 500 + k·depth, the depth of
 * v* is (v* − 500)/k exactly (iso-depth interpolates linearly between node rows).
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import type { InversionShot } from '../../../shared/inversion/types';
import { combineMembers, memberChi2Limit, quantile, type MemberSection } from '../../../shared/uncertainty/combine';
import { memberShots } from '../../../shared/uncertainty/perturb';
import { memberRockVelocity, planMembers, SPREAD } from '../../../shared/uncertainty/plan';

const numpy = (script: string, input: unknown): unknown =>
  JSON.parse(execFileSync('/usr/bin/python3', ['-c', `import sys, json, numpy as np\nd = json.loads(sys.stdin.read())\n${script}`], { input: JSON.stringify(input), encoding: 'utf8' }));

describe('ensemble statistics', () => {
  it('takes quantiles as NumPy does (linear between order statistics, Hyndman & Fan type 7)', () => {
    const sets = [[3.2], [1, 2], [5, 1, 4, 2, 3], Array.from({ length: 24 }, (_, i) => Math.sin(i * 1.7) * 10 + i / 3)];
    const ours = sets.map((s) => [0.05, 0.5, 0.95].map((p) => quantile([...s].sort((a, b) => a - b), p)));
    const theirs = numpy('print(json.dumps([[float(np.percentile(s, q)) for q in (5, 50, 95)] for s in d]))', sets) as number[][];
    ours.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(theirs[i][j], 10)));
  });

  // 21 × 11 nodes, 1 m apart, flat ground at z = 10: member k has v = 500 + g_k · depth, covered everywhere, rays to the bottom.
  const grid: Grid = { x0: 0, dx: 1, nx: 21, z0: 10, dz: 1, nz: 11 };
  const gradients = [100, 120, 150, 200, 250, 80];
  const member = (g: number, chi2: number): MemberSection => ({
    velocity: Float32Array.from({ length: grid.nx * grid.nz }, (_, i) => 500 + g * Math.floor(i / grid.nx)),
    coverage: new Float32Array(grid.nx * grid.nz).fill(5),
    doi: new Float64Array(grid.nx).fill(0),
    chi2,
  });
  const members = [...gradients.map((g) => member(g, 1.0)), member(400, 3.5)]; // the last fits badly
  const summary = combineMembers(members, grid, [[0, 10], [20, 10]], { threshold: 1, rockVelocity: 1200, stationXs: [0, 7.5, 20] });

  it('leaves out members that do not fit (χ² > 1.2) and counts them', () => {
    expect([summary.used, summary.excluded]).toEqual([6, 1]);
  });

  it('gives each node the mean and sample standard deviation of the members, as NumPy', () => {
    const depth = 6;
    const values = gradients.map((g) => 500 + g * depth);
    const [mean, sd] = numpy('print(json.dumps([float(np.mean(d)), float(np.std(d, ddof=1))]))', values) as number[];
    const i = depth * grid.nx + 4;
    expect(summary.mean[i]).toBeCloseTo(mean, 3);
    expect(summary.std[i]).toBeCloseTo(sd, 2);
    // Faster than 1200 m/s at 6 m: 500 + 6g > 1200 for g > 116.7 → 4 of 6 members.
    expect(summary.probabilityFaster[i]).toBeCloseTo(4 / 6, 6);
  });

  it('bands the depth of the chosen velocity at each station: median and 5–95 % of the exact member depths', () => {
    const exact = gradients.map((g) => (1200 - 500) / g);
    const [p5, median, p95] = numpy('print(json.dumps([float(np.percentile(d, q)) for q in (5, 50, 95)]))', exact) as number[];
    for (const band of summary.bands) {
      expect(band.resolved).toBe(6);
      expect(band.median).toBeCloseTo(median, 5);
      expect(band.p5).toBeCloseTo(p5, 5);
      expect(band.p95).toBeCloseTo(p95, 5);
    }
  });

  it('with a rock velocity per member, bands each member\'s own v* depth and counts faster than its own v*', () => {
    const rocks = [1000, 1100, 1200, 1300, 1400, 1250]; // every depth inside the 10 m grid
    const own = combineMembers(gradients.map((g, k) => ({ ...member(g, 1), rockVelocity: rocks[k] })), grid, [[0, 10], [20, 10]], { threshold: 1, rockVelocity: 1200, stationXs: [10] });
    const exact = gradients.map((g, k) => (rocks[k] - 500) / g);
    const [p5, median, p95] = numpy('print(json.dumps([float(np.percentile(d, q)) for q in (5, 50, 95)]))', exact) as number[];
    expect([own.bands[0].p5, own.bands[0].median, own.bands[0].p95].map((v) => Number(v!.toFixed(6)))).toEqual([p5, median, p95].map((v) => Number(v.toFixed(6))));
    // At 6 m: member k is faster than its v* when 500 + 6 g_k > rocks[k]: 1100 > 1000, 1220 > 1100, 1400 > 1200, 1700 > 1300, 2000 > 1400, 980 < 1250.
    expect(own.probabilityFaster[6 * grid.nx + 4]).toBeCloseTo(5 / 6, 6);
  });
});

describe('a member\'s rock velocity drawn from a range', () => {
  it('stays inside the range, is log-uniform (median at the geometric mean), and is the value itself for an empty range', () => {
    const draws = Array.from({ length: 4001 }, (_, i) => memberRockVelocity(i * 2654435761 >>> 0, 1500, 3000)).sort((a, b) => a - b);
    expect(draws[0]).toBeGreaterThanOrEqual(1500);
    expect(draws.at(-1)!).toBeLessThanOrEqual(3000);
    // Median of a log-uniform variable on [a, b] is sqrt(a·b) = 2121.3 m/s; 4001 draws put it within ~2 %.
    expect(Math.abs(quantile(draws, 0.5) / Math.sqrt(1500 * 3000) - 1)).toBeLessThan(0.02);
    expect(memberRockVelocity(12345, 2500, 2500)).toBe(2500);
    expect(memberRockVelocity(12345, 1500, 3000)).toBe(memberRockVelocity(12345, 1500, 3000));
  });
});

describe('member plans and picks', () => {
  it('draws each member from its own seed, the same every time, within the stated spreads', () => {
    const a = planMembers(64, 42, { start: true, smoothing: true, picks: 'sigma' });
    expect(planMembers(64, 42, { start: true, smoothing: true, picks: 'sigma' })).toEqual(a);
    expect(new Set(a.map((m) => m.seed)).size).toBe(64);
    for (const m of a) {
      expect(m.v0Factor).toBeGreaterThanOrEqual(1 / SPREAD.v0);
      expect(m.v0Factor).toBeLessThanOrEqual(SPREAD.v0);
      expect(m.kFactor).toBeGreaterThanOrEqual(1 / SPREAD.k);
      expect(m.smoothingFactor).toBeLessThanOrEqual(SPREAD.smoothing);
    }
    const fixed = planMembers(4, 42, { start: false, smoothing: false, picks: 'none' });
    expect(fixed.every((m) => m.v0Factor === 1 && m.kFactor === 1 && m.smoothingFactor === 1)).toBe(true);
  });

  const shots: InversionShot[] = Array.from({ length: 10 }, (_, k) => ({
    shotId: `S${k + 1}`,
    source: { x: 5 * k, z: 0 },
    receivers: new Float64Array(4000),
    times: Float64Array.from({ length: 2000 }, (_, i) => 0.01 + i * 1e-5),
    sigmas: new Float64Array(2000).fill(0.0005),
  }));

  it('moves each pick by its sigma times a standard normal deviate', () => {
    const moved = memberShots(shots, { seed: 7, picks: 'sigma' });
    const z = moved.flatMap((s, k) => Array.from(s.times, (t, i) => (t - shots[k].times[i]) / shots[k].sigmas[i]));
    const [mean, sd] = numpy('print(json.dumps([float(np.mean(d)), float(np.std(d, ddof=1))]))', z) as number[];
    // 20 000 deviates: the mean within 3 standard errors (0.02) of 0, the spread within 2 % of 1.
    expect(Math.abs(mean)).toBeLessThan(0.03);
    expect(Math.abs(sd - 1)).toBeLessThan(0.02);
  });

  it('resamples whole shots with replacement, keeping their count', () => {
    const drawn = memberShots(shots, { seed: 11, picks: 'bootstrap' });
    expect(drawn).toHaveLength(shots.length);
    expect(new Set(drawn.map((s) => s.shotId)).size).toBe(shots.length);
    for (const s of drawn) expect(shots.some((o) => o.times === s.times && s.shotId.startsWith(`${o.shotId}#`))).toBe(true);
    expect(new Set(drawn.map((s) => s.shotId.split('#')[0])).size).toBeLessThan(shots.length); // some drawn twice (seed 11)
  });
});

describe('a member\'s problem', () => {
  it('starts from the fitted gradient times the member\'s factors, and the automatic weight schedule from its first weight times its factor', async () => {
    const { memberProblem } = await import('../../../shared/uncertainty/member');
    const grid: Grid = { x0: 0, dx: 2, nx: 6, z0: 20, dz: 2, nz: 6 };
    const active = new Uint8Array(36).fill(1);
    const settings = { maxIterations: 10, smoothing: null, verticalWeight: 0.5, damping: 0.05, vMin: 100, vMax: 7000, order: 2 as const, checkerboard: true, checkerSize: null };
    const base = { problem: { grid, active, start: new Float32Array(36).fill(1), shots: [], settings }, surfaceZ: () => 20, fit: { v0: 400, k: 50 } };
    const p = memberProblem(base, { index: 0, seed: 1, v0Factor: 1.2, kFactor: 0.5, smoothingFactor: 2, picks: 'none' });
    // Node (ix 3, iz 4) lies 8 m below the flat ground: 480 + 25 · 8 = 680 m/s.
    expect(p.start[4 * 6 + 3]).toBe(680);
    expect(p.settings.smoothing).toBeNull(); // the automatic schedule, as the base ran it …
    expect(p.autoSmoothingStart).toBe(100); // … started at its first weight (50, shared/inversion/README.md) × 2
    expect(p.settings.checkerboard).toBe(false);
    // A base with a fixed weight: the member's weight is fixed too, times its factor.
    const fixed = memberProblem({ ...base, problem: { ...base.problem, settings: { ...settings, smoothing: 4 } } }, { index: 0, seed: 1, v0Factor: 1, kFactor: 1, smoothingFactor: 0.5, picks: 'none' });
    expect([fixed.settings.smoothing, fixed.autoSmoothingStart]).toEqual([2, undefined]);
    // No start factors, or a saved-model start: the base's own start.
    expect(memberProblem({ ...base, fit: null }, { index: 0, seed: 1, v0Factor: 1.2, kFactor: 0.5, smoothingFactor: 1, picks: 'none' }).start).toBe(base.problem.start);
  });
});

describe('a member judged against the original picks', () => {
  it('measures χ² per datum against the picks as observed, whatever the member fitted (hand-computed)', async () => {
    const { chi2AgainstOriginal, memberShots } = await import('../../../shared/uncertainty/perturb');
    const original: InversionShot[] = [
      { shotId: 'A', source: { x: 0, z: 0 }, receivers: new Float64Array(4), times: Float64Array.of(0.01, 0.02), sigmas: Float64Array.of(0.001, 0.001) },
      { shotId: 'B', source: { x: 9, z: 0 }, receivers: new Float64Array(2), times: Float64Array.of(0.03), sigmas: Float64Array.of(0.002) },
    ];
    const perturbed = memberShots(original, { seed: 5, picks: 'sigma' });
    // Computed times 1 ms off on A's picks (1σ each) and 4 ms off on B's (2σ): (1 + 1 + 4) / 3 = 2.
    expect(chi2AgainstOriginal(original, perturbed, [0.011, 0.019, 0.034])).toBeCloseTo(2, 10);
    // A bootstrap member that drew B twice: each copy is compared with B's own pick.
    const drawn = [{ ...original[1], shotId: 'B#1' }, { ...original[1], shotId: 'B#2' }];
    expect(chi2AgainstOriginal(original, drawn, [0.032, 0.028])).toBeCloseTo(1, 10);
  });
});

describe('which members are used', () => {
  it('holds members to χ² ≤ 1.2, or to 25 % above the base inversion when it stopped higher', () => {
    expect(memberChi2Limit(0.95)).toBe(1.2);
    expect(memberChi2Limit(1.5)).toBeCloseTo(1.875, 12);
    expect(memberChi2Limit(null)).toBe(1.2);
    expect(memberChi2Limit(Number.NaN)).toBe(1.2);
  });
});

describe('the band drawn on a section', () => {
  it('outlines each run of stations with a band, 5 % depth out and 95 % depth back, never across a gap (hand-worked)', async () => {
    const { bandOutlines } = await import('../../../shared/uncertainty/band-outline');
    const band = (x: number, p5: number | null, p95: number | null) => ({ x, resolved: 5, median: p5, p5, p95 });
    const outlines = bandOutlines([band(0, 1, 3), band(2, 2, 4), band(4, null, null), band(6, 1, 2), band(8, 2, 5), band(10, 3, 6), band(12, 1, 1)], (x) => 100 + x / 2);
    expect(outlines).toEqual([
      { x: [0, 2, 2, 0], z: [99, 99, 97, 97] },
      { x: [6, 8, 10, 12, 12, 10, 8, 6], z: [102, 102, 102, 105, 105, 99, 99, 101] },
    ]);
  });
});

describe('the band at the boreholes', () => {
  // Stations every 10 m; no band at x = 30 (too few members resolve it there).
  const band = (x: number, p5: number | null, median: number | null, p95: number | null) => ({ x, resolved: 8, p5, median, p95 });
  const bands = [band(0, 4, 5, 6), band(10, 6, 7, 10), band(20, 5, 6, 7), band(30, null, null, null), band(40, 8, 9, 10)];

  it('interpolates the band linearly between neighbouring stations that both have one (hand-worked), and gives none next to a gap or beyond the ends', async () => {
    const { bandAt } = await import('../../../shared/uncertainty/band-ties');
    expect(bandAt(bands, 10)).toEqual({ p5: 6, median: 7, p95: 10 });
    // x = 2.5 between 0 and 10: a quarter of the way.
    expect(bandAt(bands, 2.5)).toEqual({ p5: 4.5, median: 5.5, p95: 7 });
    expect(bandAt(bands, 25)).toBeNull();
    expect(bandAt(bands, 30)).toBeNull();
    expect(bandAt(bands, -1)).toBeNull();
    expect(bandAt(bands, 41)).toBeNull();
  });

  it('says whether the logged top of rock lies inside the band, shallower or deeper, for holes that log one', async () => {
    const { bandTies } = await import('../../../shared/uncertainty/band-ties');
    const ties = bandTies(bands, [
      { name: 'BH1', x: 2.5, contacts: [{ depth: 1, rockTop: false }, { depth: 6, rockTop: true }] },
      { name: 'BH2', x: 15, contacts: [{ depth: 5, rockTop: true }] },
      { name: 'BH3', x: 20, contacts: [{ depth: 7.5, rockTop: true }] },
      { name: 'TP1', x: 10, contacts: [{ depth: 1.2 }] },
      { name: 'BH4', x: 35, contacts: [{ depth: 9, rockTop: true }] },
    ]);
    expect(ties.map((t) => [t.name, t.verdict])).toEqual([['BH1', 'inside'], ['BH2', 'shallower'], ['BH3', 'deeper'], ['BH4', 'no band']]);
    // BH2 at x = 15, half-way from 10 to 20: 5.5–8.5 m, logged 5 m.
    expect(ties[1].band).toEqual({ p5: 5.5, median: 6.5, p95: 8.5 });
  });
});
