import { groupPicksByShot, placeShots, type PlacedShot } from '../../shared/picks';
import { rasteriseModel, type ModelFile, type RasterModel } from '../../shared/model';
import { MAX_GRID_NODES, MAX_SHOTS_PER_RUN } from '../../shared/limits';
import { HttpError } from '../http/errors';
import type { StoredPick } from './pickSets';

/** The index of a placed pick (placement keeps the stored pick objects). */
export const pickIndexOf = (p: PlacedShot['picks'][number]): number => (p as StoredPick).index;

export interface RunInputs {
  raster: RasterModel;
  shots: PlacedShot[];
  /** Pick indices excluded in the pick-set revision of the run. */
  excluded: Set<number>;
}

/**
 * The model rasterised and every shot placed on it, or a 409 that says which source or receiver
 * lies outside the grid or in the air. Used by the API before queuing and by the worker before solving.
 */
export function prepareRunInputs(model: ModelFile, picks: readonly StoredPick[], excludedIndices: readonly number[]): RunInputs {
  const nodes = model.grid.nx * model.grid.nz;
  if (nodes > MAX_GRID_NODES) {
    throw new HttpError(422, 'grid_too_large', `The model grid has ${nodes.toLocaleString('en-GB')} nodes; the limit is ${MAX_GRID_NODES.toLocaleString('en-GB')}.`);
  }
  const raster = rasteriseModel(model);
  // Stored picks are parsed picks plus their index; placement keeps the same objects.
  const placed = placeShots(raster, groupPicksByShot(picks));
  if (!placed.ok) {
    const first = placed.errors[0];
    throw new HttpError(
      409,
      'outside_model',
      `This model version does not cover the pick set: line ${first.line} of the pick file, ${first.message}.`,
      placed.errors.map((e) => ({ line: e.line ?? undefined, column: e.column ?? undefined, message: e.message })),
    );
  }
  if (placed.shots.length > MAX_SHOTS_PER_RUN) {
    throw new HttpError(422, 'too_many_shots', `The pick set has ${placed.shots.length} shots; one run solves at most ${MAX_SHOTS_PER_RUN}. Split the picks into several pick sets (one per spread) and run each.`);
  }
  return { raster, shots: placed.shots, excluded: new Set(excludedIndices) };
}
