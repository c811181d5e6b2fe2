/**
 * What the layered rasteriser's cell slownesses buy: two-layer models (500 over 2000 m/s, 0.5 m
 * cells) built from model files, with the refractor on a node row, between rows, and dipping 5°;
 * solved with node values only (the solver's own rule) and with the cell slownesses. Max / mean
 * relative error against the head-wave formulas (exact.ts) at the surface nodes more than two
 * cells from the source. Prints a markdown table (docs/engine.md).
 *   npx tsx scripts/bench/cell-slowness-study.ts
 */
import { TravelTimeSolver } from '../../shared/eikonal';
import { parseModelFile, rasteriseModel } from '../../shared/model';
import { dippingSurfaceTime, twoLayerSurfaceTime } from './exact';

const V1 = 500;
const V2 = 2000;
const H = 0.5;
const WIDTH = 200;

function study(depthAtX0: number, dipDeg: number): [string, string] {
  const dip = (dipDeg * Math.PI) / 180;
  const nx = WIDTH / H + 1;
  const nz = (dipDeg ? 40 : 30) / H + 1;
  const parsed = parseModelFile({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: H, nx, z0: 0, dz: H, nz },
    layers: [
      { name: 'slow', base: [[0, -depthAtX0], [WIDTH, -depthAtX0 - WIDTH * Math.tan(dip)]], v_top: V1, v_base: V1 },
      { name: 'fast', v_top: V2, v_base: V2 },
    ],
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const m = rasteriseModel(parsed.model);
  const source = { x: dipDeg ? WIDTH / 2 : 0, z: 0 };
  const solver = new TravelTimeSolver(m.grid);
  const run = (cellSlowness?: Float32Array): string => {
    const T = solver.solve(m.velocity, m.active, source, { order: 2, cellSlowness });
    let max = 0;
    let sum = 0;
    let count = 0;
    for (let ix = 0; ix < nx; ix++) {
      const x = ix * H;
      if (Math.abs(x - source.x) <= 2 * H) continue;
      const exact = dipDeg ? dippingSurfaceTime(V1, V2, depthAtX0, dip, source.x, x) : twoLayerSurfaceTime(V1, V2, depthAtX0, x - source.x);
      const e = Math.abs(T[ix] - exact) / exact;
      max = Math.max(max, e);
      sum += e;
      count++;
    }
    return `${(max * 100).toFixed(3)} / ${((sum / count) * 100).toFixed(3)}`;
  };
  return [run(), run(m.cellSlowness)];
}

console.log('| refractor | node values only (rule above) | with cell slownesses |');
console.log('|---|---|---|');
for (const d of [10, 10.1, 10.2, 10.25, 10.4, 10.49, 7.77]) {
  const [plain, cells] = study(d, 0);
  console.log(`| flat at ${d} m${d === 10 ? ' (on a row)' : ''} | ${plain} | ${cells} |`);
}
for (const d of [8, 8.37]) {
  const [plain, cells] = study(d, 5);
  console.log(`| dipping 5°, ${d} m at x = 0 (source mid-line) | ${plain} | ${cells} |`);
}
