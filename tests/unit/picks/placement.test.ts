/** Placing picks on a model: empty z → on the surface; positions outside the grid or in the air → line-named errors. */
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { formatPickError, groupPicksByShot, parsePickText, placeShots } from '../../../shared/picks';

const parsed = parseModelFile({
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 1, nx: 21, z0: 10, dz: 1, nz: 11 },
  surface: [[0, 8], [20, 6]], // z = 8 − 0.1·x
  layers: [{ v_top: 800, v_base: 1200 }],
});
if (!parsed.ok) throw new Error('model must parse');
const model = rasteriseModel(parsed.model);
const place = (csv: string) => {
  const r = parsePickText(csv);
  if (!r.ok) throw new Error(r.errors.map(formatPickError).join('\n'));
  return placeShots(model, groupPicksByShot(r.picks));
};

describe('placeShots', () => {
  it('puts empty elevations on the surface and keeps given ones', () => {
    const r = place('shot_id,source_x,source_z,receiver_x,receiver_z,time_ms\nS1,5,,10,,3\nS1,5,,15,2.5,4\nS2,12,4,3,,5\n');
    if (!r.ok) throw new Error(r.errors.map(formatPickError).join('\n'));
    expect(r.shots.map((s) => [s.shotId, s.source.x, +s.source.z.toFixed(9)])).toEqual([['S1', 5, 7.5], ['S2', 12, 4]]);
    expect(Array.from(r.shots[0].receivers).map((v) => +v.toFixed(9))).toEqual([10, 7, 15, 2.5]);
  });

  it('rejects positions outside the grid or above the ground, naming line and column', () => {
    const r = place('shot_id,source_x,source_z,receiver_x,receiver_z,time_ms\nS1,5,,25,,3\nS1,5,,15,7,4\nS2,12,-1,3,,5\nS3,2,9,3,,5\n');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.map(formatPickError)).toEqual([
        'line 2, receiver_x: receiver at x 25 m, z 6 m is outside the model (grid x 0 to 20 m, z 0 to 10 m)',
        'line 3, receiver_z: receiver at x 15 m, z 7 m is in the air, above the ground surface (z 6.5 m)',
        'line 4, source_z: source at x 12 m, z -1 m is outside the model (grid x 0 to 20 m, z 0 to 10 m)',
        'line 5, source_z: source at x 2 m, z 9 m is in the air, above the ground surface (z 7.8 m)',
      ]);
    }
  });
});
