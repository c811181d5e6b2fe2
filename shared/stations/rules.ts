import type { Station } from '../schemas/stations';

/** A station-table problem; `row` is 1-based in the table, `line` the file line when read from CSV. */
export interface StationIssue {
  row: number;
  line?: number;
  column: 'station' | 'x' | 'z' | null;
  message: string;
}

/** Rules across rows: x strictly increasing down the table, no station number twice. */
export function checkStationTable(stations: readonly Station[]): StationIssue[] {
  const issues: StationIssue[] = [];
  const seen = new Map<number, number>();
  stations.forEach((s, i) => {
    const row = i + 1;
    const first = seen.get(s.station);
    if (first !== undefined) issues.push({ row, column: 'station', message: `station ${s.station} already appears in row ${first}` });
    else seen.set(s.station, row);
    const prev = stations[i - 1];
    if (prev && !(s.x > prev.x)) issues.push({ row, column: 'x', message: `x must increase down the table (${s.x} m after ${prev.x} m)` });
  });
  return issues;
}
