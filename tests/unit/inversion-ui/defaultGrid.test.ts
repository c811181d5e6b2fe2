import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { defaultGridSpec } from '../../../shared/model/edit/defaults';
import { defaultInversionSpacing, gridSizeWords, inversionGrid, medianStationSpacing } from '../../../src/components/inversion/defaultGrid';

// The rule: the model editor's default extent for the line, on half the median station spacing
// taken down to one of the editor's round spacings (shared/model/edit/defaults.ts NICE_SPACINGS) and
// coarsened while the grid would have more than 600 nodes along the line — the server's rule for the
// automatic start, so the form shows the grid the worker will use. Expected values worked out by hand.

const line = (xs: number[], z = 100) => xs.map((x) => ({ x, z }));

describe('medianStationSpacing', () => {
  it('takes the median gap between neighbouring stations, whatever order they are listed in', () => {
    expect(medianStationSpacing(line([10, 0, 2, 4, 6]))).toBe(2); // gaps 2, 2, 2, 4
    expect(medianStationSpacing(line([0, 1, 3, 6, 10]))).toBe(2.5); // gaps 1, 2, 3, 4 → (2 + 3) / 2
    expect(medianStationSpacing(line([0, 0, 5]))).toBe(5); // a repeated position is one station
    expect(medianStationSpacing(line([7]))).toBeNull();
  });

  it('gives 1 m cells on the demo line, whose geophones are 2.5 m apart (half is 1.25, down to 1)', () => {
    const rows = readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8')
      .split('\n')
      .filter((l) => /^\d/.test(l))
      .map((l) => l.split(','));
    expect(defaultInversionSpacing({ stations: rows.map(([, x, z]) => ({ x: Number(x), z: Number(z) })) })).toBe(1);
  });
});

describe('inversionGrid', () => {
  // 51 stations 2 m apart on flat ground at 100 m. The editor's default (defaults.ts): margin 5 m,
  // x −5 … 105, top 100.5, depth 25.5 (bottom at 75). On 1 m cells: x −5 … 105 → 111 nodes;
  // top 101, bottom still 75 → 27 rows.
  const stations = line(Array.from({ length: 51 }, (_, i) => 2 * i));

  it('keeps the editor default extent on the finer spacing', () => {
    const spacing = defaultInversionSpacing({ stations });
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

describe('defaultInversionSpacing', () => {
  it('takes half the station spacing down to a round spacing', () => {
    expect(defaultInversionSpacing({ stations: line([0, 3, 6, 9]) })).toBe(1); // 1.5 → 1
    expect(defaultInversionSpacing({ stations: line([0, 5, 10]) })).toBe(2.5); // 2.5 is round already
    expect(defaultInversionSpacing({ stations: line([0, 0.3, 0.6]) })).toBe(0.1); // 0.15 → 0.1
    expect(defaultInversionSpacing({ stations: line([0, 0.1, 0.2]) })).toBe(0.1); // 0.05: nothing smaller is offered
  });

  it('coarsens a long line until the grid has at most 600 nodes along it', () => {
    // 0 … 2000 m every 2 m: editor extent −100 … 2100 m (margin 5 % of 2000). Nodes along the line at
    // 1, 2, 2.5 and 5 m: 2201, 1101, 881, 441 — the first within 600 is 5 m.
    const long = line(Array.from({ length: 1001 }, (_, i) => 2 * i));
    expect(defaultInversionSpacing({ stations: long })).toBe(5);
    expect(inversionGrid({ stations: long }, 5).nx).toBe(441);
  });
});

describe('gridSizeWords', () => {
  it('says the node count and flags a grid past the limit', () => {
    expect(gridSizeWords({ x0: 0, dx: 1, nx: 111, z0: 0, dz: 1, nz: 27 })).toEqual({ text: '111 × 27 nodes (2,997)', tooLarge: false });
    expect(gridSizeWords({ x0: 0, dx: 0.01, nx: 2001, z0: 0, dz: 0.01, nz: 1000 }).tooLarge).toBe(2001 * 1000 > MAX_GRID_NODES);
  });
});
