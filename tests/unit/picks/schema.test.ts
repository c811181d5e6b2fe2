/** JSON pick sets (shared/schemas/picks.ts) follow the same rules as the CSV parser (FORMATS.md §2). */
import { describe, expect, it } from 'vitest';
import { pickSetSchema, toPicks } from '../../../shared/schemas/picks';

const row = (over: Record<string, unknown> = {}) => ({ shot_id: 'S1', source_x: 0, receiver_x: 5, time_ms: 6.7, ...over });

describe('pickSetSchema', () => {
  it('accepts a valid set and converts to SI with default sigma', () => {
    const r = pickSetSchema.safeParse([row(), row({ receiver_x: 10, time_ms: 13.3, sigma_ms: 0.5, receiver_z: 98.5 })]);
    expect(r.success).toBe(true);
    if (r.success) {
      expect(toPicks(r.data)).toEqual([
        { line: 1, shotId: 'S1', sourceX: 0, sourceZ: null, receiverX: 5, receiverZ: null, time: 0.0067, sigma: 0.001 },
        { line: 2, shotId: 'S1', sourceX: 0, sourceZ: null, receiverX: 10, receiverZ: 98.5, time: expect.closeTo(0.0133, 12), sigma: 0.0005 },
      ]);
    }
  });

  it('names row and column for each rule', () => {
    const r = pickSetSchema.safeParse([
      row(),
      row({ receiver_x: 5 }),
      row({ receiver_x: 7, source_x: 1 }),
      row({ receiver_x: 8, time_ms: 0 }),
      row({ receiver_x: 9, time_ms: -1 }),
      row({ receiver_x: 11, time_ms: 'abc' }),
    ]);
    expect(r.success).toBe(false);
    if (!r.success) {
      expect(r.error.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
        ['4.time_ms', 'time_ms is negative; a travel time must be > 0'],
        ['5.time_ms', 'time_ms must be a finite number'],
      ]);
    }
    // With the per-row errors fixed, the cross-row rules run.
    const r2 = pickSetSchema.safeParse([row(), row({ receiver_x: 5 }), row({ receiver_x: 7, source_x: 1 }), row({ receiver_x: 8, time_ms: 0 })]);
    expect(r2.success).toBe(false);
    if (!r2.success) {
      expect(r2.error.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
        ['1.receiver_x', 'shot S1 already has a pick at receiver_x = 5, receiver_z on the surface (row 1); duplicate pick'],
        ['2.source_x', 'shot S1 has source_x = 0 on row 1 but 1 here; all picks of a shot share one source position'],
        ['3.time_ms', 'time_ms is 0, which is allowed only for a pick at the source position itself'],
      ]);
    }
  });
});
