/** Chainage along a bent line and the station-coordinate checks; distances from Pythagoras (3-4-5 triangles). */
import { describe, expect, it } from 'vitest';
import { chainageAlong, coordinateProblems } from '../../../shared/geo/chainage';

const pt = (easting: number, northing: number) => ({ easting, northing });

describe('chainage along a line that bends', () => {
  it('sums the straight steps between stations: 5 m steps east, then 5 m steps north-east', () => {
    const points = [pt(1000, 2000), pt(1005, 2000), pt(1010, 2000), pt(1013, 2004), pt(1016, 2008)];
    expect(chainageAlong(points)).toEqual([0, 5, 10, 15, 20]);
    expect(chainageAlong(points, 100)).toEqual([100, 105, 110, 115, 120]);
    expect(coordinateProblems(points)).toEqual([]);
    expect(coordinateProblems(points, [0, 5, 10, 15, 20])).toEqual([]);
  });

  it('names the point where a line doubles back, jumps, repeats a point or disagrees with its chainage', () => {
    const back = [pt(0, 0), pt(5, 0), pt(10, 0), pt(6, 3), pt(11, 3)];
    expect(coordinateProblems(back).map((p) => p.index)).toContain(3);
    expect(coordinateProblems(back).find((p) => p.index === 3)!.message).toMatch(/turns the line back by 143°/); // atan2(3, −4): 180° − 36.87°
    const jump = [pt(0, 0), pt(5, 0), pt(10, 0), pt(60, 0), pt(65, 0)];
    expect(coordinateProblems(jump)).toEqual([{ index: 3, message: 'is 50.0 m from the station before it, where stations are typically 5.0 m apart: a coordinate looks wrong (if the line really skips here, give the chainage x as well)' }]);
    // The same gap with the chainage given beside it is a real gap in the spread, not a jump.
    expect(coordinateProblems(jump, [0, 5, 10, 60, 65])).toEqual([]);
    expect(coordinateProblems([pt(0, 0), pt(5, 0), pt(5, 0)])[0]).toEqual({ index: 2, message: 'has the same easting and northing as the station before it' });
    expect(coordinateProblems([pt(0, 0), pt(3, 4), pt(6, 8)], [0, 5, 12])).toEqual([{ index: 2, message: 'is 5.00 m from the station before it by its coordinates but 7.00 m by its chainage x' }]);
  });
});
