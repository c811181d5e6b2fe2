/**
 * Putting a pick set onto a rasterised model: empty elevations go on the ground surface,
 * and every source and receiver must lie inside the grid and not in the air. Errors name
 * the pick's file line and column, like the parser's.
 */
import { insideGrid, nodeX, nodeZ } from '../grid';
import type { RasterModel } from '../model/rasterise';
import type { ShotPicks } from './group';
import type { Pick, PickError } from './types';

export interface PlacedShot {
  shotId: string;
  source: { x: number; z: number };
  picks: Pick[];
  /** Receiver positions actually used, interleaved x, z (m), one pair per pick. */
  receivers: Float64Array;
}

export type PlacementResult = { ok: true; shots: PlacedShot[] } | { ok: false; errors: PickError[] };

export function placeShots(model: RasterModel, shots: readonly ShotPicks[], maxErrors = 100): PlacementResult {
  const errors: PickError[] = [];
  const placed: PlacedShot[] = [];
  const { grid } = model;
  const eps = 1e-6 * grid.dz;
  // Rounded to the millimetre: x0 + (nx−1)·dx carries float noise (39.699999999999996).
  const mm = (v: number) => +v.toFixed(3);
  const where = `grid x ${mm(grid.x0)} to ${mm(nodeX(grid, grid.nx - 1))} m, z ${mm(nodeZ(grid, grid.nz - 1))} to ${mm(grid.z0)} m`;

  const check = (p: Pick, what: 'source' | 'receiver', x: number, z: number): void => {
    if (errors.length >= maxErrors) return;
    // Blame x when it is off the line, otherwise z.
    const column = insideGrid(grid, x, grid.z0) ? `${what}_z` : `${what}_x`;
    if (!insideGrid(grid, x, z)) {
      errors.push({ line: p.line, column, message: `${what} at x ${x} m, z ${z} m is outside the model (${where})` });
    } else if (z > model.surfaceZ(x) + eps) {
      errors.push({ line: p.line, column: `${what}_z`, message: `${what} at x ${x} m, z ${z} m is in the air, above the ground surface (z ${+model.surfaceZ(x).toFixed(3)} m)` });
    }
  };

  for (const shot of shots) {
    const first = shot.picks[0];
    const source = { x: shot.sourceX, z: shot.sourceZ ?? model.surfaceZ(shot.sourceX) };
    check(first, 'source', source.x, source.z);
    const receivers = new Float64Array(2 * shot.picks.length);
    shot.picks.forEach((p, i) => {
      const z = p.receiverZ ?? model.surfaceZ(p.receiverX);
      receivers[2 * i] = p.receiverX;
      receivers[2 * i + 1] = z;
      check(p, 'receiver', p.receiverX, z);
    });
    placed.push({ shotId: shot.shotId, source, picks: shot.picks, receivers });
  }
  return errors.length ? { ok: false, errors } : { ok: true, shots: placed };
}
