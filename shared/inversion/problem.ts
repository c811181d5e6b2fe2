/**
 * From picks placed on a model to the inversion's shots, and the checks that refuse an inversion
 * that cannot work before any time is spent on it.
 */
import type { PlacedShot } from '../picks';
import type { InversionShot } from './types';

/** Fewest picks an inversion accepts. */
export const MIN_INVERSION_PICKS = 10;
/**
 * Most ground nodes per pick: beyond this the grid is far finer than the data can say anything
 * about (a 1000 × 200 grid wants at least 100 picks). Common practice, no source: the value keeps
 * every realistic survey and refuses a fine grid over a handful of picks.
 */
export const MAX_NODES_PER_PICK = 2000;

export function inversionShots(placed: readonly PlacedShot[]): InversionShot[] {
  return placed.map((shot) => ({
    shotId: shot.shotId,
    source: shot.source,
    receivers: shot.receivers,
    times: Float64Array.from(shot.picks, (p) => p.time),
    sigmas: Float64Array.from(shot.picks, (p) => p.sigma),
  }));
}

/** Sentences saying why these picks cannot be inverted on a grid with `groundNodes` unknowns; empty when they can. */
export function inversionDataProblems(shots: readonly { shotId: string; times: ArrayLike<number> }[], groundNodes: number): string[] {
  const picks = shots.reduce((n, s) => n + s.times.length, 0);
  const problems: string[] = [];
  if (picks < MIN_INVERSION_PICKS) problems.push(`an inversion needs at least ${MIN_INVERSION_PICKS} picks (there are ${picks})`);
  const withPicks = shots.filter((s) => s.times.length > 0);
  if (withPicks.length === 1) {
    problems.push(`all picks belong to shot ${withPicks[0].shotId}; an inversion needs picks from at least two shots (one shot cannot tell depth from velocity)`);
  }
  if (picks >= MIN_INVERSION_PICKS && groundNodes > MAX_NODES_PER_PICK * picks) {
    problems.push(`too few picks for the grid: ${groundNodes.toLocaleString('en-US')} ground nodes for ${picks} picks (at most ${MAX_NODES_PER_PICK} nodes per pick); use a coarser grid`);
  }
  return problems;
}
