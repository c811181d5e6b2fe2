/**
 * What the layered rasteriser's cell slownesses buy: two-layer models (500 over 2000 m/s, 0.5 m
 * cells) built from model files, with the refractor on a node row, between rows, and dipping 5°;
 * solved with node values only (the solver's own rule) and with the cell slownesses. Max / mean
 * relative error against the head-wave formulas (exact.ts) at the surface nodes more than two
 * cells from the source. Prints a markdown table (docs/engine.md).
 *   npx tsx scripts/bench/cell-slowness-study.ts
 */
import { TravelTimeSolver } from '../../shared/eikonal';
import { twoLayerModelCase } from './cases';
import { errors } from './measure';

function study(depthAtX0: number, dipDeg: number): [string, string] {
  const c = twoLayerModelCase(depthAtX0, dipDeg);
  const solver = new TravelTimeSolver(c.grid);
  const run = (cellSlowness?: Float32Array): string => {
    const e = errors(c, solver.solve(c.velocity, c.active, c.source, { order: 2, cellSlowness }));
    return `${(e.max * 100).toFixed(3)} / ${(e.mean * 100).toFixed(3)}`;
  };
  return [run(), run(c.cellSlowness)];
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
