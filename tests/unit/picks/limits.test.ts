/**
 * Issue 16 item 5: absurd numbers in a pick file (CSV) or a JSON pick set are refused with line
 * and column (CSV) or [row, column] (JSON). Ranges from shared/limits.ts: positions ±1e7 m,
 * elevations −12 000…+9 000 m (from memory), times 0–10 000 ms and sigmas 0.01–100 ms
 * (common practice, no source). The absurd values are those the issue reports as stored.
 */
import { describe, expect, it } from 'vitest';
import { formatPickError, parsePickText } from '../../../shared/picks';
import { pickSetSchema } from '../../../shared/schemas/picks';

const HEADER = 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms';
const GOOD = 'S1,0,,2,,5.8,0.5';
/** Parses a header, one good row (line 2) and `row` (line 3); returns the formatted errors. */
const errorsFor = (row: string): string[] => {
  const r = parsePickText(`${HEADER}\n${GOOD}\n${row}\n`);
  return r.ok ? [] : r.errors.map(formatPickError);
};

describe('pick file: plausible numbers, refused with line and column', () => {
  it.each([
    ['receiver_x −1e20', 'S1,0,,-1e20,,5.8,0.5', 'line 3, receiver_x: must be between -10,000,000 and 10,000,000 m (got -100000000000000000000)'],
    ['time_ms 1e308', 'S1,0,,4,,1e308,0.5', 'line 3, time_ms: must be between 0 and 10,000 ms (got 1e+308)'],
    ['sigma_ms 1e-321', 'S1,0,,4,,11.4,1e-321', 'line 3, sigma_ms: must be between 0.01 and 100 ms (got 1e-321)'],
    ['sigma_ms 101', 'S1,0,,4,,11.4,101', 'line 3, sigma_ms: must be between 0.01 and 100 ms (got 101)'],
    ['source_x 1e15', 'S2,1e15,,4,,11.4,', 'line 3, source_x: must be between -10,000,000 and 10,000,000 m (got 1000000000000000)'],
    ['receiver_z 1e308', 'S1,0,,4,1e308,11.4,', 'line 3, receiver_z: must be between -12,000 and 9,000 m (got 1e+308)'],
    ['source_z −20 000 m', 'S2,5,-20000,4,,11.4,', 'line 3, source_z: must be between -12,000 and 9,000 m (got -20000)'],
  ])('%s', (_name, row, message) => {
    expect(errorsFor(row)).toEqual([message]);
  });

  it('accepts the edges: 10 000 ms, 0.01 and 100 ms sigma, x = ±1e7 m, z = 9 000 m', () => {
    const r = parsePickText(`${HEADER}\nS1,0,,1e7,,10000,0.01\nS1,0,,-1e7,9000,20,100\n`);
    expect(r.ok).toBe(true);
  });
});

describe('JSON pick set: the same ranges, path [row, column]', () => {
  const row = (over: Record<string, unknown> = {}) => ({ shot_id: 'S1', source_x: 0, receiver_x: 5, time_ms: 6.7, ...over });
  it.each([
    ['receiver_x', -1e20],
    ['time_ms', 1e308],
    ['sigma_ms', 1e-321],
    ['receiver_z', 1e308],
  ])('%s = %s', (column, value) => {
    const r = pickSetSchema.safeParse([row(), row({ receiver_x: 10, [column]: value })]);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.path.join('.'))).toEqual([`1.${column}`]);
  });
});
