/**
 * Moving a layered model onto a new grid: the surface and every base are cut or extended to the
 * new x range (FORMATS.md §1 wants them to cover the grid), and painted cells are resampled by
 * position: each new node takes the paint of the old node nearest to it, so a painted block keeps
 * its place and size whether the new spacing is finer or coarser. A raw velocity grid cannot be
 * moved this way (its values are tied to its nodes).
 */
import type { Grid } from '../../grid';
import type { ModelEdit, ModelFile } from '../../schemas/model';
import { fitPolylineToRange, type Point } from './polyline-edit';

export type RegridResult = { ok: true; model: ModelFile; editsBefore: number; editsAfter: number } | { ok: false; message: string };

export function regridModel(model: ModelFile, grid: Grid): RegridResult {
  if (model.velocity) return { ok: false, message: 'This model is a raw velocity grid: its values belong to its nodes, so its grid cannot be changed here.' };
  const xEnd = grid.x0 + (grid.nx - 1) * grid.dx;
  const fit = (p: Point[]) => fitPolylineToRange(p, grid.x0, xEnd);
  const edits = resampleEdits(model.edits ?? [], model.grid, grid);
  return {
    ok: true,
    model: {
      ...model,
      grid: { ...grid },
      ...(model.surface ? { surface: fit(model.surface as Point[]) } : {}),
      ...(model.layers ? { layers: model.layers.map((l) => (l.base ? { ...l, base: fit(l.base as Point[]) } : { ...l })) } : {}),
      edits,
    },
    editsBefore: model.edits?.length ?? 0,
    editsAfter: edits.length,
  };
}

/** Nearest-node resampling of painted cells from grid `from` to grid `to`. */
export function resampleEdits(edits: readonly ModelEdit[], from: Grid, to: Grid): ModelEdit[] {
  if (edits.length === 0) return [];
  const painted = new Map<number, number>();
  let xLo = Infinity, xHi = -Infinity, zLo = Infinity, zHi = -Infinity;
  for (const e of edits) {
    painted.set(e.iz * from.nx + e.ix, e.v);
    const x = from.x0 + e.ix * from.dx;
    const z = from.z0 - e.iz * from.dz;
    xLo = Math.min(xLo, x - from.dx / 2);
    xHi = Math.max(xHi, x + from.dx / 2);
    zLo = Math.min(zLo, z - from.dz / 2);
    zHi = Math.max(zHi, z + from.dz / 2);
  }
  const out: ModelEdit[] = [];
  // Only the new nodes inside the painted cells' bounding box can take paint.
  const ixLo = Math.max(0, Math.floor((xLo - to.x0) / to.dx));
  const ixHi = Math.min(to.nx - 1, Math.ceil((xHi - to.x0) / to.dx));
  const izLo = Math.max(0, Math.floor((to.z0 - zHi) / to.dz));
  const izHi = Math.min(to.nz - 1, Math.ceil((to.z0 - zLo) / to.dz));
  for (let iz = izLo; iz <= izHi; iz++) {
    const oz = Math.round((from.z0 - (to.z0 - iz * to.dz)) / from.dz);
    if (oz < 0 || oz >= from.nz) continue;
    for (let ix = ixLo; ix <= ixHi; ix++) {
      const ox = Math.round((to.x0 + ix * to.dx - from.x0) / from.dx);
      if (ox < 0 || ox >= from.nx) continue;
      const v = painted.get(oz * from.nx + ox);
      if (v !== undefined) out.push({ ix, iz, v });
    }
  }
  return out;
}
