/**
 * A rasterised model as the solver threads receive it: SharedArrayBuffers, copied once per run
 * and viewed by every thread without a copy per shot.
 */
import type { Grid } from '../../shared/grid';
import type { Point } from '../../shared/eikonal';

export interface ModelArrays {
  velocity: Float32Array;
  active: Uint8Array;
  /** Layered models: slowness of the cells an interface crosses (RasterModel.cellSlowness). */
  cellSlowness?: Float32Array;
  /** Ground surface polyline (RasterModel.surface), for the solver's start region. */
  surface?: Point[];
}

export interface SharedModel {
  velocity: SharedArrayBuffer;
  active: SharedArrayBuffer;
  cellSlowness?: SharedArrayBuffer;
  /** Small: sent as a plain array with each task. */
  surface?: Point[];
}

export function shareModel(model: ModelArrays): SharedModel {
  const copy = (a: Float32Array | Uint8Array | Float64Array): SharedArrayBuffer => {
    const buf = new SharedArrayBuffer(a.byteLength);
    new Uint8Array(buf).set(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));
    return buf;
  };
  return {
    velocity: copy(model.velocity),
    active: copy(model.active),
    ...(model.cellSlowness ? { cellSlowness: copy(model.cellSlowness) } : {}),
    ...(model.surface ? { surface: model.surface } : {}),
  };
}

export function viewModel(grid: Grid, shared: SharedModel): ModelArrays {
  const n = grid.nx * grid.nz;
  return {
    velocity: new Float32Array(shared.velocity, 0, n),
    active: new Uint8Array(shared.active, 0, n),
    cellSlowness: shared.cellSlowness ? new Float32Array(shared.cellSlowness, 0, (grid.nx - 1) * (grid.nz - 1)) : undefined,
    surface: shared.surface,
  };
}
