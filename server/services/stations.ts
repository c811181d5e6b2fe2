import { dataSource } from '../db/dataSource';
import { Station } from '../entities';
import type { Station as StationRow } from '../../shared/schemas/stations';
import { audit } from './audit';

export async function listStations(lineId: string): Promise<StationRow[]> {
  const rows = await dataSource.getRepository(Station).find({ where: { lineId }, order: { x: 'ASC' } });
  return rows.map(({ station, x, z }) => ({ station, x, z }));
}

/** Replaces the line's station table in one transaction (already validated). */
export async function replaceStations(actorId: string, projectId: string, lineId: string, stations: StationRow[]): Promise<void> {
  await dataSource.transaction(async (em) => {
    await em.delete(Station, { lineId });
    if (stations.length) await em.insert(Station, stations.map((s) => ({ lineId, ...s })));
    await audit(em, { actorId, action: 'line.stations.replace', objectType: 'survey_line', objectId: lineId, projectId, detail: { stations: stations.length } });
  });
}
