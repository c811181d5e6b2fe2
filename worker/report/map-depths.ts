/**
 * The depth-to-rock table in map coordinates (issue 19 item 3), after the iso-depth table of either
 * report when the stations carry eastings and northings: where to set out a borehole or an
 * excavation is read in the site's grid, not in chainage.
 */
import type { PageFlow } from './context';
import { caption } from './flow';
import { fixed, NONE } from './format';
import { drawTable } from './table';

export interface MapDepthRow {
  station: number | string;
  easting?: number;
  northing?: number;
  groundZ: number | null;
  depth: number | null;
  elevation: number | null;
}

export function drawMapDepthTable(ctx: PageFlow, rows: readonly MapDepthRow[], surface: string, crs: string | null | undefined): void {
  const located = rows.filter((r) => r.easting !== undefined && r.northing !== undefined);
  if (!located.length) return;
  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', `Depth to ${surface} at the stations in map coordinates${crs ? ` (${crs})` : ''}: easting, northing, ground elevation, depth below ground and elevation of the surface (m); a dash where the table before gives none.`);
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Station', width: 55 },
      { title: 'Easting (m)', width: 90, align: 'right' },
      { title: 'Northing (m)', width: 95, align: 'right' },
      { title: 'Ground elevation (m)', width: 85, align: 'right' },
      { title: 'Depth (m)', width: 65, align: 'right' },
      { title: 'Elevation (m)', width: 75, align: 'right' },
    ],
    rows: located.map((r) => [String(r.station), fixed(r.easting!, 2), fixed(r.northing!, 2), r.groundZ === null ? NONE : fixed(r.groundZ, 2), r.depth === null ? NONE : fixed(r.depth, 1), r.elevation === null ? NONE : fixed(r.elevation, 1)]),
  });
}
