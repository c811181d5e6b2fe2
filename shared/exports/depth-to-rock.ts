/**
 * The depth-to-rock table (issue 19 item 3): at every station, the depth and elevation of the
 * section's rock surface, read from the section itself — a layered model's interfaces (exactly as
 * drawn), or an iso-velocity v* (shared/model/iso-depth.ts; for an inversion only where the rays
 * resolve it) — and, at each borehole, the logged top of rock against it.
 */
import { evalPolyline } from '../model/polyline';
import { isoVelocityDepth } from '../model/iso-depth';
import { raySupport, resolvedIsoDepth, type RaySupport } from '../model/resolved-iso-depth';
import { mapPositionAt } from './along-line';
import type { ExportSection } from './section';

/** The surface whose depth is tabulated. */
export type RockSurface = { kind: 'interface'; index: number } | { kind: 'iso'; velocity: number };

export interface DepthRow {
  station: number | string;
  x: number;
  easting: number | null;
  northing: number | null;
  groundZ: number;
  /** Depth below ground (m) and elevation of the surface; null with the reason when there is none. */
  depth: number | null;
  elevation: number | null;
  note: string;
}

export interface TieRow {
  hole: string;
  x: number;
  logged: number;
  material: string;
  interpreted: number | null;
  /** interpreted − logged (m); null where the surface is not resolved at the hole. */
  difference: number | null;
}

export function surfaceName(section: ExportSection, surface: RockSurface): string {
  return surface.kind === 'iso' ? `the ${surface.velocity} m/s iso-velocity` : `the base of ${section.interfaces[surface.index]?.name ?? `layer ${surface.index + 1}`}`;
}

/** The default surface: the deepest interface of a layered model, else a 2500 m/s iso-velocity (a common weathered/sound rock threshold; common practice, no source). */
export function defaultRockSurface(section: ExportSection): RockSurface {
  return section.interfaces.length ? { kind: 'interface', index: section.interfaces.length - 1 } : { kind: 'iso', velocity: 2500 };
}

/** Depth of the surface at chainage x, or the reason there is none. */
export function rockDepthAt(section: ExportSection, surface: RockSurface, x: number): { depth: number | null; elevation: number | null; note: string } {
  const { grid } = section;
  const groundZ = evalPolyline(section.surface, x);
  const inside = x >= section.surface[0][0] && x <= section.surface[section.surface.length - 1][0];
  if (surface.kind === 'interface') {
    const line = section.interfaces[surface.index]?.points;
    if (!line || !inside || x < line[0][0] || x > line[line.length - 1][0]) return { depth: null, elevation: null, note: 'outside the section' };
    const z = Math.min(evalPolyline(line, x), groundZ);
    return { depth: groundZ - z, elevation: z, note: '' };
  }
  const support = supportOf(section);
  if (section.coverage && section.doi) {
    const r = resolvedIsoDepth(support, surface.velocity, x);
    if (r.status !== 'resolved') return { depth: null, elevation: null, note: r.status };
    return { depth: r.result!.depth, elevation: r.result!.elevation, note: '' };
  }
  if (!(x >= grid.x0 && x <= grid.x0 + (grid.nx - 1) * grid.dx)) return { depth: null, elevation: null, note: 'outside the section' };
  const r = isoVelocityDepth(support.raster, surface.velocity, x);
  return r.depth === null ? { depth: null, elevation: null, note: 'not reached within the section' } : { depth: r.depth, elevation: r.elevation, note: '' };
}

/** The air-filled raster and ray support of a section, built once per section (a table reads it at every station and class). */
const supports = new WeakMap<ExportSection, RaySupport>();
function supportOf(section: ExportSection): RaySupport {
  let support = supports.get(section);
  if (!support) {
    const surfaceZ = (at: number) => evalPolyline(section.surface, at);
    // Without rays only the raster is read (a model's iso-depths are not filtered by coverage).
    support = raySupport(section.grid, section.velocity, section.coverage ?? section.velocity, section.doi ?? new Float64Array(section.grid.nx), section.coverageThreshold, surfaceZ);
    supports.set(section, support);
  }
  return support;
}

/** One row per station. */
export function depthToRock(section: ExportSection, surface: RockSurface): DepthRow[] {
  return section.stations.map((s) => {
    const at = rockDepthAt(section, surface, s.x);
    const map = s.easting !== undefined ? [s.easting, s.northing!] : mapPositionAt(section.stations, s.x);
    return { station: s.station, x: s.x, easting: map?.[0] ?? null, northing: map?.[1] ?? null, groundZ: evalPolyline(section.surface, s.x), ...at };
  });
}

/** The logged top of rock of each hole (every contact where none is marked) against the surface. */
export function rockTies(section: ExportSection, surface: RockSurface): TieRow[] {
  return section.holes.flatMap((h) => {
    const marked = h.contacts.filter((c) => c.rockTop);
    const interpreted = rockDepthAt(section, surface, h.x).depth;
    return (marked.length ? marked : h.contacts).map((c) => ({
      hole: h.name,
      x: h.x,
      logged: c.depth,
      material: c.material,
      interpreted,
      difference: interpreted === null ? null : +(interpreted - c.depth).toFixed(3),
    }));
  });
}
