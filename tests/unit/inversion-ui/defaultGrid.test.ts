import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { defaultGridSpec } from '../../../shared/model/edit/defaults';
import { defaultInversionSpacing, gridSizeWords, inversionGrid, medianStationSpacing } from '../../../src/components/inversion/defaultGrid';

// The rule is the one the issue brief states: the model editor's default extent for the line,
// on a spacing of half the median station spacing. Expected values worked out by hand.

const line = (xs: number[], z = 100) => xs.map((x) => ({ x, z }));

describe('medianStationSpacing', () => {
  it('takes the median gap between neighbouring stations, whatever order they are listed in', () => {
    expect(medianStationSpacing(line([10, 0, 2, 4, 6]))).toBe(2); // gaps 2, 2, 2, 4
    expect(medianStationSpacing(line([0, 1, 3, 6, 10]))).toBe(2.5); // gaps 1, 2, 3, 4 → (2 + 3) / 2
    expect(medianStationSpacing(line([0, 0, 5]))).toBe(5); // a repeated position is one station
    expect(medianStationSpacing(line([7]))).toBeNull();
  });

  it('gives 1.25 m cells on the demo line, whose geophones are 2.5 m apart', () => {
    const rows = readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8')
      .split('\n')
      .filter((l) => /^\d/.test(l))
      .map((l) => l.split(','));
    expect(defaultInversionSpacing(rows.map(([, x, z]) => ({ x: Number(x), z: Number(z) })))).toBe(1.25);
  });
});

describe('inversionGrid', () => {
  // 51 stations 2 m apart on flat ground at 100 m. The editor's default (defaults.ts): margin 5 m,
  // x −5 … 105, top 100.5, depth 25.5 (bottom at 75). On 1 m cells: x −5 … 105 → 111 nodes;
  // top 101, bottom still 75 → 27 rows.
  const stations = line(Array.from({ length: 51 }, (_, i) => 2 * i));

  it('keeps the editor default extent on the finer spacing', () => {
    const spacing = defaultInversionSpacing(stations)!;
    expect(spacing).toBe(1);
    const grid = inversionGrid({ stations }, spacing);
    expect(grid).toEqual({ x0: -5, dx: 1, nx: 111, z0: 101, dz: 1, nz: 27 });
  });

  it('reaches at least as far as the editor default on every side, for awkward spacings too', () => {
    const spec = defaultGridSpec({ stations, shotXs: [-12, 112] });
    for (const spacing of [0.3, 0.7, 1.25, 3]) {
      const g = inversionGrid({ stations, shotXs: [-12, 112] }, spacing);
      expect(g.x0).toBeLessThanOrEqual(spec.xStart + 1e-9);
      expect(g.x0 + (g.nx - 1) * g.dx).toBeGreaterThanOrEqual(spec.xEnd - 1e-9);
      expect(g.z0).toBeGreaterThanOrEqual(spec.top - 1e-9);
      expect(g.z0 - (g.nz - 1) * g.dz).toBeLessThanOrEqual(spec.top - spec.depth + 1e-9);
    }
  });
});

describe('gridSizeWords', () => {
  it('says the node count and flags a grid past the limit', () => {
    expect(gridSizeWords({ x0: 0, dx: 1, nx: 111, z0: 0, dz: 1, nz: 27 })).toEqual({ text: '111 × 27 nodes (2,997)', tooLarge: false });
    expect(gridSizeWords({ x0: 0, dx: 0.01, nx: 2001, z0: 0, dz: 0.01, nz: 1000 }).tooLarge).toBe(2001 * 1000 > MAX_GRID_NODES);
  });
});
