/**
 * Adding and removing layers while keeping FORMATS.md §1's shape: layers top-down, every layer
 * but the last has a base, the last has none and reaches the grid bottom.
 */
import type { Grid } from '../../grid';
import type { ModelLayer } from '../../schemas/model';
import { gridBottom, gridRight, midline, type Point } from './polyline-edit';

/** Velocities are rounded to this step (m/s) when the editor proposes them. */
const V_STEP = 50;
const roundV = (v: number): number => Math.max(V_STEP, Math.round(v / V_STEP) * V_STEP);

function flat(grid: Grid, z: number): Point[] {
  return [
    [grid.x0, z],
    [gridRight(grid), z],
  ];
}

/** The interface on top of layer k: the ground surface (or the grid top) for the first layer. */
export function layerTop(layers: readonly ModelLayer[], k: number, grid: Grid, surface?: readonly Point[]): Point[] {
  if (k > 0) {
    const base = layers[k - 1].base;
    if (base) return base as Point[];
  }
  return surface ? (surface as Point[]) : flat(grid, grid.z0);
}

/**
 * A new layer just below layer k. Its top is layer k's base (or, below the last layer, half the
 * depth to the grid bottom); its velocities continue layer k's.
 */
export function addLayerBelow(layers: readonly ModelLayer[], k: number, grid: Grid, surface?: readonly Point[]): ModelLayer[] {
  if (k < 0 || k >= layers.length) return layers as ModelLayer[];
  const xEnd = gridRight(grid);
  const out = layers.map((l) => ({ ...l }));
  const upper = out[k];
  const isLast = k === layers.length - 1;
  if (isLast) {
    const top = layerTop(layers, k, grid, surface);
    upper.base = midline(top, flat(grid, gridBottom(grid)), grid.x0, xEnd);
    const fresh: ModelLayer = { name: freshName(layers), v_top: roundV(upper.v_base * 1.2), v_base: roundV(upper.v_base * 1.4) };
    out.push(fresh);
    return out;
  }
  const lowerBase = layers[k + 1].base ?? flat(grid, gridBottom(grid));
  const upperBase = upper.base ?? flat(grid, gridBottom(grid));
  const fresh: ModelLayer = {
    name: freshName(layers),
    base: midline(upperBase, lowerBase, grid.x0, xEnd),
    v_top: roundV((upper.v_base + layers[k + 1].v_top) / 2),
    v_base: roundV(layers[k + 1].v_top),
  };
  out.splice(k + 1, 0, fresh);
  return out;
}

/** A name for an added layer that says it is new and is not taken ("new layer", "new layer 2", …), whatever its place. */
function freshName(layers: readonly ModelLayer[]): string {
  const taken = new Set(layers.map((l) => l.name));
  for (let n = 1; ; n++) {
    const name = n === 1 ? 'new layer' : `new layer ${n}`;
    if (!taken.has(name)) return name;
  }
}

/** Remove layer k (at least one layer stays). Removing the last layer makes the one above it the last, without a base. */
export function removeLayer(layers: readonly ModelLayer[], k: number): ModelLayer[] {
  if (layers.length <= 1 || k < 0 || k >= layers.length) return layers as ModelLayer[];
  const out = layers.filter((_, i) => i !== k).map((l) => ({ ...l }));
  const last = out[out.length - 1];
  if (last.base) delete last.base;
  return out;
}

/** Replace some fields of layer k. */
export function updateLayer(layers: readonly ModelLayer[], k: number, patch: Partial<ModelLayer>): ModelLayer[] {
  if (k < 0 || k >= layers.length) return layers as ModelLayer[];
  return layers.map((l, i) => (i === k ? { ...l, ...patch } : l));
}
