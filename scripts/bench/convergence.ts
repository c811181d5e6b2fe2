/**
 * Convergence table for docs/engine.md: mean relative error against the constant-gradient
 * formula (exact.ts) beyond 4 m from an off-node source, for cell sizes 1, 0.5, 0.25, 0.125 m,
 * with and without the factored source treatment; observed order p = log2(e_h / e_h/2).
 *   npx tsx scripts/bench/convergence.ts
 */
import { TravelTimeSolver } from '../../shared/eikonal';
import { gradientRayMaxDepth, gradientTime } from './exact';

const V0 = 500;
const G = 25;
const WIDTH = 40;
const DEPTH = 12;
const src = { x: 20.13, z: -0.37 };
const spacings = [1, 0.5, 0.25, 0.125];

function meanError(h: number, order: 1 | 2, factored: boolean): number {
  const nx = Math.round(WIDTH / h) + 1;
  const nz = Math.round(DEPTH / h) + 1;
  const grid = { x0: 0, dx: h, nx, z0: 0, dz: h, nz };
  const v = new Float32Array(nx * nz);
  for (let iz = 0; iz < nz; iz++) v.fill(V0 + G * iz * h, iz * nx, (iz + 1) * nx);
  const T = new TravelTimeSolver(grid).solve(v, new Uint8Array(nx * nz).fill(1), src, { order, factored });
  let sum = 0;
  let n = 0;
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0; ix < nx; ix++) {
      const x = ix * h;
      const z = -iz * h;
      if (Math.hypot(x - src.x, z - src.z) < 4 || gradientRayMaxDepth(V0, G, src.x, src.z, x, z) > DEPTH) continue;
      const exact = gradientTime(V0, G, src.x, src.z, x, z);
      sum += Math.abs(T[iz * nx + ix] - exact) / exact;
      n++;
    }
  }
  return sum / n;
}

console.log(`| scheme | ${spacings.map((h) => `h = ${h} m`).join(' | ')} | observed order |`);
console.log(`|---|${spacings.map(() => '---').join('|')}|---|`);
for (const factored of [true, false]) {
  for (const order of [1, 2] as const) {
    const e = spacings.map((h) => meanError(h, order, factored));
    const p = e.slice(1).map((v, k) => Math.log2(e[k] / v).toFixed(2));
    const name = `${factored ? 'factored' : 'plain'}, order ${order}`;
    console.log(`| ${name} | ${e.map((v) => `${(v * 100).toFixed(4)} %`).join(' | ')} | ${p.join(', ')} |`);
  }
}
