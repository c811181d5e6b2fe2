/**
 * Issue 16 item 5: a model file with absurd numbers or unknown keys is refused with the JSON path
 * of the value at fault. Ranges are the trade's plausible values (shared/limits.ts, where each
 * range says why); the absurd values are the ones the issue reports as stored before.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseModelFile } from '../../../shared/model';

const base = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 1, nx: 11, z0: 10, dz: 1, nz: 11 },
  layers: [{ base: [[0, 5], [10, 4]], v_top: 500, v_base: 700 }, { v_top: 2000, v_base: 2500 }],
};
const clone = (): typeof base => JSON.parse(JSON.stringify(base));
const pathsOf = (json: unknown): string[] => {
  const r = parseModelFile(json);
  return r.ok ? [] : r.issues.map((i) => i.path);
};

describe('model file: plausible numbers', () => {
  it('accepts the base model and the demo file (valid FORMATS.md files stay valid)', () => {
    expect(parseModelFile(base).ok).toBe(true);
    const demo = JSON.parse(readFileSync(new URL('../../../fixtures/demo/tq-l1.model.json', import.meta.url), 'utf8'));
    expect(parseModelFile(demo).ok).toBe(true);
  });

  it.each([
    ['v_top 1e308', (m: any) => (m.layers[1].v_top = 1e308), 'layers[1].v_top'],
    ['v_base 1e-300', (m: any) => (m.layers[0].v_base = 1e-300), 'layers[0].v_base'],
    ['v_top 10 001 m/s (just above 10 000)', (m: any) => (m.layers[0].v_top = 10_001), 'layers[0].v_top'],
    ['v_base 49 m/s (just below 50)', (m: any) => (m.layers[1].v_base = 49), 'layers[1].v_base'],
    ['dx 1e308', (m: any) => (m.grid.dx = 1e308), 'grid.dx'],
    ['dz 0.001 m', (m: any) => (m.grid.dz = 0.001), 'grid.dz'],
    ['x0 1e15', (m: any) => (m.grid.x0 = 1e15), 'grid.x0'],
    ['z0 1e308', (m: any) => (m.grid.z0 = 1e308), 'grid.z0'],
    ['base point z 1e308', (m: any) => (m.layers[0].base[1][1] = 1e308), 'layers[0].base[1][1]'],
    ['edit v 1e-300', (m: any) => (m.edits = [{ ix: 1, iz: 1, v: 1e-300 }]), 'edits[0].v'],
  ])('refuses %s at its path', (_name, mutate, path) => {
    const m = clone();
    mutate(m);
    expect(pathsOf(m)).toContain(path);
  });

  it('accepts the edges of each range (50 and 10 000 m/s, 0.01 and 100 m)', () => {
    const m = clone();
    m.layers[0].v_top = 50;
    m.layers[1].v_base = 10_000;
    expect(parseModelFile(m).ok).toBe(true);
    const coarse = { format: 'timefield-model/1', grid: { x0: 0, dx: 100, nx: 3, z0: 0, dz: 0.01, nz: 3 }, layers: [{ v_top: 300, v_base: 300 }] };
    expect(parseModelFile(coarse).ok).toBe(true);
  });

  it('refuses a raw velocity grid value outside 50–10 000 m/s at velocity[i]', () => {
    const velocity = Array.from({ length: 4 }, () => 1500);
    velocity[2] = 1e308;
    const r = parseModelFile({ format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 2, z0: 0, dz: 1, nz: 2 }, velocity });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues).toEqual([{ path: 'velocity[2]', message: 'velocity must be between 50 and 10,000 m/s (got 1e+308)' }]);
  });

  it('refuses a grid whose far corner is outside the coordinate or elevation range', () => {
    // x0 and dx are each plausible; 2 000 000 nodes of 100 m reach x = 2e8 m, beyond ±1e7 m.
    const wide = { format: 'timefield-model/1', grid: { x0: 0, dx: 100, nx: 1_000_000, z0: 0, dz: 1, nz: 2 }, layers: [{ v_top: 300, v_base: 300 }] };
    const r = parseModelFile(wide);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.some((i) => i.path === 'grid' && /right edge/.test(i.message))).toBe(true);
    const deep = { format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 2, z0: 0, dz: 100, nz: 200 }, layers: [{ v_top: 300, v_base: 300 }] };
    const r2 = parseModelFile(deep);
    expect(r2.ok ? [] : r2.issues.map((i) => i.message)).toEqual([
      "the grid's bottom z0 − (nz − 1)·dz must be between -12,000 and 9,000 m (got -19900)",
    ]);
  });
});

describe('model file: unknown keys', () => {
  // FORMATS.md §1: tools may add extra keys; issue 16 item 5: megabytes of junk are not stored.
  it('refuses a top-level key holding a megabyte of junk, with its path', () => {
    const junk = 'x'.repeat(1024 * 1024);
    expect(pathsOf({ ...base, junk })).toEqual(['junk']);
  });

  it('refuses oversized unknown keys inside grid, a layer and an edit', () => {
    const m: any = clone();
    const big = 'y'.repeat(70 * 1024);
    m.grid.extra = big;
    m.layers[1].colour = big;
    m.edits = [{ ix: 1, iz: 1, v: 900, note: [big] }];
    expect(pathsOf(m).sort()).toEqual(['edits[0].note', 'grid.extra', 'layers[1].colour']);
  });

  it('keeps small extras for a round trip', () => {
    const m: any = { ...clone(), notes: 'checked by the field crew' };
    m.layers[1].colour = 'red';
    const r = parseModelFile(m);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect((r.model as Record<string, unknown>).notes).toBe('checked by the field crew');
      expect((r.model.layers![1] as Record<string, unknown>).colour).toBe('red');
    }
  });
});
