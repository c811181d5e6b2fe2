/**
 * `npx tsx scripts/make-inversion-report-fixture.ts [OUT.json]`
 * Writes fixtures/report/inversion-small.json: an invented survey (soil over weathered rock over a
 * rockhead that deepens to the east) with times from the engine on a model four times finer than
 * the inversion grid plus invented Gaussian noise, inverted from the automatic gradient start with
 * the checkerboard test. The inversion report's tests and sample read the stored result, so they
 * do not spend half a minute inverting.
 */
import { writeFileSync } from 'node:fs';
import { sampleTime, solveTravelTimes } from '../shared/eikonal';
import { gradientStart, inProcessModeller, invert, type InversionShot } from '../shared/inversion';
import { parseModelFile, rasteriseModel } from '../shared/model';
import { DEFAULT_INVERSION_SETTINGS } from '../shared/schemas/inversions';
import { gaussianNoise } from '../fixtures/report/assemble';

const out = process.argv[2] ?? new URL('../fixtures/report/inversion-small.json', import.meta.url).pathname;

const SURFACE: [number, number][] = [[-6, 30.6], [30, 31.5], [66, 30.2]];
const TRUE_MODEL = {
  format: 'timefield-model/1',
  grid: { x0: -6, dx: 0.25, nx: 289, z0: 32, dz: 0.25, nz: 105 },
  surface: SURFACE,
  layers: [
    { name: 'sandy soil', base: [[-6, 27.6], [30, 28.2], [66, 26.8]], v_top: 450, v_base: 650 },
    { name: 'weathered granite', base: [[-6, 22.5], [30, 20.5], [66, 15.5]], v_top: 1300, v_base: 1700 },
    { name: 'granite', v_top: 3200, v_base: 3600 },
  ],
};
const GEOPHONES = Array.from({ length: 25 }, (_, i) => 2.5 * i);
const SHOT_XS = [-5, 0, 10, 20, 30, 40, 50, 60, 65];
const SIGMA = 0.0005;

const parsed = parseModelFile(TRUE_MODEL);
if (!parsed.ok) throw new Error(`true model invalid: ${JSON.stringify(parsed.issues)}`);
const fine = rasteriseModel(parsed.model);
const noise = gaussianNoise(20261204);
const round5 = (t: number) => Math.round(t * 1e5) / 1e5; // picks to 0.01 ms, as a pick file holds them
const shots: InversionShot[] = SHOT_XS.map((sx) => {
  const source = { x: sx, z: fine.surfaceZ(sx) };
  const T = solveTravelTimes(fine.grid, fine.velocity, fine.active, source, { cellSlowness: fine.cellSlowness });
  const xs = GEOPHONES.filter((x) => Math.abs(x - sx) > 1e-9);
  return {
    shotId: `S${sx}`,
    source,
    receivers: Float64Array.from(xs.flatMap((x) => [x, fine.surfaceZ(x)])),
    times: Float64Array.from(xs, (x) => round5(sampleTime(fine.grid, T, fine.active, { x, z: fine.surfaceZ(x) }) + SIGMA * noise())),
    sigmas: new Float64Array(xs.length).fill(SIGMA),
  };
});

// Inversion grid: 1 m nodes, same surface.
const coarseFile = parseModelFile({ format: 'timefield-model/1', grid: { x0: -6, dx: 1, nx: 73, z0: 32, dz: 1, nz: 27 }, surface: SURFACE, velocity: new Array(73 * 27).fill(1000) });
if (!coarseFile.ok) throw new Error('coarse model invalid');
const coarse = rasteriseModel(coarseFile.model);
const settings = { ...DEFAULT_INVERSION_SETTINGS, checkerboard: true };
const start = gradientStart(coarse.grid, coarse.active, coarse.surfaceZ, shots, settings);
const problem = { grid: coarse.grid, active: coarse.active, start: start.velocity, shots, settings };
const t0 = performance.now();
const result = await invert(problem, inProcessModeller(problem), {
  onIteration: (r) => {
    process.stderr.write(`iteration ${r.iteration}: chi² ${r.chi2.toFixed(3)}, RMS ${r.rmsMs.toFixed(3)} ms\n`);
  },
});
const seconds = (performance.now() - t0) / 1000;

const nullable = (a: ArrayLike<number>, digits: number) => Array.from(a, (v) => (Number.isFinite(v) ? +v.toFixed(digits) : null));
let at = 0;
const residuals = shots.flatMap((s) =>
  Array.from(s.times, (t, i) => {
    const c = result.computed[at++];
    return { shotId: s.shotId, receiverX: s.receivers[2 * i], observedMs: +(t * 1000).toFixed(2), computedMs: +(c * 1000).toFixed(4), sigmaMs: s.sigmas[i] * 1000 };
  }),
);
const cb = result.checkerboard!;
writeFileSync(
  out,
  `${JSON.stringify({
    note: 'Invented survey for the inversion report (scripts/make-inversion-report-fixture.ts); not real data.',
    grid: coarse.grid,
    surface: SURFACE,
    trueInterfaces: TRUE_MODEL.layers.filter((l) => l.base).map((l) => l.base),
    start: { kind: 'gradient', spacing: 1, v0: +start.v0.toFixed(1), k: +start.k.toFixed(3) },
    settings,
    stopReason: result.stopReason,
    history: result.history.map((h) => ({ iteration: h.iteration, chi2: +h.chi2.toFixed(4), rmsMs: +h.rmsMs.toFixed(4), smoothing: h.smoothing })),
    velocity: nullable(result.velocity, 0),
    coverage: Array.from(result.coverage, (v, i) => (coarse.active[i] ? +v.toFixed(2) : null)),
    doi: nullable(result.doi, 2),
    shots: shots.map((s) => ({ shotId: s.shotId, sourceX: s.source.x, sourceZ: +s.source.z.toFixed(3) })),
    stations: GEOPHONES.map((x, i) => ({ station: 101 + i, x, z: +fine.surfaceZ(x).toFixed(2) })),
    residuals,
    checkerboard: { size: cb.size, amplitude: cb.amplitude, correlation: +cb.correlation.toFixed(4), coverageThreshold: cb.coverageThreshold, truePattern: nullable(cb.truePattern, 4), recovered: nullable(cb.recovered, 4) },
  })}\n`,
);
console.log(`${out}: ${result.history.length - 1} iterations (${result.stopReason}), χ² ${result.history.at(-1)!.chi2.toFixed(3)}, checkerboard r = ${cb.correlation.toFixed(3)}, ${seconds.toFixed(1)} s`);
