import { describe, expect, it } from 'vitest';
import { compareShotIds, filterResiduals, NO_FILTER, parseLimit, sortResiduals } from '../../../src/components/run/table/residualFilters';
import { row } from './fixtures';

// What the residual table promises (issue 6): filter by shot, receiver range and |residual| > k·σ.

const rows = [
  row({ pickIndex: 0, shotId: 'S1', receiverX: 0, residualMs: 0.4, sigmaMs: 0.5 }),
  row({ pickIndex: 1, shotId: 'S1', receiverX: 2.5, residualMs: -1.2, sigmaMs: 0.5 }),
  row({ pickIndex: 2, shotId: 'S2', receiverX: 5, residualMs: 1.0, sigmaMs: 0.5 }),
  row({ pickIndex: 3, shotId: 'S10', receiverX: 7.5, residualMs: 3, sigmaMs: 1, excluded: true }),
];

describe('filterResiduals', () => {
  it('keeps everything with no filter', () => {
    expect(filterResiduals(rows, NO_FILTER)).toHaveLength(4);
  });

  it('filters by shot and by an inclusive receiver range', () => {
    expect(filterResiduals(rows, { ...NO_FILTER, shotId: 'S1' }).map((r) => r.pickIndex)).toEqual([0, 1]);
    expect(filterResiduals(rows, { ...NO_FILTER, xMin: 2.5, xMax: 5 }).map((r) => r.pickIndex)).toEqual([1, 2]);
  });

  it('keeps only |residual| strictly greater than k·σ, whatever the sign', () => {
    // k = 2: limits 1.0, 1.0, 1.0, 2.0 ms → only −1.2 and 3 (excluded) pass; 1.0 is not greater than 1.0
    expect(filterResiduals(rows, { ...NO_FILTER, k: 2 }).map((r) => r.pickIndex)).toEqual([1, 3]);
    expect(filterResiduals(rows, { ...NO_FILTER, k: 2, includeExcluded: false }).map((r) => r.pickIndex)).toEqual([1]);
  });
});

describe('sortResiduals', () => {
  it('sorts shot ids as people read them (S2 before S10)', () => {
    expect(sortResiduals(rows, 'shotId', 'asc').map((r) => r.shotId)).toEqual(['S1', 'S1', 'S2', 'S10']);
    expect(compareShotIds('S2', 'S10')).toBeLessThan(0);
  });

  it('sorts by |residual| and by signed residual in either direction without touching the input', () => {
    const copy = [...rows];
    expect(sortResiduals(rows, 'absResidual', 'desc').map((r) => r.pickIndex)).toEqual([3, 1, 2, 0]);
    expect(sortResiduals(rows, 'residualMs', 'asc').map((r) => r.pickIndex)).toEqual([1, 0, 2, 3]);
    expect(rows).toEqual(copy);
  });

  it('breaks ties by shot then receiver, so equal values keep a steady order', () => {
    const tied = [row({ pickIndex: 5, shotId: 'S2', receiverX: 1 }), row({ pickIndex: 4, shotId: 'S1', receiverX: 9 }), row({ pickIndex: 3, shotId: 'S1', receiverX: 1 })];
    expect(sortResiduals(tied, 'sigmaMs', 'desc').map((r) => r.pickIndex)).toEqual([3, 4, 5]);
  });
});

describe('parseLimit', () => {
  it('reads numbers, treats blank as no limit, and flags anything else', () => {
    expect(parseLimit(' 12.5 ')).toEqual({ value: 12.5, ok: true });
    expect(parseLimit('')).toEqual({ value: null, ok: true });
    expect(parseLimit('abc')).toEqual({ value: null, ok: false });
    expect(parseLimit('Infinity')).toEqual({ value: null, ok: false });
  });
});
