/**
 * Shots for the live preview: the pick set's rows (ms, as the API sends them) turned into the
 * shared Pick type and placed on the rasterised draft with the same `placeShots` the solve
 * command uses, so empty elevations land on this model's ground surface exactly as they would
 * in a full solve.
 */
import { computeResiduals, residualStats, type ResidualInput } from '../../../shared/residuals';
import { msToS, sToMs } from '../../../shared/units';
import { groupPicksByShot, placeShots, formatPickError, type Pick, type PlacedShot } from '../../../shared/picks';
import type { RasterModel } from '../../../shared/model';
import type { PickRow } from '../../api/types';

export const pickFromRow = (r: PickRow): Pick => ({
  line: r.line,
  shotId: r.shotId,
  sourceX: r.sourceX,
  sourceZ: r.sourceZ,
  receiverX: r.receiverX,
  receiverZ: r.receiverZ,
  time: msToS(r.timeMs),
  sigma: msToS(r.sigmaMs),
});

export type PreviewShot = { ok: true; shot: PlacedShot } | { ok: false; message: string };

/** One shot placed on the model, or a sentence saying why it cannot be (off the grid, in the air). */
export function placePreviewShot(raster: RasterModel, picks: readonly Pick[], shotId: string): PreviewShot {
  const group = groupPicksByShot(picks.filter((p) => p.shotId === shotId));
  if (group.length === 0) return { ok: false, message: `Shot ${shotId} has no picks in this pick set.` };
  const placed = placeShots(raster, group, 5);
  if (!placed.ok) return { ok: false, message: `Shot ${shotId} does not fit this model: ${placed.errors.map(formatPickError).join('; ')}` };
  return { ok: true, shot: placed.shots[0] };
}

/** RMS of observed − computed (ms) over the shot's picks that are not excluded and were reached; null when none. */
export function shotMisfitMs(shot: PlacedShot, receiverTimes: Float64Array, excludedLines: ReadonlySet<number>): { rmsMs: number; count: number } | null {
  const inputs: ResidualInput[] = [];
  shot.picks.forEach((p, i) => {
    const computed = receiverTimes[i];
    if (excludedLines.has(p.line) || !Number.isFinite(computed)) return;
    inputs.push({ shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed, sigma: p.sigma });
  });
  const stats = residualStats(computeResiduals(inputs));
  return stats.rms === null ? null : { rmsMs: sToMs(stats.rms), count: stats.count };
}
