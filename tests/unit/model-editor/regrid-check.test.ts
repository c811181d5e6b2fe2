import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel, type ModelFile } from '../../../shared/model';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { checkDraft, defaultModel, gridFromSpec, gridIsUsable, paintCells, rectangleCells, regridModel, specFromGrid } from '../../../shared/model/edit';

const base = (): ModelFile => defaultModel({ stations: [{ x: 0, z: 100 }, { x: 60, z: 101 }, { x: 120, z: 99 }] });

describe('changing the grid', () => {
  it('keeps a painted block in place at a finer and at a coarser spacing', () => {
    const m = base();
    const edits = paintCells([], m.grid, rectangleCells(m.grid, { x: 40, z: 96 }, { x: 50, z: 92 }), 300);
    const spec = specFromGrid(m.grid);
    for (const spacing of [spec.spacing / 2, spec.spacing * 2]) {
      const r = regridModel({ ...m, edits }, gridFromSpec({ ...spec, spacing }));
      if (!r.ok) throw new Error(r.message);
      expect(parseModelFile(r.model).ok).toBe(true);
      const g = r.model.grid;
      for (const e of r.model.edits!) {
        const x = g.x0 + e.ix * g.dx;
        const z = g.z0 - e.iz * g.dz;
        expect(x).toBeGreaterThanOrEqual(40 - m.grid.dx);
        expect(x).toBeLessThanOrEqual(50 + m.grid.dx);
        expect(z).toBeGreaterThanOrEqual(92 - m.grid.dz);
        expect(z).toBeLessThanOrEqual(96 + m.grid.dz);
      }
      // the painted area stays about the same size in m² (within one cell row and column)
      const area = r.model.edits!.length * g.dx * g.dz;
      expect(area).toBeGreaterThan(0.6 * 10 * 4);
      expect(area).toBeLessThan(1.6 * 10 * 4);
    }
  });

  it('a raw velocity grid is refused with a sentence', () => {
    const m = base();
    const raw = { format: m.format, grid: m.grid, velocity: Array.from(rasteriseModel(m).velocity) };
    const r = regridModel(raw, { ...m.grid, nx: 10 });
    expect(r.ok).toBe(false);
  });
});

describe('checks before saving', () => {
  it('a negative or non-finite velocity is an error with its path', () => {
    const m = base();
    const neg = checkDraft({ ...m, layers: m.layers!.map((l, k) => (k === 1 ? { ...l, v_top: -300 } : l)) });
    expect(neg.errors.map((e) => e.path)).toContain('layers[1].v_top');
    const nan = checkDraft({ ...m, layers: m.layers!.map((l, k) => (k === 0 ? { ...l, v_base: Number.NaN } : l)) });
    expect(nan.errors.map((e) => e.path)).toContain('layers[0].v_base');
  });

  it('an interface node outside the grid is an error with its path', () => {
    const m = base();
    const layers = m.layers!.map((l, k) => (k === 0 ? { ...l, base: l.base!.map((p, i) => (i === 2 ? ([p[0], m.grid.z0 + 5] as [number, number]) : p)) } : l));
    const c = checkDraft({ ...m, layers });
    expect(c.errors).toContainEqual(expect.objectContaining({ path: 'layers[0].base[2]', message: expect.stringMatching(/above the grid top/) }));
  });

  it('a grid over the limit is refused with its size, and never rasterised', () => {
    const m = base();
    const grid = { ...m.grid, nx: 20_000, nz: 1_000 };
    expect(gridIsUsable(grid)).toBe(false);
    const c = checkDraft({ ...m, grid });
    expect(c.errors[0].message).toContain('20,000,000 nodes');
    expect(c.errors[0].message).toContain(MAX_GRID_NODES.toLocaleString('en-US'));
  });

  it('velocities outside 100–7000 m/s warn but do not block (common practice, no source)', () => {
    const m = base();
    const c = checkDraft({ ...m, layers: m.layers!.map((l, k) => (k === 1 ? { ...l, v_base: 8000 } : l)) });
    expect(c.errors).toEqual([]);
    expect(c.warnings.join(' ')).toMatch(/faster than 7000 m\/s/);
  });
});
