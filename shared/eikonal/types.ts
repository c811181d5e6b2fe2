/** A position in the model plane: x along the line (m), z elevation (m, up positive). */
export interface Point {
  x: number;
  z: number;
}

/** Options of the public solve. order 2 (default) is the mixed second-order scheme, 1 the first-order upwind one. */
export interface SolveOptions {
  order?: 1 | 2;
  /**
   * Slowness (s/m) of cells an interface crosses, index cz·(nx−1)+cx, NaN where unknown
   * (the layered rasteriser's RasterModel.cellSlowness, shared/model/cell-slowness.ts). Used on the cells the solver finds a
   * contrast in, in place of its own rule, which can only guess where between two node rows an
   * interface lies.
   */
  cellSlowness?: Float32Array | Float64Array;
  /**
   * The ground surface polyline (x increasing; the model's surface, RasterModel.surface). With it,
   * ground nodes near the source that see it through ground get exact straight-ray times
   * (surface-start.ts), so shots on sloping ground are not late along the surface.
   */
  surface?: readonly Point[];
}

/** Node velocities as either precision; solves always run in Float64. */
export type VelocityField = Float32Array | Float64Array;
