import type { Station } from '../schemas/stations';
import { coordinateProblems } from '../geo/chainage';

/** A station-table problem; `row` is 1-based in the table, `line` the file line when read from CSV. */
export interface StationIssue {
  row: number;
  line?: number;
  column: 'station' | 'x' | 'z' | 'easting' | 'northing' | 'lon' | 'lat' | null;
  message: string;
}

/**
 * Rules across rows: x strictly increasing down the table, no station number twice; coordinates on
 * every row or none, and where they are given, a line that neither doubles back nor jumps and agrees
 * with the chainage (shared/geo/chainage.ts).
 */
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
  const located = stations.filter((s) => s.easting !== undefined).length;
  if (located > 0 && located < stations.length) {
    const row = stations.findIndex((s) => s.easting === undefined) + 1;
    issues.push({ row, column: 'easting', message: 'has no easting and northing while other stations have them: give coordinates for every station or for none' });
  } else if (located > 0 && !issues.length) {
    const points = stations.map((s) => ({ easting: s.easting!, northing: s.northing! }));
    for (const p of coordinateProblems(points, stations.map((s) => s.x))) issues.push({ row: p.index + 1, column: 'easting', message: p.message });
  }
  return issues;
}
