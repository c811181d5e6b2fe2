import { useMemo } from 'react';
import { evalPolyline } from '../../../shared/model/polyline';
import type { BinaryGrid } from '../../api/runs';
import type { PickSetShot, Station } from '../../api/types';
import { finiteRange } from '../run/section/velocityColours';
import type { InversionSectionScene } from './InversionSectionCanvas';
import { isoVelocityContours, isoVelocityLevels } from './velocityContours';

/** One colour range over both sides, so the same colour means the same velocity on each (null while either is missing). */
export function sharedRange(a: ArrayLike<number> | null, b: ArrayLike<number> | null): { min: number; max: number } | null {
  if (!a || !b) return null;
  const ra = finiteRange(a);
  const rb = finiteRange(b);
  if (!ra || !rb) return null;
  return { min: Math.min(ra.min, rb.min), max: Math.max(ra.max, rb.max) };
}

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
