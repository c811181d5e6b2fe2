/** Bad input must fail fast with EikonalInputError and a readable message — never a hang or a NaN (house rules). */
import { describe, expect, it } from 'vitest';
import { EikonalInputError, sampleTime, solveTravelTimes, traceRay, validateSolveInput } from '../../../shared/eikonal';
import { MAX_GRID_NODES } from '../../../shared/limits';

const grid = { x0: 0, dx: 1, nx: 6, z0: 0, dz: 1, nz: 4 };
const n = grid.nx * grid.nz;
const ground = () => new Uint8Array(n).fill(1);
const uniform = () => new Float64Array(n).fill(1000);

function expectInputError(fn: () => unknown, pattern: RegExp): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught).toBeInstanceOf(EikonalInputError);
  expect((caught as Error).message).toMatch(pattern);
}

describe('validateSolveInput', () => {
  it('accepts a good model', () => {
    expect(() => validateSolveInput(grid, uniform(), ground(), { x: 2.5, z: -1 })).not.toThrow();
  });
  it.each([
    [0, /velocity at node \(ix 2, iz 1.*is 0 m\/s/],
    [-300, /is -300 m\/s/],
    [NaN, /is NaN m\/s/],
    [Infinity, /is Infinity m\/s/],
  ])('rejects a velocity of %s with the node named', (bad, pattern) => {
    const v = uniform();
    v[1 * grid.nx + 2] = bad;
    expectInputError(() => solveTravelTimes(grid, v, ground(), { x: 0, z: 0 }), pattern);
  });
  it('ignores velocities at air nodes (they carry no waves)', () => {
    const v = uniform();
    const a = ground();
    v[0] = 0;
    a[0] = 0;
    const T = solveTravelTimes(grid, v, a, { x: 3, z: -2 });
    expect(T[0]).toBe(Infinity);
    expect(T.every((t, i) => i === 0 || Number.isFinite(t))).toBe(true);
  });
  it('rejects a grid over the node limit before touching the arrays', () => {
    const huge = { x0: 0, dx: 1, nx: 20_000, z0: 0, dz: 1, nz: Math.ceil(MAX_GRID_NODES / 20_000) + 1 };
    expectInputError(() => validateSolveInput(huge, new Float32Array(4), new Uint8Array(4), { x: 0, z: 0 }), /limit is 2,000,000/);
  });
  it('rejects arrays of the wrong length', () => {
    expectInputError(() => validateSolveInput(grid, new Float64Array(n - 1).fill(1000), ground(), { x: 0, z: 0 }), /velocity has 23 values; the grid needs nx × nz = 24/);
    expectInputError(() => validateSolveInput(grid, uniform(), new Uint8Array(n + 2), { x: 0, z: 0 }), /ground mask has 26 values/);
  });
  it('rejects a broken grid', () => {
    expectInputError(() => validateSolveInput({ ...grid, dx: 0 }, uniform(), ground(), { x: 0, z: 0 }), /spacing must be positive/);
    expectInputError(() => validateSolveInput({ ...grid, nx: 2.5 }, uniform(), ground(), { x: 0, z: 0 }), /whole counts/);
    expectInputError(() => validateSolveInput({ ...grid, x0: NaN }, uniform(), ground(), { x: 0, z: 0 }), /finite/);
  });
  it('rejects a source outside the grid', () => {
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: 5.5, z: 0 }), /outside the model grid \(x 0 to 5 m, z -3 to 0 m\)/);
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: 1, z: 0.2 }), /outside the model grid/);
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: NaN, z: 0 }), /finite/);
  });
  it('rejects a source in the air, accepts one on the ground surface', () => {
    const a = ground();
    for (let ix = 0; ix < grid.nx; ix++) a[ix] = 0; // top row is air
    a[grid.nx + 0] = 0;
    a[grid.nx + 1] = 0; // and two nodes of row 1 at the left
    expectInputError(() => solveTravelTimes(grid, uniform(), a, { x: 0.5, z: -0.5 }), /in the air/);
    expect(() => solveTravelTimes(grid, uniform(), a, { x: 3.2, z: -1 })).not.toThrow();
    expect(() => solveTravelTimes(grid, uniform(), a, { x: 3.2, z: -0.4 })).not.toThrow(); // cell has ground corners
  });
  it('rejects a model with no ground at all', () => {
    expectInputError(() => solveTravelTimes(grid, uniform(), new Uint8Array(n), { x: 1, z: -1 }), /no ground nodes/);
  });
  it('sampleTime and traceRay reject points outside the grid', () => {
    const T = solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 });
    expectInputError(() => sampleTime(grid, T, ground(), { x: -1, z: 0 }), /outside the model grid/);
    expectInputError(() => traceRay(grid, T, uniform(), ground(), { x: 9, z: 0 }, { x: 1, z: -1 }), /outside the model grid/);
  });
});

describe('other entry points', () => {
  it('a solver for an oversized grid is refused before any allocation', async () => {
    const { TravelTimeSolver } = await import('../../../shared/eikonal');
    expectInputError(() => new TravelTimeSolver({ x0: 0, dx: 1, nx: 100_000, z0: 0, dz: 1, nz: 100_000 }), /limit is 2,000,000/);
  });
  it('sampleTime and traceRay refuse arrays of the wrong length', () => {
    const T = solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 });
    expectInputError(() => sampleTime(grid, T.subarray(1), ground(), { x: 1, z: 0 }), /travel times \(23\)/);
    expectInputError(() => traceRay(grid, T, uniform().subarray(2), ground(), { x: 4, z: 0 }, { x: 1, z: -1 }), /velocity \(22\)/);
  });
});

describe('cell slownesses given to the solver', () => {
  const cells = (values: number[]) => Float64Array.from(values);
  const count = (grid.nx - 1) * (grid.nz - 1);

  it('rejects the wrong number of cells', () => {
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 }, { cellSlowness: cells([NaN]) }), /cell slowness has 1 values.*15 cells/);
  });
  it('rejects a value that is not positive and finite, names the cell', () => {
    const bad = new Float64Array(count).fill(NaN);
    bad[7] = -0.001;
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 }, { cellSlowness: bad }), /cell slowness 7 is -0.001/);
    bad[7] = Infinity;
    expectInputError(() => solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 }, { cellSlowness: bad }), /cell slowness 7 is Infinity/);
  });
  it('all NaN (nothing known) changes nothing', () => {
    const plain = solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 });
    const withUnknown = solveTravelTimes(grid, uniform(), ground(), { x: 1, z: -1 }, { cellSlowness: new Float64Array(count).fill(NaN) });
    expect(Array.from(withUnknown)).toEqual(Array.from(plain));
  });
});
