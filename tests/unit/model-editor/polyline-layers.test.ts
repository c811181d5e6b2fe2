import { describe, expect, it } from 'vitest';
import type { Grid } from '../../../shared/grid';
import { parseModelFile } from '../../../shared/model';
import {
  addLayerBelow, deleteNode, defaultGridSpec, defaultModel, fitPolylineToRange, insertNode, insertNodeInWidestGap, moveNode, removeLayer, type Point,
} from '../../../shared/model/edit';

const grid: Grid = { x0: 0, dx: 1, nx: 101, z0: 20, dz: 1, nz: 21 };
const line: Point[] = [[0, 10], [50, 12], [100, 8]];

describe('interface nodes', () => {
  it('inner nodes move freely between their neighbours; end nodes keep their x', () => {
    expect(moveNode(line, 1, 30, 11)[1]).toEqual([30, 11]);
    expect(moveNode(line, 1, 120, 11)[1][0]).toBeCloseTo(99.99, 9); // stays left of the next node
    expect(moveNode(line, 0, 40, 15)[0]).toEqual([0, 15]);
    expect(moveNode(line, 2, 40, -30, grid)[2]).toEqual([100, 0]); // clamped to the grid bottom (z = 0)
  });

  it('a node inserted on the line takes the line\'s height there', () => {
    const out = insertNode(line, 75);
    expect(out).toHaveLength(4);
    expect(out[2]).toEqual([75, 10]); // halfway from 12 to 8
    expect(insertNode(line, 50)).toBe(line); // already a node there
    expect(insertNode(line, -5)).toBe(line); // outside the ends
    expect(insertNodeInWidestGap([[0, 0], [10, 0], [40, 4]])[2]).toEqual([25, 2]);
  });

  it('only inner nodes can be deleted, and never below two nodes', () => {
    expect(deleteNode(line, 1)).toEqual([[0, 10], [100, 8]]);
    expect(deleteNode(line, 0)).toBe(line);
    expect(deleteNode([[0, 1], [100, 1]], 1)).toHaveLength(2);
  });

  it('fitting to a new x range cuts and extends with the values held at the ends', () => {
    expect(fitPolylineToRange(line, 25, 120)).toEqual([[25, 11], [50, 12], [100, 8], [120, 8]]);
  });
});

describe('layers', () => {
  const model = defaultModel({ stations: [{ x: 0, z: 15 }, { x: 50, z: 16 }, { x: 100, z: 14 }] });

  it('the default model is valid and its last layer has no base', () => {
    const parsed = parseModelFile(model);
    expect(parsed.ok).toBe(true);
    expect(model.layers!.at(-1)!.base).toBeUndefined();
  });

  it('adding below the last layer gives the old last layer a base; the result stays valid', () => {
    const layers = addLayerBelow(model.layers!, 1, model.grid, model.surface as Point[]);
    expect(layers).toHaveLength(3);
    expect(layers[1].base).toBeDefined();
    expect(layers[2].base).toBeUndefined();
    expect(parseModelFile({ ...model, layers }).ok).toBe(true);
  });

  it('adding between layers puts the new base between the neighbours', () => {
    const layers = addLayerBelow(model.layers!, 0, model.grid, model.surface as Point[]);
    expect(layers).toHaveLength(3);
    const [upper, fresh] = layers;
    // below the upper base everywhere, above the grid bottom
    for (const [x, z] of fresh.base!) {
      const zu = upper.base!.find((p) => p[0] === x)?.[1];
      if (zu !== undefined) expect(z).toBeLessThan(zu);
    }
    expect(parseModelFile({ ...model, layers }).ok).toBe(true);
  });

  it('removing the last layer takes the base off the new last layer', () => {
    const three = addLayerBelow(model.layers!, 1, model.grid, model.surface as Point[]);
    const two = removeLayer(three, 2);
    expect(two).toHaveLength(2);
    expect(two[1].base).toBeUndefined();
    expect(parseModelFile({ ...model, layers: two }).ok).toBe(true);
    expect(removeLayer([model.layers![0]], 0)).toHaveLength(1);
  });
});

describe('default grid', () => {
  it('covers stations and near off-end shots with a margin, but not a shot ten spreads away', () => {
    const stations = [{ x: 0, z: 100 }, { x: 100, z: 102 }];
    const near = defaultGridSpec({ stations, shotXs: [-40, 150] });
    expect(near.xStart).toBeLessThanOrEqual(-40 - 5);
    expect(near.xEnd).toBeGreaterThanOrEqual(150 + 5);
    const far = defaultGridSpec({ stations, shotXs: [1000] });
    expect(far.xEnd).toBeLessThan(200);
    // a quarter of the spread below the lowest station, from a top above the highest one
    expect(far.top).toBeGreaterThan(102);
    expect(far.top - far.depth).toBeLessThanOrEqual(100 - 25);
  });
});
