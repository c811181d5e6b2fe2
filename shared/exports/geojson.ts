/**
 * GeoJSON (RFC 7946, Butler et al. 2016): WGS 84 longitude, latitude in decimal degrees (section 4;
 * no "crs" member), seven decimals (about a centimetre; section 11.2 advises no more precision than
 * the data has). Lines, stations, shots, boreholes and the depth-to-rock points of a section.
 */
import { mapPositionAt } from './along-line';
import { depthToRock, surfaceName, type RockSurface } from './depth-to-rock';
import { INTERPRETATION_CAUTION } from './csv';
import type { ExportSection, ExportStation } from './section';

type Position = [number, number];
export interface Feature {
  type: 'Feature';
  geometry: { type: 'Point'; coordinates: Position } | { type: 'LineString'; coordinates: Position[] };
  properties: Record<string, string | number | boolean | null>;
}
export interface FeatureCollection {
  type: 'FeatureCollection';
  features: Feature[];
  [foreign: string]: unknown;
}

/** Easting, northing → [longitude, latitude] in WGS 84. */
export type ToLonLat = (easting: number, northing: number) => [number, number];

const round = ([lon, lat]: [number, number]): Position => [+lon.toFixed(7), +lat.toFixed(7)];
const point = (coordinates: Position, properties: Feature['properties']): Feature => ({ type: 'Feature', geometry: { type: 'Point', coordinates }, properties });

/** A line's own features: the line through its stations, each station, each shot and each hole placed by chainage. */
export function lineFeatures(line: string, stations: readonly ExportStation[], shots: readonly { id: string; x: number; z: number }[], holes: readonly { name: string; kind: string; x: number; groundZ: number | null }[], toLonLat: ToLonLat): Feature[] {
  const located = stations.filter((s) => s.easting !== undefined && s.northing !== undefined);
  if (located.length < 2) return [];
  const at = (x: number): Position | null => {
    const map = mapPositionAt(stations, x);
    return map ? round(toLonLat(map[0], map[1])) : null;
  };
  const features: Feature[] = [
    { type: 'Feature', geometry: { type: 'LineString', coordinates: located.map((s) => round(toLonLat(s.easting!, s.northing!))) }, properties: { kind: 'line', line } },
    ...located.map((s) => point(round(toLonLat(s.easting!, s.northing!)), { kind: 'station', line, station: String(s.station), chainage_m: s.x, elevation_m: s.z, easting_m: s.easting!, northing_m: s.northing! })),
  ];
  for (const s of shots) {
    const c = at(s.x);
    if (c) features.push(point(c, { kind: 'shot', line, shot: s.id, chainage_m: s.x, elevation_m: s.z }));
  }
  for (const h of holes) {
    const c = at(h.x);
    if (c) features.push(point(c, { kind: h.kind === 'trial_pit' ? 'trial pit' : 'borehole', line, name: h.name, chainage_m: h.x, ground_elevation_m: h.groundZ }));
  }
  return features;
}

/** A section's line features and its depth-to-rock point at every station. */
export function depthToRockGeoJson(section: ExportSection, surface: RockSurface, toLonLat: ToLonLat): FeatureCollection {
  const features = lineFeatures(section.title.line, section.stations, section.shots, section.holes, toLonLat);
  for (const r of depthToRock(section, surface)) {
    if (r.easting === null || r.northing === null) continue;
    features.push(point(round(toLonLat(r.easting, r.northing)), {
      kind: 'depth to rock',
      line: section.title.line,
      station: String(r.station),
      chainage_m: r.x,
      ground_elevation_m: +r.groundZ.toFixed(3),
      rock_depth_m: r.depth === null ? null : +r.depth.toFixed(2),
      rock_elevation_m: r.elevation === null ? null : +r.elevation.toFixed(3),
      note: r.note || null,
    }));
  }
  return {
    type: 'FeatureCollection',
    features,
    // Foreign members (RFC 7946 section 6.1): what the file is and the caution that goes with it.
    title: `${section.title.project}, line ${section.title.line}: ${section.title.what}; rock surface ${surfaceName(section, surface)}`,
    caution: INTERPRETATION_CAUTION,
  };
}
