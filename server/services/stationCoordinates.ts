import type { Station } from '../../shared/schemas/stations';
import type { LonLatToMap } from '../../shared/stations/csv';
import type { StationIssue } from '../../shared/stations';
import { dataSource } from '../db/dataSource';
import { crsByCode, CrsError, fromLonLat, insideArea, toLonLat, type CrsInfo } from '../geo/crs';

/** The project's coordinate reference system, or null when none is set. */
export async function projectCrs(projectId: string): Promise<CrsInfo | null> {
  const [row] = await dataSource.query(`SELECT crs_epsg FROM projects WHERE id = $1`, [projectId]);
  return row?.crs_epsg ? crsByCode(Number(row.crs_epsg)) : null;
}

/** GNSS longitude/latitude into the project's grid, refusing points outside the CRS's area of use. */
export function lonLatConverter(crs: CrsInfo | null): LonLatToMap | undefined {
  if (!crs) return undefined;
  return (lon, lat) => {
    if (!insideArea(crs, lon, lat)) return `${lon}, ${lat} lies outside the area of use of EPSG:${crs.code} (${crs.name})`;
    try {
      return fromLonLat(crs.code, lon, lat);
    } catch (e) {
      if (e instanceof CrsError) return e.message;
      throw e;
    }
  };
}

/** Stations whose easting/northing fall outside the project CRS's area of use (a wrong zone or a typo), each at its row. */
export function outsideAreaIssues(stations: readonly Station[], crs: CrsInfo | null): StationIssue[] {
  if (!crs || crs.noDatumShift) return [];
  const issues: StationIssue[] = [];
  stations.forEach((s, i) => {
    if (s.easting === undefined || s.northing === undefined || issues.length >= 20) return;
    const [lon, lat] = toLonLat(crs.code, s.easting, s.northing);
    if (!Number.isFinite(lon) || !Number.isFinite(lat) || !insideArea(crs, lon, lat)) {
      issues.push({ row: i + 1, column: 'easting', message: `easting ${s.easting}, northing ${s.northing} lies outside the area of use of EPSG:${crs.code} (${crs.name}): check the zone and the numbers` });
    }
  });
  return issues;
}
