import { useMemo } from 'react';
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
): InversionSectionScene | null {
  return useMemo(() => {
    if (!grid || !range) return null;
    return {
      grid: grid.grid,
      velocity: grid.values,
      range,
      mask: null,
      coverage: null,
      contours: showContours ? isoVelocityContours(grid.values, grid.grid, isoVelocityLevels(range.min, range.max)) : null,
      doi: [],
      surface,
      stations: stations.map((s) => ({ x: s.x, z: s.z })),
      shots: (shots ?? []).map((s) => ({ shotId: s.shotId, x: s.sourceX, z: s.sourceZ ?? (surface ? evalPolyline(surface, s.sourceX) : Number.NaN) })),
    };
  }, [grid, surface, stations, shots, range, showContours]);
}
