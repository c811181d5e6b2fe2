/**
 * Renders docs/img/inversion-section.png and prints the figures quoted in docs/inversion.md:
 * an invented three-layer line with topography and an undulating refractor, first arrivals
 * computed on a 0.25 m grid with 0.5 ms noise, inverted on a 1 m grid from the automatic gradient
 * start (same engine as `npm run invert`); the section shows the inverted velocities, grey where
 * less than 1 m of ray passed, the depth of investigation, and the true interfaces dashed.
 *   npx tsx scripts/render-inversion-figure.ts
 */
import { writePlotlyPng } from './lib/plotly-png';
import { base1, base2, geophones, shotXs, surface, threeLayerSurvey } from './lib/three-layer-line';
import { gradientStart, invert } from '../shared/inversion';
import { evalPolyline } from '../shared/model';
import { DEFAULT_INVERSION_SETTINGS } from '../shared/schemas/inversions';
import { SensitivityPool } from '../worker/threads/sensitivity-pool';

const { shots, coarse } = threeLayerSurvey();
const { grid, active } = coarse;
const settings = { ...DEFAULT_INVERSION_SETTINGS, checkerboard: true };
const start = gradientStart(grid, active, coarse.surfaceZ, shots, settings).velocity;
const problem = { grid, active, start, shots, settings };
const pool = new SensitivityPool();
const t0 = performance.now();
const result = await invert(problem, pool.modeller(problem));
const seconds = (performance.now() - t0) / 1000;
await pool.close();

// Figures for the docs: iso-velocity depths against the true interfaces under the spread.
/** Nodes with less than one cell length of ray are greyed: no ray has really crossed them. */
const COVERED = 1;
const isoDepthAt = (ix: number, v: number): number => {
  const top = coarse.surfaceZ(grid.x0 + ix * grid.dx);
  for (let iz = 1; iz < grid.nz; iz++) {
    const a = result.velocity[(iz - 1) * grid.nx + ix], b = result.velocity[iz * grid.nx + ix];
    if (a < v && b >= v) return top - (grid.z0 - (iz - 1 + (v - a) / (b - a)) * grid.dz);
  }
  return Number.NaN;
};
const stats = (errs: number[]) => {
  const s = errs.filter(Number.isFinite).map(Math.abs).sort((p, q) => p - q);
  return { median: +s[s.length >> 1].toFixed(2), p90: +s[Math.floor(0.9 * (s.length - 1))].toFixed(2), n: s.length };
};
for (const [name, base, v] of [['soil/weathered', base1, 900], ['weathered/rock', base2, 2350]] as const) {
  const errs = geophones.map((x) => isoDepthAt(Math.round((x - grid.x0) / grid.dx), v) - (coarse.surfaceZ(x) - evalPolyline(base, x)));
  console.log(`${name}: iso ${v} m/s depth error (m)`, stats(errs));
}
const last = result.history[result.history.length - 1];
console.log(`iterations ${last.iteration}, chi2 ${last.chi2.toFixed(3)}, RMS ${last.rmsMs.toFixed(3)} ms, ${result.stopReason}, ${seconds.toFixed(1)} s, checkerboard r = ${result.checkerboard?.correlation.toFixed(3)} (${result.checkerboard?.size} m)`);

const xs = Array.from({ length: grid.nx }, (_, i) => grid.x0 + i * grid.dx);
const zs = Array.from({ length: grid.nz }, (_, i) => grid.z0 - i * grid.dz);
const rows = (f: (i: number) => number | null) => zs.map((_, iz) => xs.map((_, ix) => f(iz * grid.nx + ix)));
const vel = rows((i) => (active[i] && result.coverage[i] >= COVERED ? result.velocity[i] : null));
const grey = rows((i) => (active[i] && result.coverage[i] < COVERED ? 1 : null));
const VELOCITY_SCALE = [[0, 'rgb(247,236,206)'], [0.25, 'rgb(226,232,190)'], [0.5, 'rgb(184,217,205)'], [0.75, 'rgb(143,187,214)'], [1, 'rgb(104,142,190)']];
const line = (pts: [number, number][], name: string, dash: string, color: string) => ({ type: 'scatter', mode: 'lines', x: pts.map((p) => p[0]), y: pts.map((p) => p[1]), name, line: { color, width: 2, dash } });
const doi = Array.from(result.doi);
const data = [
  { type: 'heatmap', x: xs, y: zs, z: vel, colorscale: VELOCITY_SCALE, zmin: 400, zmax: 3400, zsmooth: false, colorbar: { title: { text: 'v (m/s)' }, len: 0.9 }, hoverinfo: 'skip' },
  { type: 'heatmap', x: xs, y: zs, z: grey, colorscale: [[0, '#c8c8c8'], [1, '#c8c8c8']], showscale: false, hoverinfo: 'skip' },
  {
    type: 'contour', x: xs, y: zs, z: vel, showscale: false, hoverinfo: 'skip', colorscale: [[0, '#333'], [1, '#333']],
    contours: { coloring: 'lines', start: 500, end: 3000, size: 500, showlabels: true, labelfont: { size: 10, color: '#222' } }, line: { color: '#333', width: 1 },
  },
  line(surface, 'ground surface', 'solid', '#6b4f2a'),
  line(base1, 'true interfaces', 'dash', '#000'),
  { ...line(base2, '', 'dash', '#000'), showlegend: false },
  { type: 'scatter', mode: 'lines', x: xs, y: doi.map((z) => (Number.isFinite(z) ? z : null)), name: 'depth of investigation', line: { color: '#b03424', width: 2, dash: 'dot' } },
  { type: 'scatter', mode: 'markers', x: geophones, y: geophones.map((x) => coarse.surfaceZ(x) + 0.5), name: 'geophones', marker: { symbol: 'triangle-down', size: 7, color: '#2c62a0' } },
  { type: 'scatter', mode: 'markers', x: shotXs, y: shotXs.map((x) => coarse.surfaceZ(x) + 1.2), name: 'shots', marker: { symbol: 'star', size: 11, color: '#e08a2c', line: { color: '#000', width: 1 } } },
];
const layout = {
  width: 1200, height: 520, margin: { l: 60, r: 20, t: 50, b: 60 },
  title: { text: `Inverted section (automatic gradient start, ${last.iteration} iterations, χ² ${last.chi2.toFixed(2)}); grey: less than ${COVERED} m of ray` },
  xaxis: { title: { text: 'x along the line (m)' }, range: [-10, 110] },
  yaxis: { title: { text: 'elevation z (m)' }, range: [zs[zs.length - 1], 105.5], scaleanchor: 'x', scaleratio: 1 },
  legend: { orientation: 'h', y: -0.18 },
  plot_bgcolor: '#ffffff',
};

await writePlotlyPng(new URL('../docs/img/inversion-section.png', import.meta.url), data, layout);
