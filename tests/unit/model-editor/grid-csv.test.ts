import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel, type ModelFile } from '../../../shared/model';
import { float32Text, formatGridCsv, paintCells, parseGridCsv, rectangleCells } from '../../../shared/model/edit';

function demoModel(): ModelFile {
  const parsed = parseModelFile(JSON.parse(readFileSync('fixtures/demo/tq-l1.model.json', 'utf8')));
  if (!parsed.ok) throw new Error('demo model does not parse');
  return parsed.model;
}

describe('CSV grid export and import', () => {
  it('round trip: the imported grid rasterises to exactly the same velocities and ground mask', () => {
    const model = demoModel();
    const before = rasteriseModel(model);
    // a painted pocket too, with a velocity that is not a round Float32 number
    const edits = paintCells([], model.grid, rectangleCells(model.grid, { x: 40, z: 97 }, { x: 46, z: 94 }), 287.3, before.active);
    const painted = rasteriseModel({ ...model, edits });
    const text = formatGridCsv(painted.grid, painted.velocity, painted.active);
    const back = parseGridCsv(text);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    const after = rasteriseModel(back.model);
    expect(after.grid.nx).toBe(model.grid.nx);
    expect(after.grid.nz).toBe(model.grid.nz);
    expect(after.grid.x0).toBeCloseTo(model.grid.x0, 9);
    expect(after.grid.dx).toBeCloseTo(model.grid.dx, 12);
    expect(after.grid.z0).toBeCloseTo(model.grid.z0, 9);
    expect(Buffer.from(after.active.buffer).equals(Buffer.from(painted.active.buffer))).toBe(true);
    expect(Buffer.from(after.velocity.buffer).equals(Buffer.from(painted.velocity.buffer))).toBe(true);
  });

  it('writes one row per node, air with an empty v', () => {
    const model: ModelFile = { format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 3, z0: 2, dz: 1, nz: 3 }, surface: [[0, 1], [2, 1]], layers: [{ v_top: 500, v_base: 500 }] };
    const r = rasteriseModel(model);
    expect(formatGridCsv(r.grid, r.velocity, r.active)).toBe('x,z,v\n0,2,\n1,2,\n2,2,\n0,1,500\n1,1,500\n2,1,500\n0,0,500\n1,0,500\n2,0,500\n');
  });

  it('Float32 values are written with the fewest digits that read back the same', () => {
    for (const v of [350, 1234.5, 287.3, 1 / 3, 4199.999]) {
      const f = Math.fround(v);
      const s = float32Text(f);
      expect(Math.fround(Number(s))).toBe(f);
      expect(s.replace(/[-.]/g, '').length).toBeLessThanOrEqual(9);
    }
    expect(float32Text(Math.fround(287.3))).toBe('287.3');
  });

  it('bad files get line and column', () => {
    const bad = (text: string) => {
      const r = parseGridCsv(text);
      if (r.ok) throw new Error('expected errors');
      return r.errors;
    };
    expect(bad('x,z,v\n0,1,500\n1,1,abc\n')[0]).toMatchObject({ line: 3, column: 'v' });
    expect(bad('x,z,v\n0,1,-20\n')[0]).toMatchObject({ line: 2, column: 'v' });
    expect(bad('x,z\n0,1\n')[0].message).toMatch(/x, z and v/);
    expect(bad('x,z,v\n0,1,500\n1,1,500\n0,0,500\n')[0].message).toMatch(/no row for the node at x 1 m, z 0 m/);
    expect(bad('x,z,v\n0,1,500\n1,1,500\n3,1,500\n0,0,500\n1,0,500\n3,0,500\n')[0]).toMatchObject({ column: 'x' });
    expect(bad('x,z,v\n0,1,500\n1,1,500\n0,0,\n1,0,500\n')[0].message).toMatch(/air below ground/);
    expect(bad('x,z,v\n0,1,500\n0,1,400\n1,1,1\n0,0,1\n1,0,1\n')[0].message).toMatch(/already on line 2/);
  });
});
