/**
 * Renders docs/img/engine-field.png: a layered model with topography (rasterised by the product's
 * own model code), the travel-time field of one surface shot as wavefront contours, and rays
 * traced back from surface geophones. Plotly in headless Chromium.
 *   npx tsx scripts/render-engine-figure.ts
 */
import { writePlotlyPng } from './lib/plotly-png';
import { rasteriseModel, type ModelFile } from '../shared/model';
import { sampleTime, solveTravelTimes, traceRay } from '../shared/eikonal';

// Invented demo line: 120 m, 0.5 m cells; soil over weathered rock over bedrock, gentle hill.
const model = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 0.5, nx: 241, z0: 12, dz: 0.5, nz: 61 },
  surface: [[0, 9], [35, 11.5], [60, 10.5], [90, 8.5], [120, 9]],
  layers: [
    { name: 'topsoil', base: [[0, 6], [50, 7.5], [120, 4.5]], v_top: 350, v_base: 600 },
    { name: 'weathered rock', base: [[0, 0.5], [45, -2], [80, -5], [120, -6]], v_top: 1200, v_base: 1700 },
    { name: 'bedrock', v_top: 3500, v_base: 4000 },
  ],
} as unknown as ModelFile;

const raster = rasteriseModel(model);
const { grid, velocity, active } = raster;
const source = { x: 20, z: raster.surfaceZ(20) };
const times = solveTravelTimes(grid, velocity, active, source, { order: 2, cellSlowness: raster.cellSlowness });

const xs = Array.from({ length: grid.nx }, (_, i) => grid.x0 + i * grid.dx);
const zs = Array.from({ length: grid.nz }, (_, i) => grid.z0 - i * grid.dz);
const rows = (f: (i: number) => number | null) => zs.map((_, iz) => xs.map((_, ix) => f(iz * grid.nx + ix)));
const vel = rows((i) => (active[i] ? velocity[i] : null));
const tms = rows((i) => (Number.isFinite(times[i]) ? times[i] * 1000 : null));

const receivers = [2, 8, 32, 45, 60, 75, 90, 105, 118].map((x) => ({ x, z: raster.surfaceZ(x) }));
const rays = receivers.map((r) => traceRay(grid, times, velocity, active, r, source));
const picks = receivers.map((r) => sampleTime(grid, times, active, r) * 1000);

const surfaceX = xs;
const surfaceZ = xs.map((x) => raster.surfaceZ(x));
const data = [
  { type: 'heatmap', x: xs, y: zs, z: vel, colorscale: 'YlGnBu', reversescale: true, zsmooth: false, colorbar: { title: { text: 'v (m/s)' }, len: 0.9 }, hoverinfo: 'skip' },
  {
    type: 'contour', x: xs, y: zs, z: tms, showscale: false, hoverinfo: 'skip', colorscale: [[0, '#222'], [1, '#222']],
    contours: { coloring: 'lines', start: 2, end: 60, size: 2, showlabels: true, labelfont: { size: 10, color: '#222' } },
    line: { color: '#333', width: 1 },
  },
  { type: 'scatter', mode: 'lines', x: surfaceX, y: surfaceZ, line: { color: '#6b4f2a', width: 2 }, name: 'ground surface' },
  ...rays.map((ray, k) => ({
    type: 'scatter', mode: 'lines', showlegend: k === 0, name: 'rays',
    x: Array.from(ray.points.filter((_, i) => i % 2 === 0)),
    y: Array.from(ray.points.filter((_, i) => i % 2 === 1)),
    line: { color: '#d62728', width: 2 },
  })),
  { type: 'scatter', mode: 'markers', x: [source.x], y: [source.z + 0.4], marker: { symbol: 'star', size: 16, color: '#ff7f0e', line: { color: '#000', width: 1 } }, name: 'shot' },
  {
    type: 'scatter', mode: 'markers+text', x: receivers.map((r) => r.x), y: receivers.map((r) => r.z + 0.4),
    text: picks.map((t) => `${t.toFixed(1)}`), textposition: 'top center', textfont: { size: 10 },
    marker: { symbol: 'triangle-down', size: 10, color: '#2ca02c', line: { color: '#000', width: 1 } }, name: 'geophones (time, ms)',
  },
];
const layout = {
  width: 1200, height: 520, margin: { l: 60, r: 20, t: 50, b: 50 },
  title: { text: 'Wavefronts every 2 ms and rays from a surface shot, three-layer model with topography (second-order fast marching)' },
  xaxis: { title: { text: 'x along the line (m)' }, range: [0, 120] },
  yaxis: { title: { text: 'elevation z (m)' }, range: [zs[zs.length - 1], 14.5], scaleanchor: 'x', scaleratio: 1 },
  legend: { orientation: 'h', y: -0.15 },
  plot_bgcolor: '#f4f4f4',
};

writePlotlyPng(new URL('../docs/img/engine-field.png', import.meta.url), data, layout).catch((e) => {
  console.error(e);
  process.exit(1);
});
