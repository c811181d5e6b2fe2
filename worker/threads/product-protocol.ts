/** Shared-memory protocol between MatrixProductThread (matrix-products.ts) and its thread (product-thread.ts). */

/** Slots of the Int32 control array. */
export const CONTROL = { generation: 0, done: 1, command: 2, ready: 3, length: 4 } as const;

export const COMMAND = { stop: 0, load: 1, multiply: 2, transpose: 3 } as const;

/** One step's matrices and vectors, all on SharedArrayBuffers; the thread does rows from the splits on. */
export interface ProductBuffers {
  rows: number;
  columns: number;
  ptr: Int32Array;
  cols: Int32Array;
  vals: Float32Array;
  tPtr: Int32Array;
  tCols: Int32Array;
  tVals: Float32Array;
  /** Input of A·x (columns long) and of Aᵀ·u (rows long). */
  x: Float64Array;
  u: Float64Array;
  /** The thread's results, indexed like the full outputs. */
  rowsOut: Float64Array;
  colsOut: Float64Array;
  rowSplit: number;
  colSplit: number;
}
