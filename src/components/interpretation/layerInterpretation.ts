/**
 * The interpretation page's whole computation, pure: the pick set's kept picks placed on the chosen
 * model's ground (the same `placeShots` the commands use), the automatic refractor assignment, the
 * hand changes on top of it, and `interpretLayers` — the code `npm run layers` runs.
 */
import { inversionShots } from '../../../shared/inversion/problem';
import { assignRefractors, interpretLayers, LayerInputError, type Assignment, type LayerMethod, type LayerResult, type LayerShot } from '../../../shared/layers';
import { rasteriseModel, type ModelFile } from '../../../shared/model';
import { formatPickError, groupPicksByShot, placeShots, type PlacedShot } from '../../../shared/picks';
import type { PickRow } from '../../api/types';
import { pickFromRow } from '../model/previewShots';

export interface LayerSettings {
  method: LayerMethod;
  layers: 2 | 3;
  /** GRM only: a chosen XY (m); null = the optimum. */
  xy: number | null;
}

/** Hand changes: layer per pick, keyed by the pick's index in the pick set (−1 = left out). */
export type HandLayers = ReadonlyMap<number, number>;

export interface PlacedLine {
  placed: PlacedShot[];
  shots: LayerShot[];
  /** Pick-set index of each pick, per shot in pick order (to map hand changes onto the assignment). */
  indices: number[][];
  surfaceZ: (x: number) => number;
}

export type Placement = { ok: true; line: PlacedLine } | { ok: false; message: string };

export function placeLine(picks: readonly PickRow[], model: ModelFile): Placement {
  const kept = picks.filter((p) => !p.excluded);
  if (!kept.length) return { ok: false, message: 'Every pick of this revision is excluded.' };
  const raster = rasteriseModel(model);
  const byLine = new Map(kept.map((p) => [p.line, p.index]));
  const placement = placeShots(raster, groupPicksByShot(kept.map(pickFromRow)), 5);
  if (!placement.ok) return { ok: false, message: `The picks do not fit this model's grid and ground: ${placement.errors.map(formatPickError).join('; ')}` };
  const placed = placement.shots;
  return {
    ok: true,
    line: { placed, shots: inversionShots(placed), indices: placed.map((s) => s.picks.map((p) => byLine.get(p.line) ?? -1)), surfaceZ: raster.surfaceZ },
  };
}

export function automaticAssignment(line: PlacedLine, layers: 2 | 3): Assignment {
  return assignRefractors(line.shots, layers);
}

/** The automatic assignment with the hand changes laid over it (a change beyond the layer count is dropped). */
export function withHandChanges(automatic: Assignment, line: PlacedLine, hand: HandLayers, layers: number): Assignment {
  return automatic.map((a, s) => {
    const out = Int8Array.from(a);
    line.indices[s].forEach((index, i) => {
      const layer = hand.get(index);
      if (layer !== undefined && layer < layers) out[i] = layer;
    });
    return out;
  });
}

export type Interpretation = { ok: true; result: LayerResult } | { ok: false; message: string };

/**
 * The interpretation with the hand assignment, or (`assignment` null: no hand changes) with the
 * automatic one exactly as `npm run layers` makes it, velocities read on the curves reduced to a datum.
 */
export function interpret(line: PlacedLine, assignment: Assignment | null, settings: LayerSettings): Interpretation {
  try {
    const result = interpretLayers(line.shots, line.surfaceZ, { method: settings.method, layers: settings.layers, xy: settings.xy ?? undefined, assignment: assignment ?? undefined });
    if (!result.depths.length) return { ok: false, message: 'No geophone lies between reversed shots on the refractor, so no depth can be given.' };
    if (result.velocities.some((v) => !Number.isFinite(v))) return { ok: false, message: 'A layer velocity could not be found from these picks.' };
    return { ok: true, result };
  } catch (err) {
    if (err instanceof LayerInputError) return { ok: false, message: `${err.message[0].toUpperCase()}${err.message.slice(1)}.` };
    throw err;
  }
}

/** The layer table: velocity and depth range (m below ground) of each layer's base over the geophones. */
export interface LayerRow {
  layer: number;
  velocity: number;
  /** Depth of the layer's base below the ground, min–max over the geophones; null for the last layer. */
  baseDepth: { min: number; max: number } | null;
  /** Thickness min–max; null for the last layer. */
  thickness: { min: number; max: number } | null;
}

export function layerRows(result: LayerResult): LayerRow[] {
  return result.velocities.map((velocity, k) => {
    if (k === result.velocities.length - 1) return { layer: k + 1, velocity, baseDepth: null, thickness: null };
    const base = result.depths.filter((d) => d.refractor === k + 1);
    const above = new Map(result.depths.filter((d) => d.refractor === k).map((d) => [d.x, d.depth]));
    const thick = base.map((d) => d.depth - (k === 0 ? 0 : (above.get(d.x) ?? Number.NaN))).filter(Number.isFinite);
    const span = (v: number[]) => (v.length ? { min: Math.min(...v), max: Math.max(...v) } : null);
    return { layer: k + 1, velocity, baseDepth: span(base.map((d) => d.depth)), thickness: span(thick) };
  });
}
