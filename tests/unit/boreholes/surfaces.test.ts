/**
 * The surfaces the ties read: the top of a layered model's deepest layer (depth = ground − base
 * elevation) and a refractor interpolated between geophones. Checked by hand-computed values
 * (linear interpolation; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { deepestInterfaceDepth, deepestLayerName, depthBetween } from '../../../shared/boreholes';

describe('tie surfaces', () => {
  it('the deepest layer top: ground minus the base of the layer above, null off its ends', () => {
    const model = { layers: [{ name: 'topsoil', base: [[0, 98], [10, 97]] }, { name: 'clay', base: [[0, 90], [10, 86]] }, { name: 'granite' }] } as never;
    const depth = deepestInterfaceDepth(model, () => 100)!;
    // At x = 5 the clay's base is at 88 m: 12 m below a ground at 100 m.
    expect(depth(5)).toBe(12);
    expect(depth(-1)).toBeNull();
    expect(depth(11)).toBeNull();
    expect(deepestLayerName(model)).toBe('the top of granite');
    expect(deepestInterfaceDepth({ layers: [{ name: 'one' }] } as never, () => 0)).toBeNull();
  });

  it('a refractor between geophones: linear, exact at the geophones, null outside them', () => {
    const at = depthBetween([{ x: 4, depth: 6 }, { x: 0, depth: 2 }, { x: 8, depth: 6 }]);
    expect(at(0)).toBe(2);
    expect(at(2)).toBe(4);
    expect(at(6)).toBe(6);
    expect(at(8.5)).toBeNull();
    expect(depthBetween([])(1)).toBeNull();
  });
});
