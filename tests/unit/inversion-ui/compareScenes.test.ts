import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { padScene, sharedRange, unionExtent } from '../../../src/components/inversion/compareScenes';
import type { InversionSectionScene } from '../../../src/components/inversion/InversionSectionCanvas';

// The comparison's requirement (issue 11: "side by side, same colour scale"): one colour range over
// both sides, and both sections over the same stretch of line and depth. Values worked out by hand.

const scene = (grid: Grid, values: number[]): InversionSectionScene => ({
  grid,
  velocity: Float32Array.from(values),
  range: { min: 0, max: 1 },
  mask: Uint8Array.from(values.map((v) => (v > 2 ? 1 : 0))),
  coverage: Float32Array.from(values.map(() => 5)),
  contours: null,
  doi: [],
  surface: null,
  stations: [],
  shots: [],
});

describe('sharedRange', () => {
  it('takes the lowest and highest of the two ranges', () => {
    expect(sharedRange({ min: 380, max: 2900 }, { min: 450, max: 4100 })).toEqual({ min: 380, max: 4100 });
    expect(sharedRange(null, { min: 1, max: 2 })).toBeNull();
  });
});

describe('unionExtent and padScene', () => {
  const a: Grid = { x0: 0, dx: 1, nx: 3, z0: 10, dz: 1, nz: 2 }; // x 0…2, z 10…9
  const b: Grid = { x0: -2, dx: 2, nx: 4, z0: 12, dz: 2, nz: 3 }; // x −2…4, z 12…8

  it('spans both grids', () => {
    expect(unionExtent(a, b)).toEqual({ xMin: -2, xMax: 4, zMin: 8, zMax: 12 });
  });

  it('widens a grid with empty nodes on its own spacing, keeping every value where it was', () => {
    const padded = padScene(scene(a, [1, 2, 3, 4, 5, 6]), unionExtent(a, b));
    // 2 cells left, 2 right, 2 rows above, 1 below: x −2…4 (7 nodes), z 12…8 (5 rows)
    expect(padded.grid).toEqual({ x0: -2, dx: 1, nx: 7, z0: 12, dz: 1, nz: 5 });
    const at = (x: number, z: number) => padded.velocity[(12 - z) * 7 + (x + 2)];
    expect([at(0, 10), at(1, 10), at(2, 10), at(0, 9), at(1, 9), at(2, 9)]).toEqual([1, 2, 3, 4, 5, 6]);
    expect(Number.isNaN(at(-2, 12)!)).toBe(true);
    expect(Number.isNaN(at(4, 8)!)).toBe(true);
    const valid = Array.from(padded.velocity).filter(Number.isFinite);
    expect(valid).toHaveLength(6);
    // the mask moves with its values; new nodes are not masked (they are empty, not poorly covered)
    expect(padded.mask![(12 - 10) * 7 + 4]).toBe(1); // value 3 at x 2, z 10
    expect(Array.from(padded.mask!).reduce((s, m) => s + m, 0)).toBe(4);
  });

  it('leaves a grid that already spans the extent alone', () => {
    const s = scene(b, Array.from({ length: 12 }, (_, i) => i));
    expect(padScene(s, unionExtent(a, b))).toBe(s);
  });
});
