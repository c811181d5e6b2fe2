/**
 * CSV exports of a section (issue 19 item 2 and 3): plain comma-separated text with a '#' header that
 * says what, where and the cautions, metres and m/s throughout, one header row of column names.
 */
import { nodeX, nodeZ } from '../grid';
import { doiBetweenColumns } from '../model/resolved-iso-depth';
import { mapPositionAt } from './along-line';
import { depthToRock, rockDepthAt, rockTies, surfaceName, type RockSurface } from './depth-to-rock';
import { EXCAVATABILITY_CAUTION, type ExcavatabilityClass } from './excavatability';
import type { ExportSection } from './section';

export const INTERPRETATION_CAUTION =
  'Interpretations of seismic refraction data are non-unique. Calibrate them against boreholes or trial pits, have them reviewed by a qualified professional, and follow the local codes that govern their use.';

const cell = (v: number | null | undefined, digits: number): string => (v === null || v === undefined || !Number.isFinite(v) ? '' : v.toFixed(digits));
const text = (s: string): string => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

function preamble(section: ExportSection, what: string): string[] {
  const t = section.title;
  return [
    `# Timefield ${what}`,
    `# project: ${t.project}; line: ${t.line}; section: ${t.what}; exported ${t.date}`,
    `# coordinates: chainage along the line and elevation in metres${t.crs ? `; easting/northing in ${t.crs}` : '; no coordinate reference system set, easting/northing empty'}`,
    `# ${INTERPRETATION_CAUTION}`,
  ];
}

/** Every ground node: chainage, easting, northing, elevation, velocity, ray coverage and whether it lies above the depth of investigation. */
export function sectionCsv(section: ExportSection): string {
  const { grid, velocity, coverage, doi } = section;
  const lines = preamble(section, 'gridded velocity section');
  if (!coverage) lines.push('# this section has no ray coverage (a model built by hand or a forward run): coverage_m and inside_doi are empty');
  lines.push('chainage_m,easting_m,northing_m,elevation_m,velocity_m_s,coverage_m,inside_doi');
  const maps = Array.from({ length: grid.nx }, (_, ix) => mapPositionAt(section.stations, nodeX(grid, ix)));
  for (let iz = 0; iz < grid.nz; iz++) {
    const z = nodeZ(grid, iz);
    for (let ix = 0; ix < grid.nx; ix++) {
      const i = iz * grid.nx + ix;
      if (!Number.isFinite(velocity[i])) continue;
      const d = doi ? doiBetweenColumns(grid, doi, nodeX(grid, ix)) : Number.NaN;
      const inside = doi ? (Number.isFinite(d) && z >= d - 1e-9 ? '1' : '0') : '';
      lines.push([cell(nodeX(grid, ix), 3), cell(maps[ix]?.[0], 3), cell(maps[ix]?.[1], 3), cell(z, 3), cell(velocity[i], 0), coverage ? cell(coverage[i], 2) : '', inside].join(','));
    }
  }
  return lines.join('\n') + '\n';
}

/** Per station: position, ground, the rock surface's depth and elevation, and the depth to each excavatability class. */
export function depthToRockCsv(section: ExportSection, surface: RockSurface, classes: readonly ExcavatabilityClass[] | null): string {
  const lines = preamble(section, 'depth-to-rock table');
  lines.push(`# rock surface: ${surfaceName(section, surface)}`);
  const bands = (classes ?? []).filter((c) => c.from > 0);
  if (bands.length) lines.push(`# excavatability: depth to the velocity at which each class begins. ${EXCAVATABILITY_CAUTION}`);
  // A layered model's other interfaces too, each by its layer's name.
  const others = section.interfaces.map((f, index) => ({ f, index })).filter(({ index }) => !(surface.kind === 'interface' && surface.index === index));
  const header = [
    'station', 'chainage_m', 'easting_m', 'northing_m', 'ground_elevation_m', 'rock_depth_m', 'rock_elevation_m', 'note',
    ...others.map(({ f }) => text(`base_of_${f.name.replace(/\s+/g, '_')}_depth_m`)),
    ...bands.map((b) => text(`depth_to_${b.from}_m_s_${b.name.replace(/\s+/g, '_')}_m`)),
  ];
  lines.push(header.join(','));
  for (const r of depthToRock(section, surface)) {
    const interfaceDepths = others.map(({ index }) => cell(rockDepthAt(section, { kind: 'interface', index }, r.x).depth, 2));
    const classDepths = bands.map((b) => cell(rockDepthAt(section, { kind: 'iso', velocity: b.from }, r.x).depth, 2));
    lines.push([text(String(r.station)), cell(r.x, 3), cell(r.easting, 3), cell(r.northing, 3), cell(r.groundZ, 3), cell(r.depth, 2), cell(r.elevation, 3), text(r.note), ...interfaceDepths, ...classDepths].join(','));
  }
  // Ties to the logs after the table, as comments so the table reads as one block.
  for (const t of rockTies(section, surface)) {
    lines.push(`# tie at ${t.hole} (x ${t.x} m): ${t.material} logged at ${t.logged} m, interpreted ${t.interpreted === null ? 'not resolved' : `${t.interpreted.toFixed(2)} m, difference ${t.difference! > 0 ? '+' : ''}${t.difference!.toFixed(2)} m`}`);
  }
  return lines.join('\n') + '\n';
}
