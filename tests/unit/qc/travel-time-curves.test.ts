import { describe, expect, it } from 'vitest';
import { QC_DEFAULTS, findReciprocalPairs, flagSuspectPicks, runPickQc, travelTimeCurves } from '../../../shared/qc';
import { pick } from './make-pick';

describe('travelTimeCurves', () => {
  it('one curve per shot in order of first appearance, sorted by x, excluded picks kept, non-finite dropped', () => {
    const curves = travelTimeCurves([
      pick(0, 'B', 20, 10, 15), pick(1, 'A', 0, 10, 20), pick(2, 'A', 0, 5, 10, { excluded: true }),
      pick(3, 'A', 0, 7.5, 15), pick(4, 'A', 0, 8, NaN), pick(5, 'B', 20, 5, 25),
    ]);
    expect(curves.map((c) => [c.shotId, c.sourceX])).toEqual([['B', 20], ['A', 0]]);
    const a = curves[1];
    expect(a.x).toBeInstanceOf(Float64Array);
    expect(a.index).toBeInstanceOf(Int32Array);
    expect([...a.x]).toEqual([5, 7.5, 10]);
    expect([...a.t]).toEqual([0.01, 0.015, 0.02]);
    expect([...a.index]).toEqual([2, 3, 1]);
    expect(travelTimeCurves([])).toEqual([]);
  });

  it('two picks at one x are ordered by time', () => {
    const [c] = travelTimeCurves([pick(0, 'A', 0, 10, 21), pick(1, 'A', 0, 10, 20)]);
    expect([...c.index]).toEqual([1, 0]);
  });
});

describe('runPickQc', () => {
  const picks = [pick(0, 'A', 0, 30, 30), pick(1, 'B', 30, 0, 32.5), pick(2, 'A', 0, 32.5, 30)];

  it('is the two checks with their defaults (2 ms, 100 and 8000 m/s: common practice, no source)', () => {
    expect(QC_DEFAULTS).toMatchObject({ reciprocalToleranceS: 0.002, vMin: 100, vMax: 8000, sigmaAllowance: 2 });
    const qc = runPickQc(picks);
    expect(qc.reciprocalPairs).toEqual(findReciprocalPairs(picks));
    expect(qc.reciprocalPairs[0].flagged).toBe(true); // 2.5 ms apart
    expect(qc.flags).toEqual(flagSuspectPicks(picks));
    // A falls 0 ms from 30 to 32.5 m: within the 1.41 ms allowance for two 0.5 ms picks, so no flag.
    expect(qc.flags).toEqual([]);
  });

  it('passes the reciprocal tolerance through', () => {
    expect(runPickQc(picks, { reciprocalToleranceS: 0.003 }).reciprocalPairs[0].flagged).toBe(false);
  });
});
