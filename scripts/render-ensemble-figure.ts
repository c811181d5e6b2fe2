/**
 * Renders docs/img/ensemble-band.png and prints the figures quoted in docs/uncertainty.md: the
 * invented three-layer line of docs/inversion.md (first arrivals computed on a 0.25 m grid, 0.5 ms
 * noise), inverted on a 1 m grid, then an ensemble of its members (the worker's member problem and
 * combine, run here in one process on every core). Panels: mean velocity with the 5–95 % depth band
 * of v* over the true weathered/rock interface; the spread between members.
 *   npx tsx scripts/render-ensemble-figure.ts [--members 24] [--rock 1800] [--rock-max 3000]
 */
import { parseArgs } from 'node:util';
import { writePlotlyPng } from './lib/plotly-png';
import { base2, geophones, surface, threeLayerSurvey } from './lib/three-layer-line';
import { fitGradient, gradientStart, invert } from '../shared/inversion';
import { evalPolyline } from '../shared/model';
import { DEFAULT_INVERSION_SETTINGS } from '../shared/schemas/inversions';
import { bandOutlines } from '../shared/uncertainty/band-outline';
import { combineMembers, memberChi2Limit, quantile } from '../shared/uncertainty/combine';
import { memberProblem } from '../shared/uncertainty/member';
import { chi2AgainstOriginal } from '../shared/uncertainty/perturb';
import { memberRockVelocity, planMembers } from '../shared/uncertainty/plan';
import { SensitivityPool } from '../worker/threads/sensitivity-pool';

const { values } = parseArgs({ options: { members: { type: 'string', default: '24' }, rock: { type: 'string', default: '1800' }, 'rock-max': { type: 'string' } } });
const MEMBERS = Number(values.members);
const ROCK = { min: Number(values.rock), max: Number(values['rock-max'] ?? values.rock) };

const { shots, coarse } = threeLayerSurvey();
const { grid, active } = coarse;
const settings = DEFAULT_INVERSION_SETTINGS;
const start = gradientStart(grid, active, coarse.surfaceZ, shots, settings).velocity;
const problem = { grid, active, start, shots, settings, surface: coarse.surface };
const pool = new SensitivityPool();
let t0 = performance.now();
const base = await invert(problem, pool.modeller(problem));
const baseSeconds = (performance.now() - t0) / 1000;
const baseChi2 = base.history.at(-1)!.chi2;
const fit = fitGradient(shots);

t0 = performance.now();
const members = [];
for (const plan of planMembers(MEMBERS, 2026, { start: true, smoothing: true, picks: 'sigma' })) {
  const p = memberProblem({ problem, surfaceZ: coarse.surfaceZ, fit }, plan);
  const r = await invert(p, pool.modeller(p));
  members.push({ velocity: r.velocity, coverage: r.coverage, doi: r.doi, chi2: chi2AgainstOriginal(shots, p.shots, r.computed), rockVelocity: memberRockVelocity(plan.seed, ROCK.min, ROCK.max) });
}
const memberSeconds = (performance.now() - t0) / 1000;
await pool.close();
const maxChi2 = memberChi2Limit(baseChi2);
const summary = combineMembers(members, grid, surface, { threshold: 1, rockVelocity: ROCK.min, stationXs: geophones, maxChi2 });

// The truth: the weathered/rock interface below the ground at each geophone.
const trueDepth = (x: number) => evalPolyline(surface, x) - evalPolyline(base2, x);
const banded = summary.bands.filter((b) => b.p5 !== null);
const inside = banded.filter((b) => b.p5! <= trueDepth(b.x) && trueDepth(b.x) <= b.p95!).length;
const widths = banded.map((b) => b.p95! - b.p5!).sort((a, b) => a - b);
const bias = banded.map((b) => b.median! - trueDepth(b.x)).sort((a, b) => a - b);
console.log(`base: ${base.history.at(-1)!.iteration} iterations, chi2 ${baseChi2.toFixed(3)}, ${baseSeconds.toFixed(1)} s`);
console.log(`members: ${MEMBERS} in ${memberSeconds.toFixed(1)} s (${(memberSeconds / baseSeconds).toFixed(1)}x the base), used ${summary.used}, left out ${summary.excluded} (chi2 > ${maxChi2.toFixed(2)})`);
console.log(`v* ${ROCK.min}${ROCK.max > ROCK.min ? `-${ROCK.max}` : ''} m/s: banded at ${banded.length} of ${geophones.length} geophones; true interface inside the 5-95 % band at ${inside} (${((100 * inside) / Math.max(1, banded.length)).toFixed(0)} %); median width ${widths.length ? quantile(widths, 0.5).toFixed(2) : '-'} m; median (median − truth) ${bias.length ? quantile(bias, 0.5).toFixed(2) : '-'} m`);

const xs = Array.from({ length: grid.nx }, (_, i) => grid.x0 + i * grid.dx);
const zs = Array.from({ length: grid.nz }, (_, i) => grid.z0 - i * grid.dz);
const rows = (a: Float32Array) => zs.map((_, iz) => xs.map((_, ix) => (Number.isFinite(a[iz * grid.nx + ix]) ? a[iz * grid.nx + ix] : null)));
const VELOCITY_SCALE = [[0, '#f6e7c8'], [0.3, '#dfe8c9'], [0.6, '#b5d6d6'], [1, '#7fa9c9']];
const elevation = (pick: (b: (typeof summary.bands)[number]) => number | null) => summary.bands.map((b) => (pick(b) === null ? null : evalPolyline(surface, b.x) - pick(b)!));
const line = (pts: [number, number][], name: string, dash: string, color: string, axis: string, show = true) => ({ type: 'scatter', mode: 'lines', x: pts.map((p) => p[0]), y: pts.map((p) => p[1]), name, showlegend: show, xaxis: `x${axis}`, yaxis: `y${axis}`, line: { color, width: 2, dash } });
const data = [
  { type: 'heatmap', x: xs, y: zs, z: rows(summary.mean), colorscale: VELOCITY_SCALE, zmin: 400, zmax: 3400, colorbar: { title: { text: 'mean v (m/s)' }, len: 0.45, y: 0.78 }, hoverinfo: 'skip', xaxis: 'x', yaxis: 'y' },
  line(surface, 'ground surface', 'solid', '#6b4f2a', ''),
  line(base2, 'true weathered/rock interface', 'dash', '#000', ''),
  ...bandOutlines(summary.bands, (x) => evalPolyline(surface, x)).map((o, k) => ({
    type: 'scatter', mode: 'lines', x: o.x, y: o.z, name: `5–95 % band of the ${ROCK.min}${ROCK.max > ROCK.min ? `–${ROCK.max}` : ''} m/s depth`, showlegend: k === 0,
    fill: 'toself', fillcolor: 'rgba(194,65,12,0.3)', line: { color: '#9a3412', width: 1 }, xaxis: 'x', yaxis: 'y',
  })),
  { type: 'scatter', mode: 'lines', x: geophones, y: elevation((b) => b.median), name: 'median depth', line: { color: '#9a3412', width: 2, dash: 'dot' }, xaxis: 'x', yaxis: 'y' },
  { type: 'heatmap', x: xs, y: zs, z: rows(summary.std), colorscale: [[0, '#f5f5f4'], [0.5, '#a5b4c4'], [1, '#334155']], zmin: 0, colorbar: { title: { text: 'spread (m/s)' }, len: 0.45, y: 0.22 }, hoverinfo: 'skip', xaxis: 'x2', yaxis: 'y2' },
  line(surface, '', 'solid', '#6b4f2a', '2', false),
  line(base2, '', 'dash', '#000', '2', false),
];
const axis = { title: { text: 'elevation (m)' }, range: [zs[zs.length - 1], 105.5] };
const layout = {
  width: 1200, height: 880, margin: { l: 60, r: 20, t: 60, b: 60 },
  title: { text: `${MEMBERS} inversions, ${summary.used} used: mean velocity and depth band (top), spread (bottom)` },
  xaxis: { title: { text: 'x along the line (m)' }, range: [-10, 110], anchor: 'y', zeroline: false },
  yaxis: { ...axis, domain: [0.56, 1], scaleanchor: 'x', scaleratio: 1 },
  xaxis2: { title: { text: 'x along the line (m)' }, range: [-10, 110], anchor: 'y2', zeroline: false },
  yaxis2: { ...axis, domain: [0, 0.44], scaleanchor: 'x2', scaleratio: 1 },
  legend: { orientation: 'h', y: 0.5 },
  plot_bgcolor: '#e7e5e4',
};
await writePlotlyPng(new URL('../docs/img/ensemble-band.png', import.meta.url), data, layout);
