/**
 * A trace resampled onto screen rows: for each row the smallest, largest and central value of the
 * trace over the row's time span. Many samples per row keep their extremes (no lost spikes); fewer
 * samples than rows are interpolated linearly.
 */
export interface TraceRows {
  min: Float32Array;
  max: Float32Array;
  mid: Float32Array;
}

export interface RowWindow {
  /** Display time of the first row's top edge and the last row's bottom edge (ms). */
  t0: number;
  t1: number;
  rows: number;
}

/**
 * `shiftMs` is added to display time to reach record time (reduced-time display: the offset over the
 * reduction velocity). Rows outside the recorded span are NaN.
 */
export function traceRows(x: Float32Array, dtMs: number, delayMs: number, shiftMs: number, w: RowWindow, out?: TraceRows): TraceRows {
  const r = out ?? { min: new Float32Array(w.rows), max: new Float32Array(w.rows), mid: new Float32Array(w.rows) };
  const rowMs = (w.t1 - w.t0) / w.rows;
  const last = x.length - 1;
  const at = (s: number) => {
    const i = Math.floor(s);
    const f = s - i;
    return i >= last ? x[last] : x[i] + f * (x[i + 1] - x[i]);
  };
  for (let row = 0; row < w.rows; row++) {
    const top = (w.t0 + row * rowMs + shiftMs - delayMs) / dtMs;
    const bottom = top + rowMs / dtMs;
    const centre = (top + bottom) / 2;
    if (bottom < 0 || top > last) {
      r.min[row] = r.max[row] = r.mid[row] = NaN;
      continue;
    }
    const mid = at(Math.min(last, Math.max(0, centre)));
    let lo = Math.min(at(Math.max(0, top)), at(Math.min(last, bottom)), mid);
    let hi = Math.max(at(Math.max(0, top)), at(Math.min(last, bottom)), mid);
    for (let i = Math.max(0, Math.ceil(top)); i <= Math.min(last, Math.floor(bottom)); i++) {
      const v = x[i];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    r.min[row] = lo;
    r.max[row] = hi;
    r.mid[row] = mid;
  }
  return r;
}
