/**
 * Cell slownesses of the layered rasteriser (shared/model/cell-slowness.ts). The rule
 * s² = s_f² + f²·(s_s² − s_f²) is ours (derived there from the head wave's slowness components);
 * these checks pin the rule and which cells get a value. Its effect on travel times is checked
 * against the textbook head-wave formula in tests/references/model/layered-traveltimes.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { headWaveSlowness, SAMPLES_X, SAMPLES_Z } from '../../../shared/model/cell-slowness';
import { parseModelFile, rasteriseModel } from '../../../shared/model';

const s1 = 1 / 500; // slow layer above
const s2 = 1 / 2000; // fast layer below

function twoLayer(depth: number, extra: Record<string, unknown> = {}) {
  const r = parseModelFile({
    format: 'timefield-model/1',
    grid: { x0: 0, dx: 1, nx: 5, z0: 0, dz: 1, nz: 6 },
    layers: [
      { name: 'clay', base: [[0, -depth], [4, -depth]], v_top: 500, v_base: 500 },
      { name: 'chalk', v_top: 2000, v_base: 2000 },
    ],
    ...extra,
  });
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return rasteriseModel(r.model);
}
const cell = (m: ReturnType<typeof twoLayer>, cx: number, cz: number) => m.cellSlowness![cz * (m.grid.nx - 1) + cx];

describe('headWaveSlowness', () => {
  it('is the slowness itself in uniform ground', () => {
    expect(headWaveSlowness(new Float64Array(64).fill(s1))).toBeCloseTo(s1, 15);
  });
  it('gives s² = s_f² + f²(s_s² − s_f²) for a slow fraction f', () => {
    const samples = new Float64Array(40);
    samples.fill(s1, 0, 10).fill(s2, 10); // f = 0.25
    expect(headWaveSlowness(samples)).toBeCloseTo(Math.sqrt(s2 * s2 + 0.0625 * (s1 * s1 - s2 * s2)), 15);
  });
});

describe('rasteriseModel: cell slownesses', () => {
  it('gives values only in the row of cells the interface crosses', () => {
    const m = twoLayer(2.3); // between node rows z = −2 (iz 2) and −3 (iz 3)
    for (let cz = 0; cz < 5; cz++) {
      for (let cx = 0; cx < 4; cx++) {
        if (cz === 2) expect(cell(m, cx, cz)).toBeGreaterThan(0);
        else expect(cell(m, cx, cz)).toBeNaN();
      }
    }
  });

  it('reads the interface position inside the cell: 30 % slow', () => {
    const m = twoLayer(2.3);
    // Sample centres (k + ½)/32 below the cell top lie above the interface for k + ½ < 9.6, so 10 of 32.
    const f = 10 / SAMPLES_Z;
    expect(SAMPLES_X * SAMPLES_Z).toBe(256);
    expect(cell(m, 1, 2)).toBe(Math.fround(Math.sqrt(s2 * s2 + f * f * (s1 * s1 - s2 * s2)))); // stored as Float32
  });

  it('moves with the interface between the same two node rows, which the nodes alone cannot', () => {
    const a = twoLayer(2.1);
    const b = twoLayer(2.9);
    expect(Array.from(a.velocity)).toEqual(Array.from(b.velocity));
    expect(cell(a, 1, 2)).toBeLessThan(cell(b, 1, 2));
  });

  it('an interface on a node row leaves the cell above it all slow', () => {
    const m = twoLayer(2); // on row iz 2, whose nodes belong to the layer below
    expect(cell(m, 1, 1)).toBe(Math.fround(s1));
    expect(cell(m, 1, 2)).toBeNaN();
  });

  it('leaves cells with a painted corner to the solver', () => {
    const m = twoLayer(2.3, { edits: [{ ix: 1, iz: 2, v: 800 }] });
    expect(cell(m, 0, 2)).toBeNaN();
    expect(cell(m, 1, 2)).toBeNaN();
    expect(cell(m, 2, 2)).toBeGreaterThan(0);
  });

  it('is absent for a raw velocity grid', () => {
    const r = parseModelFile({ format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 2, z0: 0, dz: 1, nz: 2 }, velocity: [500, 500, 2000, 2000] });
    if (!r.ok) throw new Error(JSON.stringify(r.issues));
    expect(rasteriseModel(r.model).cellSlowness).toBeUndefined();
  });
});
