/**
 * Where things sit on the record view: traces across (index a..b in view), display time down
 * (t0..t1 ms). Shared by the drawing and the pointer handling so a click lands on what is drawn.
 */
export interface RecordView {
  /** Display time at the top and bottom of the plot (ms; reduced when a reduction velocity is set). */
  t0: number;
  t1: number;
  /** Trace positions (0-based index, fractional) at the left and right edges. */
  a: number;
  b: number;
}

export interface PlotBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

export const RECORD_MARGIN = { left: 54, top: 28, right: 10, bottom: 8 };

export function plotBox(width: number, height: number): PlotBox {
  const m = RECORD_MARGIN;
  return { left: m.left, top: m.top, width: Math.max(10, width - m.left - m.right), height: Math.max(10, height - m.top - m.bottom) };
}

export const xOfTrace = (box: PlotBox, v: RecordView, i: number) => box.left + ((i - v.a) / (v.b - v.a)) * box.width;
export const traceAtX = (box: PlotBox, v: RecordView, x: number) => v.a + ((x - box.left) / box.width) * (v.b - v.a);
export const yOfTime = (box: PlotBox, v: RecordView, t: number) => box.top + ((t - v.t0) / (v.t1 - v.t0)) * box.height;
export const timeAtY = (box: PlotBox, v: RecordView, y: number) => v.t0 + ((y - box.top) / box.height) * (v.t1 - v.t0);
/** Pixels between neighbouring traces. */
export const traceSpacing = (box: PlotBox, v: RecordView) => box.width / (v.b - v.a);

/** The whole record in view: every trace, from the first sample (or the shot) to the last. */
export function fullView(traces: number, startMs: number, endMs: number): RecordView {
  return { t0: Math.min(0, startMs), t1: Math.max(endMs, startMs + 1), a: -0.8, b: Math.max(1, traces) - 0.2 };
}

/** Zoom about a point: factor < 1 zooms in. Time and trace axes zoom separately. */
export function zoomView(v: RecordView, axis: 'time' | 'traces', factor: number, at: number): RecordView {
  if (axis === 'time') return { ...v, t0: at - (at - v.t0) * factor, t1: at + (v.t1 - at) * factor };
  return { ...v, a: at - (at - v.a) * factor, b: at + (v.b - at) * factor };
}

export function panView(v: RecordView, dTraces: number, dMs: number): RecordView {
  return { t0: v.t0 + dMs, t1: v.t1 + dMs, a: v.a + dTraces, b: v.b + dTraces };
}
