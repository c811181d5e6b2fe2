import { dataSource } from '../db/dataSource';
import type { Plan } from '../../shared/exports/plan';
import { listBoreholes } from './boreholes';
import { shotsOf } from './pickSetReads';
import { listStations } from './stations';
import { projectCrs } from './stationCoordinates';
import type { CrsInfo } from '../geo/crs';

/** Every line of the project with its stations, the shots of its newest pick set in use and its holes. */
export async function projectPlan(projectId: string): Promise<{ plan: Plan; crs: CrsInfo | null }> {
  const [project] = await dataSource.query(`SELECT name FROM projects WHERE id = $1`, [projectId]);
  const rows: { id: string; name: string }[] = await dataSource.query(`SELECT id, name FROM survey_lines WHERE project_id = $1 ORDER BY name`, [projectId]);
  const crs = await projectCrs(projectId);
  const lines = await Promise.all(
    rows.map(async (l) => {
      const [pickSet] = await dataSource.query(`SELECT id FROM pick_sets WHERE line_id = $1 AND retired_at IS NULL ORDER BY created_at DESC LIMIT 1`, [l.id]);
      const [stations, holes, shots] = await Promise.all([listStations(l.id), listBoreholes(l.id), pickSet ? shotsOf(pickSet.id) : Promise.resolve([])]);
      return {
        id: l.id,
        name: l.name,
        stations,
        shots: shots.map((s) => ({ id: s.shotId, x: s.sourceX, z: s.sourceZ ?? Number.NaN })),
        holes: holes.map((h) => ({ name: h.name, kind: h.kind, x: h.x, groundZ: h.groundZResolved })),
      };
    }),
  );
  return { plan: { project: project?.name ?? '', crs: crs ? `EPSG:${crs.code} ${crs.name}` : null, lines }, crs };
}
