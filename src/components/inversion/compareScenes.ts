import { useMemo } from 'react';
import type { Grid } from '../../../shared/grid';
import { evalPolyline } from '../../../shared/model/polyline';
import type { BinaryGrid } from '../../api/runs';
import type { PickSetShot, Station } from '../../api/types';
import { finiteRange } from '../run/section/velocityColours';
import type { InversionSectionScene } from './InversionSectionCanvas';
import { isoVelocityContours, isoVelocityLevels } from './velocityContours';

type Range = { min: number; max: number };

/** One colour range over both sides (each side's own range: covered ground for an inversion), so the same colour means the same velocity on each; null while either is missing. */
export function sharedRange(a: Range | null, b: Range | null): Range | null {
  if (!a || !b) return null;
  return { min: Math.min(a.min, b.min), max: Math.max(a.max, b.max) };
}

/** A forward run's model has no coverage: all its ground counts. */
export const modelRange = (values: ArrayLike<number> | null): Range | null => (values ? finiteRange(values) : null);

/** A forward run's model drawn like an inversion section: no coverage mask and no depth of investigation, since no inversion made it. */
export function useModelScene(
  grid: BinaryGrid | undefined,
  surface: [number, number][] | null,
  stations: Station[],
  shots: PickSetShot[] | undefined,
  range: { min: number; max: number } | null,
  showContours: boolean,
  contourRange: { min: number; max: number } | null = range,
): InversionSectionScene | null {
  return useMemo(() => {
    if (!grid || !range) return null;
    const levels = contourRange ?? range;
    return {
      grid: grid.grid,
      velocity: grid.values,
      range,
      mask: null,
      coverage: null,
      contours: showContours ? isoVelocityContours(grid.values, grid.grid, isoVelocityLevels(levels.min, levels.max)) : null,
      doi: [],
      surface,
      stations: stations.map((s) => ({ x: s.x, z: s.z })),
      shots: (shots ?? []).map((s) => ({ shotId: s.shotId, x: s.sourceX, z: s.sourceZ ?? (surface ? evalPolyline(surface, s.sourceX) : Number.NaN) })),
    };
  }, [grid, surface, stations, shots, range, showContours, contourRange]);
}

/** Node-centre extent (m) shared by the two sides of a comparison. */
export interface Extent {
  xMin: number;
  xMax: number;
  zMin: number;
  zMax: number;
}

/** The smallest extent holding both grids. */
export function unionExtent(a: Grid, b: Grid): Extent {
  const right = (g: Grid) => g.x0 + (g.nx - 1) * g.dx;
  const bottom = (g: Grid) => g.z0 - (g.nz - 1) * g.dz;
  return { xMin: Math.min(a.x0, b.x0), xMax: Math.max(right(a), right(b)), zMin: Math.min(bottom(a), bottom(b)), zMax: Math.max(a.z0, b.z0) };
}

/**
 * A scene widened with empty nodes (NaN, unmasked) on its own spacing until it covers `extent`, so two
 * sections of different grids are drawn over the same stretch of line and depth, side by side.
 */
export function padScene(scene: InversionSectionScene, extent: Extent): InversionSectionScene {
  const g = scene.grid;
  const cells = (d: number, step: number) => Math.max(0, Math.ceil(d / step - 1e-9));
  const left = cells(g.x0 - extent.xMin, g.dx);
  const right = cells(extent.xMax - (g.x0 + (g.nx - 1) * g.dx), g.dx);
  const top = cells(extent.zMax - g.z0, g.dz);
  const bottom = cells(g.z0 - (g.nz - 1) * g.dz - extent.zMin, g.dz);
  if (left + right + top + bottom === 0) return scene;
  const grid: Grid = { x0: g.x0 - left * g.dx, dx: g.dx, nx: g.nx + left + right, z0: g.z0 + top * g.dz, dz: g.dz, nz: g.nz + top + bottom };
  const pad = <T extends Float32Array | Uint8Array>(values: T, make: (n: number) => T): T => {
    const out = make(grid.nx * grid.nz);
    for (let iz = 0; iz < g.nz; iz++) out.set(values.subarray(iz * g.nx, (iz + 1) * g.nx), (iz + top) * grid.nx + left);
    return out;
  };
  const nanArray = (n: number) => new Float32Array(n).fill(Number.NaN);
  return {
    ...scene,
    grid,
    velocity: pad(scene.velocity, nanArray),
    coverage: scene.coverage ? pad(scene.coverage, nanArray) : null,
    mask: scene.mask ? pad(scene.mask, (n) => new Uint8Array(n)) : null,
  };
}
