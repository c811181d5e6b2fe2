/**
 * A solver reused across models must give exactly what a fresh solver gives: the cells it keeps
 * between solves of one model (shared/eikonal/model-cells.ts) may never leak into another model,
 * another rule or other known cells. Internal consistency, no outside source.
 */
import { describe, expect, it } from 'vitest';
import { TravelTimeSolver, type MarchOptions } from '../../../shared/eikonal';

const grid = { x0: 0, dx: 1, nx: 40, z0: 0, dz: 1, nz: 20 };
const n = grid.nx * grid.nz;
const ncells = (grid.nx - 1) * (grid.nz - 1);
const active = new Uint8Array(n).fill(1);
const source = { x: 3.3, z: -0.4 };

/** Two layers with the interface after row `row`. */
function layered(row: number): Float32Array {
  const v = new Float32Array(n);
  for (let iz = 0; iz < grid.nz; iz++) v.fill(iz <= row ? 600 : 2400, iz * grid.nx, (iz + 1) * grid.nx);
  return v;
}
/** Known cells on the interface row: slowness as if 30 % of the cell were slow. */
function known(row: number, slowFraction: number): Float64Array {
  const k = new Float64Array(ncells).fill(NaN);
  const s1 = 1 / 600;
  const s2 = 1 / 2400;
  k.fill(Math.sqrt(s2 * s2 + slowFraction ** 2 * (s1 * s1 - s2 * s2)), row * (grid.nx - 1), (row + 1) * (grid.nx - 1));
  return k;
}
const fresh = (v: Float32Array, o: MarchOptions) => new TravelTimeSolver(grid).solve(v, active, source, o);

describe('TravelTimeSolver reused across models', () => {
  const A = layered(8);
  const B = layered(12);
  const steps: [string, Float32Array, MarchOptions][] = [
    ['A', A, { order: 2 }],
    ['A with known cells', A, { order: 2, cellSlowness: known(8, 0.3) }],
    ['A with other known cells', A, { order: 2, cellSlowness: known(8, 0.8) }],
    ['A again, none known', A, { order: 2 }],
    ['B', B, { order: 2 }],
    ['B, mean rule', B, { order: 2, rule: 'mean' }],
    ['B, first order', B, { order: 1 }],
    ['A after B', A, { order: 2, cellSlowness: known(8, 0.3) }],
  ];
  const reused = new TravelTimeSolver(grid);
  for (const [name, v, o] of steps) {
    it(`${name}: same times as a fresh solver`, () => {
      expect(Array.from(reused.solve(v, active, source, o))).toEqual(Array.from(fresh(v, o)));
    });
  }

  it('known cells change the times (the check above can fail)', () => {
    const a = fresh(A, { order: 2 });
    const b = fresh(A, { order: 2, cellSlowness: known(8, 0.3) });
    expect(Array.from(a)).not.toEqual(Array.from(b));
  });
});
