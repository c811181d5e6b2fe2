/**
 * A sensible first model for a survey line: the grid spans the stations and the shots within one
 * spread length of them, with a margin, and reaches about a quarter of the spread length below
 * the lowest station (a common rule of thumb for the depth a refraction spread sees; common
 * practice, no source). It holds two layers whose boundary follows the ground surface.
 */
import type { ModelFile } from '../../schemas/model';
import { MODEL_FORMAT } from '../../schemas/model';
import { evalPolyline } from '../polyline';
import { gridFromSpec, type GridSpec } from './grid-spec';
import { fitPolylineToRange, type Point } from './polyline-edit';

/** Spacings offered by default, finest first (m). */
export const NICE_SPACINGS = [0.1, 0.2, 0.25, 0.5, 1, 2, 2.5, 5, 10, 20, 25, 50];
/** The default spacing keeps the grid at most this many nodes along the line (a quick preview). */
const DEFAULT_MAX_NX = 400;

export interface LineGeometry {
  stations: readonly { x: number; z: number }[];
  /** Shot positions along the line (m), so the default grid reaches every source. */
  shotXs?: readonly number[];
}

/** Station positions as a ground-surface polyline: sorted by x, one point per x. */
export function stationSurface(stations: LineGeometry['stations']): Point[] {
  const sorted = stations.filter((s) => Number.isFinite(s.x) && Number.isFinite(s.z)).map((s) => [s.x, s.z] as Point).sort((a, b) => a[0] - b[0]);
  const out: Point[] = [];
  for (const p of sorted) if (!out.length || p[0] > out[out.length - 1][0]) out.push(p);
  return out;
}

const ceilTo = (v: number, step: number): number => Math.ceil(v / step - 1e-9) * step;
const floorTo = (v: number, step: number): number => Math.floor(v / step + 1e-9) * step;
const tidy = (v: number): number => +v.toFixed(6);

export function defaultGridSpec(geom: LineGeometry): GridSpec {
  const surface = stationSurface(geom.stations);
  const spreadOf = surface.length >= 2 ? surface[surface.length - 1][0] - surface[0][0] : 0;
  // Off-end shots up to one spread length beyond the stations are covered; farther ones would
  // stretch the grid for little gain (the preview says when a shot lies outside).
  const near = (x: number) => Number.isFinite(x) && (surface.length < 2 || (x >= surface[0][0] - spreadOf && x <= surface[surface.length - 1][0] + spreadOf));
  const xs = [...surface.map((p) => p[0]), ...(geom.shotXs ?? []).filter(near)];
  const zs = surface.map((p) => p[1]);
  const xMin = xs.length ? Math.min(...xs) : 0;
  const xMax = xs.length ? Math.max(...xs) : 100;
  const spread = surface.length >= 2 ? surface[surface.length - 1][0] - surface[0][0] : Math.max(xMax - xMin, 100);
  const length = Math.max(xMax - xMin, spread, 10);
  const margin = ceilTo(Math.max(5, 0.05 * length), 5);
  const xStartRaw = xMin - margin;
  const xEndRaw = xMax + margin;
  const spacing = NICE_SPACINGS.find((s) => (xEndRaw - xStartRaw) / s + 1 <= DEFAULT_MAX_NX) ?? NICE_SPACINGS[NICE_SPACINGS.length - 1];
  const zHigh = zs.length ? Math.max(...zs) : 100;
  const zLow = zs.length ? Math.min(...zs) : 100;
  const top = tidy(ceilTo(zHigh + spacing, spacing));
  const below = ceilTo(Math.max(spread / 4, 10), 5);
  return {
    xStart: tidy(floorTo(xStartRaw, spacing)),
    xEnd: tidy(ceilTo(xEndRaw, spacing)),
    top,
    depth: tidy(ceilTo(top - zLow + below, spacing)),
    spacing,
  };
}

/** The editor's starting model for a line with no model yet. */
export function defaultModel(geom: LineGeometry): ModelFile {
  const spec = defaultGridSpec(geom);
  const grid = gridFromSpec(spec);
  const xEnd = grid.x0 + (grid.nx - 1) * grid.dx;
  const stations = stationSurface(geom.stations);
  const raw: Point[] = stations.length >= 2 ? stations : [[grid.x0, spec.top - spec.spacing], [xEnd, spec.top - spec.spacing]];
  if (stations.length === 1) raw.forEach((p) => (p[1] = stations[0][1]));
  const surface = fitPolylineToRange(raw, grid.x0, xEnd);
  // First boundary about a fifth of the way down, parallel to the ground, on seven nodes.
  const drop = tidy(ceilTo((spec.depth - (spec.top - Math.min(...surface.map((p) => p[1])))) / 5, spec.spacing));
  const base: Point[] = [];
  for (let k = 0; k <= 6; k++) {
    const x = k === 6 ? xEnd : tidy(grid.x0 + ((xEnd - grid.x0) * k) / 6);
    base.push([x, tidy(evalPolyline(surface, x) - drop)]);
  }
  return {
    format: MODEL_FORMAT,
    grid: { ...grid },
    surface,
    layers: [
      { name: 'upper layer', base, v_top: 400, v_base: 800 },
      { name: 'lower layer', v_top: 2000, v_base: 2500 },
    ],
    edits: [],
  };
}
