/** parseModelFile: good fixtures pass; bad files fail with errors naming the JSON path (FORMATS.md §1). */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';

const fixture = (name: string): unknown => JSON.parse(readFileSync(new URL(`../../../fixtures/models/${name}`, import.meta.url), 'utf8'));
const base = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 1, nx: 11, z0: 10, dz: 1, nz: 11 },
  layers: [{ base: [[0, 5], [10, 4]], v_top: 500, v_base: 700 }, { v_top: 2000, v_base: 2500 }],
};
const issuesOf = (json: unknown) => {
  const r = parseModelFile(json);
  if (r.ok) throw new Error('expected the file to be rejected');
  return r.issues;
};

describe('parseModelFile: good files', () => {
  it.each(['two-layer.model.json', 'three-layer.model.json', 'homogeneous.model.json'])('%s parses and rasterises', (name) => {
    const r = parseModelFile(fixture(name));
    expect(r.ok).toBe(true);
    if (r.ok) expect(rasteriseModel(r.model).velocity.every((v) => Number.isFinite(v) && v > 0)).toBe(true);
  });

  it('keeps the known extras (description, edits) for a round trip', () => {
    const r = parseModelFile({ ...base, description: 'checked by R. Okafor', edits: [{ ix: 1, iz: 2, v: 900 }] });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.model.description).toBe('checked by R. Okafor');
      expect(JSON.parse(JSON.stringify(r.model)).edits).toEqual([{ ix: 1, iz: 2, v: 900 }]);
    }
  });
});

describe('parseModelFile: bad files name the path', () => {
  it('base x not increasing → layers[1].base[3]: x must increase', () => {
    expect(issuesOf(fixture('bad/base-x-not-increasing.model.json'))).toContainEqual({
      path: 'layers[1].base[3]',
      message: 'x must increase (x = 35 follows x = 40)',
    });
  });

  it('surface not covering the grid', () => {
    const issues = issuesOf(fixture('bad/surface-short.model.json'));
    expect(issues).toHaveLength(1);
    expect(issues[0].path).toBe('surface[1]');
    expect(issues[0].message).toMatch(/before the grid's right edge x = 60/);
  });

  it('raw velocity count wrong', () => {
    expect(issuesOf(fixture('bad/velocity-count.model.json'))).toEqual([
      { path: 'velocity', message: 'has 8 values; the grid needs nx × nz = 3 × 3 = 9' },
    ]);
  });

  it('grid larger than MAX_GRID_NODES gives the size', () => {
    const issues = issuesOf(fixture('bad/grid-too-large.model.json'));
    expect(issues).toEqual([{ path: 'grid', message: 'grid has 5,006,001 nodes (nx × nz = 5001 × 1001); the limit is 2,000,000' }]);
  });

  it('non-positive or non-numeric velocities are named by index, and capped', () => {
    const velocity = new Array(121).fill(-1);
    velocity[3] = 'fast';
    const issues = issuesOf({ ...base, layers: undefined, velocity });
    expect(issues[3]).toEqual({ path: 'velocity[3]', message: '"fast" is not a velocity > 0 (m/s)' });
    expect(issues.length).toBeLessThanOrEqual(21);
  });

  it.each([
    ['format', 'format must be "timefield-model/1"', { ...base, format: 'other/2' }],
    ['grid.dx', 'dx must be > 0', { ...base, grid: { ...base.grid, dx: 0 } }],
    ['grid.nz', 'nz must be a whole number', { ...base, grid: { ...base.grid, nz: 2.5 } }],
    ['grid', 'grid is required', { ...base, grid: undefined }],
    ['layers[0].v_top', 'v_top must be > 0', { ...base, layers: [{ ...base.layers[0], v_top: -300 }, base.layers[1]] }],
    ['layers[0].base', 'needs at least two points', { ...base, layers: [{ ...base.layers[0], base: [[0, 5]] }, base.layers[1]] }],
    ['layers[0].base[1][1]', 'z must be a finite number', { ...base, layers: [{ ...base.layers[0], base: [[0, 5], [10, 'deep']] }, base.layers[1]] }],
    ['layers[0].base', 'required: every layer except the last needs a base', { ...base, layers: [{ v_top: 1, v_base: 1 }, base.layers[1]] }],
    ['layers[0].base', 'the last layer reaches the grid bottom and takes no base', { ...base, layers: [base.layers[0]] }],
    ['(root)', 'give either "velocity" or "layers", not both', { ...base, velocity: new Array(121).fill(1000) }],
    ['(root)', 'a model needs either "velocity" (a raw grid) or "layers"', { ...base, layers: undefined }],
    ['surface[0]', 'z = 12 is above the grid top (z0 = 10)', { ...base, surface: [[0, 12], [10, 9]] }],
    ['edits[0].ix', 'ix = 11 is outside the grid (nx = 11)', { ...base, edits: [{ ix: 11, iz: 0, v: 100 }] }],
    ['(root)', 'a model file must be a JSON object', [1, 2, 3]],
  ] as [string, string, unknown][])('%s: %s', (path, message, json) => {
    expect(issuesOf(json)).toContainEqual({ path, message });
  });
});
