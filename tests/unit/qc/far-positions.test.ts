/**
 * Issue 16 item 5: pick positions far from every station get a warning. Rule (our choice, common
 * practice, no source): more than 3 median station spacings from the nearest station.
 * Expected distances are worked by hand from the station positions below.
 */
import { describe, expect, it } from 'vitest';
import { findFarPositions as findFar, positionsOfPicks, type QcPick } from '../../../shared/qc';
import { pick, stations } from './make-pick';

const findFarPositions = (picks: QcPick[], xs: number[]) => findFar(positionsOfPicks(picks), xs);
const line = stations(0, 100, 5); // 21 stations, 5 m apart → median spacing 5 m, limit 15 m

describe('findFarPositions', () => {
  it('reports a receiver typed 10 000 m too far, once, with the pick count', () => {
    const picks = [pick(0, 'S1', 0, 10, 20), pick(1, 'S1', 0, 10_020, 30), pick(2, 'S2', 100, 10_020, 30), pick(3, 'S2', 100, 50, 30)];
    const r = findFarPositions(picks, line);
    expect(r.medianSpacing).toBe(5);
    expect(r.limit).toBe(15);
    expect(r.positions).toHaveLength(1);
    expect(r.positions[0]).toMatchObject({ role: 'receiver', x: 10_020, nearestStationX: 100, distance: 9_920, picks: 2, firstIndex: 1 });
    expect(r.positions[0].message).toMatch(/receiver at x = 10020\.0 m is 9920\.0 m from the nearest station \(x = 100\.0 m\)/);
  });

  it('an off-end shot within 3 spacings is normal; one beyond is reported', () => {
    const near = [pick(0, 'OFF1', -15, 0, 40)]; // exactly 3 spacings: not more than the limit
    expect(findFarPositions(near, line).positions).toEqual([]);
    const far = [pick(0, 'OFF2', -15.5, 0, 40), pick(1, 'OFF2', -15.5, 5, 42)];
    const r = findFarPositions(far, line);
    expect(r.positions.map((p) => [p.role, p.shotId, p.distance, p.picks])).toEqual([['source', 'OFF2', 15.5, 2]]);
  });

  it('a position inside a wide gap of the table is measured to the nearest station on either side', () => {
    const gappy = [0, 5, 10, 15, 60, 65, 70]; // gaps 5,5,5,45,5,5 → median 5, limit 15
    const r = findFarPositions([pick(0, 'S', 0, 37.5, 30), pick(1, 'S', 0, 32, 28)], gappy);
    expect(r.positions.map((p) => [p.x, p.nearestStationX, p.distance])).toEqual([[37.5, 15, 22.5], [32, 15, 17]]);
  });

  it('no check without at least two stations', () => {
    expect(findFarPositions([pick(0, 'S', 0, 1e6, 30)], [10])).toEqual({ medianSpacing: null, limit: null, positions: [] });
  });
});
