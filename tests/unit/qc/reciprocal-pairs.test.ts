/**
 * Reciprocal pairs on hand-made geometry: t(A→B) must equal t(B→A) (ray reversibility; Hagedoorn 1959,
 * Palmer 1980 — from memory). Tolerances 2 ms and 0.25 m are the defaults (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { findReciprocalPairs } from '../../../shared/qc';
import { pick } from './make-pick';

// Three shots at 0, 30, 60 m; each has receivers at the other two sources.
const base = () => [
  pick(0, 'S3', 60, 0, 44.4), pick(1, 'S3', 60, 30, 32.0),
  pick(2, 'S1', 0, 30, 31.5), pick(3, 'S1', 0, 60, 44.0),
  pick(4, 'S2', 30, 0, 31.0), pick(5, 'S2', 30, 60, 33.9),
];

describe('findReciprocalPairs', () => {
  it('one entry per unordered pair, sorted by shot id, shotA < shotB, tAB from shot A', () => {
    const pairs = findReciprocalPairs(base());
    expect(pairs.map((p) => [p.shotA, p.shotB, p.indexAB, p.indexBA])).toEqual([
      ['S1', 'S2', 2, 4], ['S1', 'S3', 3, 0], ['S2', 'S3', 5, 1],
    ]);
    const [p12, p13, p23] = pairs;
    expect([p12.tAB, p12.tBA]).toEqual([0.0315, 0.031]);
    expect(p12.difference).toBeCloseTo(0.0005, 12);
    expect(p13.difference).toBeCloseTo(0.0004, 12);
    expect(p23.difference).toBeCloseTo(0.0019, 12);
    expect(pairs.every((p) => !p.flagged)).toBe(true);
  });

  it('flags a difference above the tolerance; exactly at the tolerance is not flagged', () => {
    const picks = base().map((p) => (p.index === 1 ? { ...p, time: 0.0339 + 0.0021 } : p)); // S3 at 30 m
    expect(findReciprocalPairs(picks).find((p) => p.shotB === 'S3' && p.shotA === 'S2')!.flagged).toBe(true);
    const atTolerance = base().map((p) => (p.index === 1 ? { ...p, time: 0.0339 + 0.002 } : p));
    expect(findReciprocalPairs(atTolerance).find((p) => p.shotA === 'S2' && p.shotB === 'S3')!.flagged).toBe(false);
    expect(findReciprocalPairs(base(), { toleranceS: 0.0004 }).map((p) => p.flagged)).toEqual([true, false, true]);
  });

  it('matches receivers within the position tolerance, taking the nearest (ties: lower index)', () => {
    const near = [pick(0, 'A', 0, 30.2, 30), pick(1, 'B', 30, 0, 30)];
    expect(findReciprocalPairs(near)).toHaveLength(1);
    const far = [pick(0, 'A', 0, 30.3, 30), pick(1, 'B', 30, 0, 30)];
    expect(findReciprocalPairs(far)).toEqual([]);
    expect(findReciprocalPairs(far, { positionTolerance: 0.5 })).toHaveLength(1);
    const two = [pick(7, 'A', 0, 29.9, 30), pick(3, 'A', 0, 30.05, 31), pick(5, 'A', 0, 30.1, 32), pick(1, 'B', 30, 0, 30)];
    expect(findReciprocalPairs(two)[0].indexAB).toBe(3);
    const tie = [pick(7, 'A', 0, 29.9, 30), pick(4, 'A', 0, 30.1, 31), pick(1, 'B', 30, 0, 30)];
    expect(findReciprocalPairs(tie)[0].indexAB).toBe(4);
  });

  it('ignores excluded and non-finite picks, and repeat shots at one source position', () => {
    const excluded = base().map((p) => (p.index === 4 ? { ...p, excluded: true } : p));
    expect(findReciprocalPairs(excluded).map((p) => `${p.shotA}-${p.shotB}`)).toEqual(['S1-S3', 'S2-S3']);
    const nan = base().map((p) => (p.index === 4 ? { ...p, time: NaN } : p));
    expect(findReciprocalPairs(nan).map((p) => `${p.shotA}-${p.shotB}`)).toEqual(['S1-S3', 'S2-S3']);
    const repeat = [pick(0, 'A', 0, 0.1, 0.2), pick(1, 'B', 0.1, 0, 0.3)];
    expect(findReciprocalPairs(repeat)).toEqual([]);
  });

  it('empty input, a single shot, and shots without receivers at each other give no pairs', () => {
    expect(findReciprocalPairs([])).toEqual([]);
    expect(findReciprocalPairs([pick(0, 'A', 0, 30, 30)])).toEqual([]);
    expect(findReciprocalPairs([pick(0, 'A', 0, 30, 30), pick(1, 'B', 30, 10, 20)])).toEqual([]);
  });

  it('rejects negative or non-finite tolerances', () => {
    expect(() => findReciprocalPairs(base(), { toleranceS: -0.001 })).toThrow(/toleranceS/);
    expect(() => findReciprocalPairs(base(), { positionTolerance: NaN })).toThrow(/positionTolerance/);
  });
});
