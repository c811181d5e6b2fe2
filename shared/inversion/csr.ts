/**
 * Sparse matrix in compressed sparse row form on typed arrays: row r holds the entries
 * rowPtr[r] … rowPtr[r+1]−1 of `cols` (column index) and `vals`. The ray-length matrix of
 * tomography has a few hundred to a few thousand entries per row out of 10⁴–10⁶ columns.
 */
export class CsrMatrix {
  constructor(
    readonly rows: number,
    readonly columns: number,
    readonly rowPtr: Int32Array,
    readonly cols: Int32Array,
    readonly vals: Float32Array | Float64Array,
  ) {
    if (rowPtr.length !== rows + 1) throw new Error(`rowPtr must have rows + 1 = ${rows + 1} entries (got ${rowPtr.length})`);
    if (cols.length < rowPtr[rows] || vals.length < rowPtr[rows]) throw new Error('cols and vals must hold every entry rowPtr counts');
  }

  get nonZeros(): number {
    return this.rowPtr[this.rows];
  }

  /** out = A·x */
  multiply(x: Float64Array, out: Float64Array): Float64Array {
    const { rowPtr, cols, vals } = this;
    for (let r = 0; r < this.rows; r++) {
      let sum = 0;
      for (let k = rowPtr[r], end = rowPtr[r + 1]; k < end; k++) sum += vals[k] * x[cols[k]];
      out[r] = sum;
    }
    return out;
  }

  /** out += A·x */
  multiplyAdd(x: Float64Array, out: Float64Array): Float64Array {
    const { rowPtr, cols, vals } = this;
    for (let r = 0; r < this.rows; r++) {
      let sum = 0;
      for (let k = rowPtr[r], end = rowPtr[r + 1]; k < end; k++) sum += vals[k] * x[cols[k]];
      out[r] += sum;
    }
    return out;
  }

  /** Aᵀ as a matrix of its own (rows = this matrix's columns, columns ascending), in Float32. */
  transpose(): CsrMatrix {
    const { rowPtr, cols, vals } = this;
    const ptr = new Int32Array(this.columns + 1);
    const nnz = this.nonZeros;
    for (let k = 0; k < nnz; k++) ptr[cols[k] + 1]++;
    for (let j = 0; j < this.columns; j++) ptr[j + 1] += ptr[j];
    const next = ptr.slice(0, this.columns);
    const tCols = new Int32Array(nnz);
    const tVals = new Float32Array(nnz);
    for (let r = 0; r < this.rows; r++) {
      for (let k = rowPtr[r], end = rowPtr[r + 1]; k < end; k++) {
        const at = next[cols[k]]++;
        tCols[at] = r;
        tVals[at] = vals[k];
      }
    }
    return new CsrMatrix(this.columns, this.rows, ptr, tCols, tVals);
  }

  /** out += Aᵀ·y */
  multiplyTransposeAdd(y: Float64Array, out: Float64Array): Float64Array {
    const { rowPtr, cols, vals } = this;
    for (let r = 0; r < this.rows; r++) {
      const yr = y[r];
      if (yr === 0) continue;
      for (let k = rowPtr[r], end = rowPtr[r + 1]; k < end; k++) out[cols[k]] += vals[k] * yr;
    }
    return out;
  }

  /** Σ over rows of (rowWeight[r]·A[r, j])², per column j, added to out. */
  addColumnSquares(rowWeight: Float64Array, out: Float64Array): Float64Array {
    const { rowPtr, cols, vals } = this;
    for (let r = 0; r < this.rows; r++) {
      const w2 = rowWeight[r] * rowWeight[r];
      for (let k = rowPtr[r], end = rowPtr[r + 1]; k < end; k++) out[cols[k]] += w2 * vals[k] * vals[k];
    }
    return out;
  }
}
