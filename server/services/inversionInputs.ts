/**
 * The picks and model an inversion works on: the grid and ground surface it records, the picks of
 * its pick-set revision placed on them, and the rules that must hold before anything is queued
 * (enough picks from enough shots for the grid, shared/inversion/problem.ts; grid within
 * MAX_GRID_NODES; every source and receiver inside the grid and in the ground). Used by the API
 * before queuing and by the worker before inverting.
 */
import type { Grid } from '../../shared/grid';
import { inversionDataProblems } from '../../shared/inversion/problem';
import { MAX_GRID_NODES, MAX_SHOTS_PER_RUN } from '../../shared/limits';
import { MODEL_FORMAT } from '../../shared/schemas/model';
import { rasteriseModel, type ModelFile, type RasterModel } from '../../shared/model';
import { groupPicksByShot, placeShots, type PlacedShot } from '../../shared/picks';
import { HttpError } from '../http/errors';
import type { StoredPick } from './pickSets';

/** 422 unless the grid is within the node limit; `path` names the body field that chose it. */
export function checkGridSize(grid: Grid, path: string): void {
  const nodes = grid.nx * grid.nz;
  if (nodes > MAX_GRID_NODES) {
    const message = `the grid would have ${nodes.toLocaleString('en-GB')} nodes (${grid.nx} × ${grid.nz}); the limit is ${MAX_GRID_NODES.toLocaleString('en-GB')}`;
    throw new HttpError(422, 'grid_too_large', `${path}: ${message}.`, [{ path, message }]);
  }
}

/**
 * Ground and air of a gradient start's grid: the recorded surface rasterised (the velocities are
 * replaced by the fitted gradient; one layer only decides which nodes are ground).
 */
export function surfaceRaster(grid: Grid, surface: [number, number][] | null): RasterModel {
  const model: ModelFile = { format: MODEL_FORMAT, grid: { ...grid }, ...(surface ? { surface } : {}), layers: [{ name: 'ground', v_top: 1000, v_base: 1000 }] };
  return rasteriseModel(model);
}

export interface PlacedPicks {
  /** Shots of the picks that count (not excluded), placed on the grid. */
  shots: PlacedShot[];
  /** Excluded picks that lie on the grid, by shot: the result shows their residuals too. */
  excludedShots: PlacedShot[];
  picks: number;
}

/**
 * The revision's picks on the raster, or the API error for the first rule they break. Rules on
 * counts name `pickSetRevision` when exclusions took picks away, else `pickSetId`; the rule on picks
 * per grid node names `gridPath`, the body field that chose the grid.
 */
export function placeInversionPicks(raster: RasterModel, picks: readonly StoredPick[], excludedIndices: readonly number[], gridPath = 'start'): PlacedPicks {
  const excluded = new Set(excludedIndices);
  const used = picks.filter((p) => !excluded.has(p.index));
  const byShot = groupPicksByShot(used).map((s) => ({ shotId: s.shotId, times: s.picks.map((p) => p.time) }));
  const dropped = picks.length - used.length;
  const countPath = dropped ? 'pickSetRevision' : 'pickSetId';
  const counts = inversionDataProblems(byShot, 0).map((message) => ({ path: countPath, message: dropped ? `${message}; this revision excludes ${dropped}` : message }));
  let ground = 0;
  for (let i = 0; i < raster.active.length; i++) ground += raster.active[i];
  const issues = counts.length ? counts : inversionDataProblems(byShot, ground).map((message) => ({ path: gridPath, message }));
  if (issues.length) throw new HttpError(422, 'not_invertible', `${issues[0].path}: ${issues[0].message}.`, issues);
  const placed = placeShots(raster, groupPicksByShot(used));
  if (!placed.ok) {
    const first = placed.errors[0];
    throw new HttpError(
      409,
      'outside_model',
      `The inversion grid does not cover the pick set: line ${first.line} of the pick file, ${first.message}.`,
      placed.errors.map((e) => ({ line: e.line ?? undefined, column: e.column ?? undefined, message: e.message })),
    );
  }
  if (placed.shots.length > MAX_SHOTS_PER_RUN) {
    throw new HttpError(422, 'too_many_shots', `The pick set has ${placed.shots.length} shots; one inversion takes at most ${MAX_SHOTS_PER_RUN}. Split the picks into several pick sets (one per spread).`);
  }
  const rest = picks.filter((p) => excluded.has(p.index));
  const restPlaced = rest.length ? placeShots(raster, groupPicksByShot(rest)) : { ok: true as const, shots: [] };
  return { shots: placed.shots, excludedShots: restPlaced.ok ? restPlaced.shots : [], picks: used.length };
}
