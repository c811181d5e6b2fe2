/**
 * Issue 16 item 5: station tables with absurd numbers (x = 1e15, z = 1e308) are refused with
 * row and column (JSON) or line and column (CSV). Ranges from shared/limits.ts: x within ±1e7 m,
 * z within −12 000…+9 000 m (deepest ocean ≈ −11 000 m, highest summit ≈ 8 850 m; from memory).
 */
import { describe, expect, it } from 'vitest';
import { stationTableBody } from '../../../shared/schemas/stations';
import { parseStationCsv } from '../../../shared/stations';

describe('station table limits', () => {
  it('JSON: x = 1e15 and z = 1e308 are refused at [row, column]', () => {
    const r = stationTableBody.safeParse([{ station: 1, x: 0, z: 100 }, { station: 2, x: 1e15, z: 1e308 }]);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.path.join('.'))).toEqual(['1.x', '1.z']);
  });

  it('CSV: the same values are refused with line and column', () => {
    const r = parseStationCsv('station,x,z\n1,0,100\n# comment\n2,1e15,1e308\n');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues.map((i) => [i.line, i.column])).toEqual([[4, 'x'], [4, 'z']]);
      expect(r.issues[0].message).toBe('must be between -10,000,000 and 10,000,000 m (got 1000000000000000)');
    }
  });

  it('plausible values at the edges are accepted', () => {
    expect(stationTableBody.safeParse([{ station: 1, x: -1e7, z: -12_000 }, { station: 2, x: 1e7, z: 9_000 }]).success).toBe(true);
    expect(parseStationCsv('station,x,z\n1,-10000000,-12000\n2,10000000,9000\n').ok).toBe(true);
  });
});
