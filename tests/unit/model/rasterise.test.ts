/**
 * Rasterisation against a worked example computed by hand (the arithmetic is written out
 * beside each expected value). Rules checked: FORMATS.md §1 plus our documented sampling
 * choices in shared/model/rasterise.ts (node on an interface → layer below; gradient
 * evaluated at the node's z; node on the surface is ground; air copies the ground below).
 */
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel, type ModelFile } from '../../../shared/model';

function load(json: unknown): ModelFile {
  const r = parseModelFile(json);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.model;
}

// Grid: x = 0, 10, 20 (ix 0..2); z = 10, 8, 6, 4, 2, 0 (iz 0..5).
// Surface: 9 at x=0, 7 at x=10, 5 at x=20.
// Layer 0 base: flat at z=4. Layer 1 base: 1 at x=0, 3 at x=10, 5 at x=20 (crosses layer 0's base → pinch-out at x=20).
const worked = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 10, nx: 3, z0: 10, dz: 2, nz: 6 },
  surface: [[0, 9], [20, 5]],
  layers: [
    { name: 'topsoil', base: [[0, 4], [20, 4]], v_top: 400, v_base: 800 },
    { name: 'weathered', base: [[0, 1], [20, 5]], v_top: 1500, v_base: 2000 },
    { name: 'bedrock', v_top: 3000, v_base: 3600 },
  ],
};

describe('rasteriseModel: worked example', () => {
  const m = rasteriseModel(load(worked));
  const v = (ix: number, iz: number) => m.velocity[iz * 3 + ix];
  const a = (ix: number, iz: number) => m.active[iz * 3 + ix];

  it('marks nodes above the surface as air and nodes on or below it as ground', () => {
    // column x=0 (surface 9): z=10 air, z=8.. ground
    expect([0, 1, 2, 3, 4, 5].map((iz) => a(0, iz))).toEqual([0, 1, 1, 1, 1, 1]);
    // column x=10 (surface 7): z=10, 8 air
    expect([0, 1, 2, 3, 4, 5].map((iz) => a(1, iz))).toEqual([0, 0, 1, 1, 1, 1]);
    // column x=20 (surface 5): z=10, 8, 6 air
    expect([0, 1, 2, 3, 4, 5].map((iz) => a(2, iz))).toEqual([0, 0, 0, 1, 1, 1]);
  });

  it('column x=0: gradients within each layer, node on an interface takes the layer below', () => {
    expect(v(0, 1)).toBeCloseTo(480, 3); // z=8, topsoil: 400 + 400·(9−8)/(9−4) = 480
    expect(v(0, 2)).toBeCloseTo(640, 3); // z=6: 400 + 400·(9−6)/5 = 640
    expect(v(0, 3)).toBeCloseTo(1500, 3); // z=4 on topsoil base → weathered top: 1500
    expect(v(0, 4)).toBeCloseTo(1833.333, 2); // z=2: 1500 + 500·(4−2)/(4−1) = 1833.33
    expect(v(0, 5)).toBeCloseTo(3600, 3); // z=0 bedrock, top 1, bottom 0: 3000 + 600·1 = 3600
  });

  it('column x=10: thin weathered layer, bedrock gradient to the grid bottom', () => {
    expect(v(1, 2)).toBeCloseTo(533.333, 2); // z=6: 400 + 400·(7−6)/(7−4) = 533.33
    expect(v(1, 3)).toBeCloseTo(1500, 3); // z=4 on interface → weathered (top 4, base 3): 1500
    expect(v(1, 4)).toBeCloseTo(3200, 3); // z=2 bedrock, top 3, bottom 0: 3000 + 600·(3−2)/3 = 3200
    expect(v(1, 5)).toBeCloseTo(3600, 3);
  });

  it('column x=20: weathered base above topsoil base is clipped, the layer pinches out', () => {
    // Weathered base 5 > topsoil base 4 → clipped to 4, zero thickness: z=4 goes straight to bedrock (top 4).
    expect(v(2, 3)).toBeCloseTo(3000, 3); // 3000 + 600·0
    expect(v(2, 4)).toBeCloseTo(3300, 3); // 3000 + 600·(4−2)/(4−0)
    expect(v(2, 5)).toBeCloseTo(3600, 3);
  });

  it('air nodes copy the topmost ground velocity of their column', () => {
    expect(v(0, 0)).toBe(v(0, 1));
    expect(v(1, 0)).toBe(v(1, 2));
    expect(v(1, 1)).toBe(v(1, 2));
    expect([0, 1, 2].map((iz) => v(2, iz))).toEqual([v(2, 3), v(2, 3), v(2, 3)]);
  });

  it('surfaceZ interpolates the polyline', () => {
    expect(m.surfaceZ(10)).toBeCloseTo(7, 12);
    expect(m.surfaceZ(5)).toBeCloseTo(8, 12);
  });
});

describe('rasteriseModel: other forms', () => {
  it('without a surface the top row is ground and surfaceZ is z0', () => {
    const m = rasteriseModel(load({ ...worked, surface: undefined }));
    expect(Array.from(m.active)).toEqual(new Array(18).fill(1));
    expect(m.surfaceZ(7)).toBe(10);
    // x=0, z=10, topsoil from 10 to 4: 400 + 400·0 = 400; z=8: 400 + 400·2/6 = 533.33
    expect(m.velocity[0]).toBeCloseTo(400, 3);
    expect(m.velocity[3]).toBeCloseTo(533.333, 2);
  });

  it('raw velocity grid is used as given, with air filled from below', () => {
    const velocity = Array.from({ length: 18 }, (_, i) => 100 + i);
    const m = rasteriseModel(load({ format: 'timefield-model/1', grid: worked.grid, surface: worked.surface, velocity }));
    expect(m.velocity[4 * 3 + 1]).toBe(113); // (ix 1, iz 4) → index 13
    // air at x=20 (iz 0..2) copies the first ground node (ix 2, iz 3) → index 3·3 + 2 = 11 → 111
    expect([0, 1, 2].map((iz) => m.velocity[iz * 3 + 2])).toEqual([111, 111, 111]);
    expect(m.velocity[0]).toBe(103); // air at x=0 (iz 0) copies (ix 0, iz 1) → index 3 → 103
  });

  it('edits paint ground nodes over the layered result and leave air alone', () => {
    const m = rasteriseModel(load({ ...worked, edits: [{ ix: 1, iz: 4, v: 999 }, { ix: 2, iz: 0, v: 55 }] }));
    expect(m.velocity[4 * 3 + 1]).toBe(999);
    expect(m.active[2]).toBe(0);
    expect(m.velocity[2]).toBeCloseTo(3000, 3);
  });

  it('a node exactly on a surface reached through floating-point steps still counts as ground', () => {
    // z = 1 − 3·0.1 = 0.7000000000000001 in doubles vs a surface at 0.7
    const m = rasteriseModel(load({
      format: 'timefield-model/1',
      grid: { x0: 0, dx: 0.1, nx: 2, z0: 1, dz: 0.1, nz: 6 },
      surface: [[0, 0.7], [0.1, 0.7]],
      layers: [{ v_top: 500, v_base: 500 }],
    }));
    expect(m.active[3 * 2]).toBe(1);
    expect(m.active[2 * 2]).toBe(0);
  });
});
