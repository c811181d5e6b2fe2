import { describe, expect, it } from 'vitest';
import { compareResiduals, rmsMs } from '../../../src/components/run/compare/residualDifference';
import { comparisonHeadline, compareSentence } from '../../../src/components/run/compare/compareWords';
import { buildMatrix } from '../../../src/components/run/misfit/matrix';
import { row } from './fixtures';

describe('buildMatrix', () => {
  it('puts each pick in its shot row and receiver column, with gaps where a shot has no pick', () => {
    const rows = [row({ shotId: 'S10', receiverX: 5 }), row({ shotId: 'S2', receiverX: 0 }), row({ shotId: 'S2', receiverX: 5.0004 }), row({ shotId: 'S10', receiverX: 2.5 })];
    const m = buildMatrix(rows, (r) => r.shotId, (r) => r.receiverX);
    expect(m.shots).toEqual(['S2', 'S10']);
    expect(m.receivers).toEqual([0, 2.5, 5]);
    expect(m.cells[0]![0]).toBe(rows[1]);
    expect(m.cells[0]![1]).toBeNull();
    expect(m.cells[0]![2]).toBe(rows[2]); // 5.0004 m is the same geophone as 5 m (matched to the millimetre)
    expect(m.cells[1]![1]).toBe(rows[3]);
  });
});

describe('compareResiduals', () => {
  it('with the same picks, the change in residual is computed time A − computed time B', () => {
    const a = [row({ shotId: 'S1', receiverX: 0, observedMs: 10, computedMs: 9.5 }), row({ shotId: 'S1', receiverX: 2.5, observedMs: 12, computedMs: 12.4 })];
    const b = [row({ shotId: 'S1', receiverX: 0, observedMs: 10, computedMs: 9.9 }), row({ shotId: 'S1', receiverX: 2.5, observedMs: 12, computedMs: 12.1 })];
    const c = compareResiduals(a, b);
    expect(c.matched).toHaveLength(2);
    for (const m of c.matched) expect(m.diffMs).toBeCloseTo(m.a.computedMs - m.b.computedMs, 12);
    expect(c.onlyA).toBe(0);
    expect(c.onlyB).toBe(0);
  });

  it('measures which run is closer to the pick by the size of the residual, not its sign (issue 17 item 7)', () => {
    // A: −0.5 ms (pick earlier than computed); B: +0.2 ms. B is closer (0.2 < 0.5) though B − A = +0.7 ms.
    const a = [row({ shotId: 'S1', receiverX: 0, observedMs: 10, computedMs: 10.5 })];
    const b = [row({ shotId: 'S1', receiverX: 0, observedMs: 10, computedMs: 9.8 })];
    const [m] = compareResiduals(a, b).matched;
    expect(m!.diffMs).toBeCloseTo(0.7, 12);
    expect(m!.fitChangeMs).toBeCloseTo(-0.3, 12);
  });

  it('pairs by shot and receiver position and counts the picks only one run has', () => {
    const a = [row({ shotId: 'S1', receiverX: 0 }), row({ shotId: 'S1', receiverX: 5 })];
    const b = [row({ shotId: 'S1', receiverX: 5 }), row({ shotId: 'S2', receiverX: 5 })];
    const c = compareResiduals(a, b);
    expect(c.matched.map((m) => `${m.shotId}@${m.receiverX}`)).toEqual(['S1@5']);
    expect(c.onlyA).toBe(1);
    expect(c.onlyB).toBe(1);
  });
});

describe('rmsMs', () => {
  it('is the root mean square, and NaN (not 0) for no values', () => {
    expect(rmsMs([3, -4])).toBeCloseTo(Math.sqrt(12.5), 12);
    expect(rmsMs([])).toBeNaN();
  });
});

describe('compareSentence', () => {
  it('names the better run and by how much', () => {
    expect(compareSentence(0.61, 0.51)).toBe('Run B fits the picks better: its RMS misfit is 0.10 ms lower (16 % less).');
    expect(compareSentence(0.51, 0.61)).toMatch(/^Run A fits the picks better/);
  });

  it('calls a difference under a hundredth of a millisecond a tie, and never prints NaN', () => {
    expect(compareSentence(0.512, 0.515)).toMatch(/equally well/);
    expect(compareSentence(Number.NaN, 0.5)).not.toMatch(/NaN/);
  });
});

describe('comparisonHeadline', () => {
  it('names no winner when the runs fit different pick sets', () => {
    expect(comparisonHeadline(0.5, 4.8, false)).toMatch(/do not rank/);
    expect(comparisonHeadline(0.5, 4.8, true)).toMatch(/^Run A fits the picks better/);
  });
});
