/**
 * The plan of a project (issue 19 item 1–2): every line through its stations in map coordinates,
 * with its shots and boreholes placed by chainage along it. Drawn as DXF in the project's grid
 * (easting, northing in metres) with a north arrow, a scale bar and a title block, or as GeoJSON.
 */
import Drawing from 'dxf-writer';
import { mapPositionAt } from './along-line';
import { INTERPRETATION_CAUTION } from './csv';
import { lineFeatures, type FeatureCollection, type ToLonLat } from './geojson';
import { mappedLines, planExtent, scaleBarLength, type Plan } from './plan-geometry';

export type { Plan, PlanLine } from './plan-geometry';

export const PLAN_LAYERS = {
  lines: 'TF_PLAN_LINES',
  stations: 'TF_PLAN_STATIONS',
  shots: 'TF_PLAN_SHOTS',
  holes: 'TF_PLAN_BOREHOLES',
  north: 'TF_PLAN_NORTH_ARROW',
  scale: 'TF_PLAN_SCALE_BAR',
  title: 'TF_PLAN_TITLE',
} as const;

export function planDxf(plan: Plan, date: string): string {
  const lines = mappedLines(plan);
  const d = new Drawing();
  d.setUnits('Meters');
  const L = PLAN_LAYERS;
  d.addLayer(L.lines, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.stations, Drawing.ACI.GREEN, 'CONTINUOUS');
  d.addLayer(L.shots, Drawing.ACI.RED, 'CONTINUOUS');
  d.addLayer(L.holes, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.north, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.scale, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.title, Drawing.ACI.WHITE, 'CONTINUOUS');
  const ext = lines.length ? planExtent(lines) : { e0: 0, e1: 100, n0: 0, n1: 100 };
  const size = Math.max(ext.e1 - ext.e0, ext.n1 - ext.n0, 10);
  const h = +(size / 120).toFixed(2);
  for (const line of lines) {
    const pts = line.stations.filter((s) => s.easting !== undefined).map((s) => [s.easting!, s.northing!] as [number, number]);
    d.setActiveLayer(L.lines).drawPolyline(pts);
    d.drawText(pts[0][0], pts[0][1] + 2 * h, 1.5 * h, 0, `Line ${line.name}`, 'left');
    d.setActiveLayer(L.stations);
    for (const s of line.stations) if (s.easting !== undefined) d.drawPoint(s.easting, s.northing!);
    const ends = [line.stations[0], line.stations[line.stations.length - 1]];
    for (const s of ends) if (s.easting !== undefined) d.drawText(s.easting, s.northing! - 1.5 * h, h, 0, String(s.station), 'center', 'top');
    d.setActiveLayer(L.shots);
    for (const s of line.shots) {
      const p = mapPositionAt(line.stations, s.x);
      if (p) {
        d.drawCircle(p[0], p[1], 0.4 * h);
        d.drawText(p[0] + 0.6 * h, p[1] + 0.6 * h, 0.8 * h, 0, s.id);
      }
    }
    d.setActiveLayer(L.holes);
    for (const hole of line.holes) {
      const p = mapPositionAt(line.stations, hole.x);
      if (p) {
        d.drawRect(p[0] - 0.5 * h, p[1] - 0.5 * h, p[0] + 0.5 * h, p[1] + 0.5 * h);
        d.drawText(p[0] + 0.8 * h, p[1] - 0.8 * h, h, 0, hole.name, 'left', 'top');
      }
    }
  }
  // North arrow (grid north) at the top right, a scale bar under the lines.
  const ax = ext.e1 + 6 * h, ay = ext.n1;
  d.setActiveLayer(L.north).drawPolyline([[ax - h, ay - 4 * h], [ax, ay], [ax + h, ay - 4 * h], [ax, ay - 3 * h]], true);
  d.drawText(ax, ay + h, 1.5 * h, 0, 'N', 'center', 'bottom');
  const bar = scaleBarLength(ext.e1 - ext.e0);
  const by = ext.n0 - 6 * h;
  d.setActiveLayer(L.scale).drawLine(ext.e0, by, ext.e0 + bar, by);
  d.drawLine(ext.e0, by - 0.5 * h, ext.e0, by + 0.5 * h).drawLine(ext.e0 + bar, by - 0.5 * h, ext.e0 + bar, by + 0.5 * h);
  d.drawText(ext.e0 + bar / 2, by + 0.8 * h, h, 0, `${bar} m`, 'center', 'bottom');
  const rows = [
    `${plan.project}: plan of the survey lines`,
    `Easting and northing in metres${plan.crs ? `, ${plan.crs}` : ''}; grid north up; exported ${date}`,
    ...(lines.length < plan.lines.length ? [`Not drawn (no station coordinates): ${plan.lines.filter((l) => !lines.includes(l)).map((l) => l.name).join(', ')}`] : []),
    INTERPRETATION_CAUTION,
  ];
  d.setActiveLayer(L.title);
  rows.forEach((r, i) => d.drawText(ext.e0, by - 4 * h - i * 1.8 * h, i === 0 ? 1.4 * h : h, 0, r));
  return d.toDxfString();
}

export function planGeoJson(plan: Plan, toLonLat: ToLonLat): FeatureCollection {
  return {
    type: 'FeatureCollection',
    features: mappedLines(plan).flatMap((l) => lineFeatures(l.name, l.stations, l.shots, l.holes, toLonLat)),
    title: `${plan.project}: survey lines, stations, shots and boreholes`,
    caution: INTERPRETATION_CAUTION,
  };
}
