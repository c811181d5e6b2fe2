/**
 * A velocity section as the exports see it (issue 19): whatever made it (a model version, a forward
 * run's model, an inversion, a layer interpretation saved as a model), the same fields, so every
 * export format is written once.
 */
import type { Grid } from '../grid';
import { evalPolyline } from '../model/polyline';
import { rasteriseModel, type ModelFile } from '../model';

export interface ExportStation {
  station: number | string;
  x: number;
  z: number;
  easting?: number;
  northing?: number;
}

export interface ExportHole {
  name: string;
  kind: 'borehole' | 'trial_pit';
  x: number;
  /** Ground elevation at the hole (m); null when unknown (the hole is then left off the section). */
  groundZ: number | null;
  contacts: { depth: number; material: string; rockTop: boolean }[];
}

export interface ExportSection {
  /** Title-block facts. */
  title: { project: string; line: string; what: string; date: string; crs: string | null };
  grid: Grid;
  /** m/s per node (iz outer), NaN in the air. */
  velocity: Float32Array;
  /** Summed ray length per node (m); null when the section has no coverage (a hand-built model). */
  coverage: Float32Array | null;
  /** Less ray than this (m) and a node is poorly covered. */
  coverageThreshold: number;
  /** Depth-of-investigation elevation per grid column (m), NaN where no ray passes; null without rays. */
  doi: Float64Array | null;
  /** Ground surface vertices (x, z), x increasing. */
  surface: [number, number][];
  /** Layer interfaces of a layered model, top down. */
  interfaces: { name: string; points: [number, number][] }[];
  stations: ExportStation[];
  shots: { id: string; x: number; z: number }[];
  holes: ExportHole[];
}

/** Ground surface of a grid without one: the top node row. */
const flatTop = (grid: Grid): [number, number][] => [[grid.x0, grid.z0], [grid.x0 + (grid.nx - 1) * grid.dx, grid.z0]];

/** A model file (layered or a raw grid) as a section without coverage. */
export function sectionOfModel(model: ModelFile, rest: Pick<ExportSection, 'title' | 'stations' | 'shots' | 'holes'>): ExportSection {
  const raster = rasteriseModel(model);
  const velocity = Float32Array.from(raster.velocity, (v, i) => (raster.active[i] ? v : Number.NaN));
  const surface = (model.surface as [number, number][] | undefined) ?? flatTop(raster.grid);
  const interfaces = (model.layers ?? []).flatMap((l, k) => (l.base ? [{ name: l.name ?? `layer ${k + 1}`, points: l.base as [number, number][] }] : []));
  return { ...rest, grid: raster.grid, velocity, coverage: null, coverageThreshold: 0, doi: null, surface, interfaces };
}

/** An inversion's section: velocities, ray coverage and the depth of investigation. */
export function sectionOfInversion(
  s: { grid: Grid; surface: [number, number][] | null; velocity: (number | null)[]; coverage: (number | null)[]; doi: (number | null)[] },
  coverageThreshold: number,
  rest: Pick<ExportSection, 'title' | 'stations' | 'shots' | 'holes'>,
): ExportSection {
  const nan = (v: number | null) => (v === null ? Number.NaN : v);
  return {
    ...rest,
    grid: s.grid,
    velocity: Float32Array.from(s.velocity, nan),
    coverage: Float32Array.from(s.coverage, nan),
    coverageThreshold,
    doi: Float64Array.from(s.doi, nan),
    surface: s.surface ?? flatTop(s.grid),
    interfaces: [],
  };
}

/** Ground elevation at x on the section's surface. */
export const groundAtX = (section: ExportSection, x: number): number => evalPolyline(section.surface, x);
