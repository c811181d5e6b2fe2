import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { rasteriseModel, type ModelFile } from '../../../shared/model';
import { brushCells, brushStrokeCells, eraseCells, paintCells, rectangleCells, updateLayer } from '../../../shared/model/edit';

const grid: Grid = { x0: 0, dx: 1, nx: 21, z0: 10, dz: 1, nz: 11 };

describe('brush and rectangle cells', () => {
  it('a brush centred on a node covers the lattice points of the disc', () => {
    // Lattice points with x² + y² ≤ n²: 1, 5, 13, 29, 49 for n = 0..4 (Gauss's circle problem;
    // OEIS A000328, "Number of points of norm <= n^2 in square lattice").
    const expected = [1, 5, 13, 29, 49];
    expected.forEach((count, r) => expect(brushCells(grid, { x: 10, z: 5 }, r)).toHaveLength(count));
  });

  it('a brush smaller than a cell paints the nearest node; off the grid paints nothing', () => {
    expect(brushCells(grid, { x: 3.4, z: 7.6 }, 0.1)).toEqual([2 * 21 + 3]); // iz = round(10 − 7.6) = 2
    expect(brushCells(grid, { x: -5, z: 5 }, 1)).toEqual([]);
  });

  it('a brush is clipped at the grid edge', () => {
    // Centre on the corner node (0, 0): only the quarter disc inside the grid, r = 2 → 6 nodes (hand count: (0,0),(1,0),(2,0),(0,1),(1,1),(0,2)).
    expect(brushCells(grid, { x: 0, z: 10 }, 2)).toHaveLength(6);
  });

  it('a fast stroke leaves no gaps between pointer positions', () => {
    const cells = new Set(brushStrokeCells(grid, { x: 2, z: 5 }, { x: 18, z: 5 }, 0));
    for (let ix = 2; ix <= 18; ix++) expect(cells.has(5 * 21 + ix)).toBe(true);
  });

  it('a rectangle covers every node inside it, corners in any order', () => {
    const cells = rectangleCells(grid, { x: 6.5, z: 2.2 }, { x: 3.1, z: 4.9 });
    // x 4..6 (3 columns), z 3..4 (2 rows) → iz 6..7
    expect(cells.sort((a, b) => a - b)).toEqual([6 * 21 + 4, 6 * 21 + 5, 6 * 21 + 6, 7 * 21 + 4, 7 * 21 + 5, 7 * 21 + 6]);
  });
});

describe('cells to edits', () => {
  const model: ModelFile = {
    format: 'timefield-model/1',
    grid: { ...grid } as ModelFile['grid'],
    surface: [[0, 8], [20, 8]],
    layers: [
      { name: 'soil', base: [[0, 5], [20, 5]], v_top: 400, v_base: 400 },
      { name: 'rock', v_top: 3000, v_base: 3000 },
    ],
  };

  it('painting replaces earlier paint on the same nodes and skips air', () => {
    const raster = rasteriseModel(model);
    let edits = paintCells([], grid, rectangleCells(grid, { x: 4, z: 9 }, { x: 6, z: 7 }), 250, raster.active);
    // rows z = 9 and 10 are air (surface at 8): only z = 8 and 7 remain → 2 rows × 3 columns
    expect(edits).toHaveLength(6);
    edits = paintCells(edits, grid, brushCells(grid, { x: 5, z: 7 }, 0), 4500, raster.active);
    expect(edits).toHaveLength(6);
    expect(edits.filter((e) => e.ix === 5 && e.iz === 3)).toEqual([{ ix: 5, iz: 3, v: 4500 }]);
  });

  it('painted cells survive a change to the layers underneath', () => {
    const edits = paintCells([], grid, rectangleCells(grid, { x: 10, z: 4 }, { x: 12, z: 2 }), 300);
    const changed = { ...model, edits, layers: updateLayer(model.layers!, 1, { v_top: 3500, v_base: 3500 }) };
    const r = rasteriseModel(changed);
    expect(r.velocity[8 * 21 + 15]).toBe(3500); // an unpainted rock node (z = 2 m) follows the layer
    for (const e of edits) expect(r.velocity[e.iz * 21 + e.ix]).toBe(300); // the pocket stays
  });

  it('erasing restores the layered value', () => {
    const edits = paintCells([], grid, [3 * 21 + 2, 3 * 21 + 3], 999);
    const erased = eraseCells(edits, grid, [3 * 21 + 2]);
    expect(erased).toEqual([{ ix: 3, iz: 3, v: 999 }]);
    expect(eraseCells(erased, grid, [0])).toBe(erased); // nothing there: same list back
  });
});
