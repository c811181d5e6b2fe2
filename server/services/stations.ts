import { dataSource } from '../db/dataSource';
import { Station } from '../entities';
import type { Station as StationRow } from '../../shared/schemas/stations';
import { audit } from './audit';

/** A stored station as the API shows it: easting and northing only where the line has coordinates. */
export const stationView = ({ station, x, z, easting, northing }: Pick<Station, 'station' | 'x' | 'z' | 'easting' | 'northing'>): StationRow =>
  easting === null || northing === null ? { station, x, z } : { station, x, z, easting, northing };

export async function listStations(lineId: string): Promise<StationRow[]> {
  const rows = await dataSource.getRepository(Station).find({ where: { lineId }, order: { x: 'ASC' } });
  return rows.map(stationView);
}

/** An earlier station table of a line, as GET /api/lines/:lineId/stations/revisions lists it. */
export interface StationRevisionSummary {
  number: number;
  stations: number;
  replacedAt: string;
  replacedBy: { id: string; name: string } | null;
}

/**
 * Replaces the line's station table in one transaction (already validated). The table it replaces,
 * when there was one, is kept as the line's next station revision, so nothing is lost.
 */
export async function replaceStations(actorId: string, projectId: string, lineId: string, stations: StationRow[], restoredFrom: number | null = null): Promise<void> {
  await dataSource.transaction(async (em) => {
    // One save of a line's stations at a time, so two saves cannot take the same revision number.
    await em.query(`SELECT 1 FROM survey_lines WHERE id = $1 FOR UPDATE`, [lineId]);
    const previous = await em.getRepository(Station).find({ where: { lineId }, order: { x: 'ASC' } });
    let kept: number | null = null;
    // A save that changes nothing keeps no copy of what it did not change.
    const same =
      previous.length === stations.length &&
      previous.every((p, i) => p.station === stations[i].station && p.x === stations[i].x && p.z === stations[i].z && p.easting === (stations[i].easting ?? null) && p.northing === (stations[i].northing ?? null));
    if (previous.length && !same) {
      const [{ next }] = await em.query(`SELECT coalesce(max(number), 0) + 1 AS next FROM station_revisions WHERE line_id = $1`, [lineId]);
      kept = Number(next);
      await em.query(`INSERT INTO station_revisions (line_id, number, stations, station_count, replaced_by) VALUES ($1, $2, $3, $4, $5)`, [
        lineId, kept, JSON.stringify(previous.map(stationView)), previous.length, actorId,
      ]);
    }
    await em.delete(Station, { lineId });
    if (stations.length) await em.insert(Station, stations.map((s) => ({ lineId, ...s, easting: s.easting ?? null, northing: s.northing ?? null })));
    await audit(em, {
      actorId,
      action: restoredFrom === null ? 'line.stations.replace' : 'line.stations.restore',
      objectType: 'survey_line',
      objectId: lineId,
      projectId,
      detail: { stations: stations.length, replaced: previous.length, keptAsRevision: kept, ...(restoredFrom === null ? {} : { restoredFrom }) },
    });
  });
}

export async function listStationRevisions(lineId: string): Promise<StationRevisionSummary[]> {
  const rows: { number: number; station_count: number; replaced_at: Date; user_id: string | null; user_name: string | null }[] = await dataSource.query(
    `SELECT r.number, r.station_count, r.replaced_at, u.id AS user_id, u.name AS user_name
       FROM station_revisions r LEFT JOIN users u ON u.id = r.replaced_by
      WHERE r.line_id = $1 ORDER BY r.number DESC`,
    [lineId],
  );
  return rows.map((r) => ({ number: r.number, stations: r.station_count, replacedAt: r.replaced_at.toISOString(), replacedBy: r.user_id ? { id: r.user_id, name: r.user_name ?? '' } : null }));
}

/** The stations of an earlier revision, or null when the line has no such revision. */
export async function stationRevision(lineId: string, number: number): Promise<StationRow[] | null> {
  const rows: { stations: StationRow[] }[] = await dataSource.query(`SELECT stations FROM station_revisions WHERE line_id = $1 AND number = $2`, [lineId, number]);
  return rows[0]?.stations ?? null;
}
