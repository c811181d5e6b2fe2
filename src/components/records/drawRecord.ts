import { niceTicks } from '../model/sectionGeometry';
import { traceRows, type TraceRows } from '../../lib/traces/rows';
import type { TracePickMark } from './pickingState';
import { plotBox, traceSpacing, xOfTrace, yOfTime, type PlotBox, type RecordView } from './recordGeometry';

export interface RecordDrawing {
  /** Processed traces, peak 1 (lib/traces/prepare). */
  traces: Float32Array[];
  /** Per trace: sample interval and delay (ms), and the reduced-time shift (ms) added to display time to reach record time. */
  dtMs: number[];
  delayMs: number[];
  shiftMs: number[];
  /** Label above each trace (channel number). */
  labels: string[];
  view: RecordView;
  wiggle: boolean;
  density: boolean;
  /** Amplitude 1 spans `gain` trace spacings. */
  gain: number;
  /** Largest swing in trace spacings; null: unclipped. */
  clip: number | null;
  picks: (TracePickMark | null)[];
  selected: number | null;
}

const INK = '#292524';
const GRID = '#e7e5e4';
const AUTO_PICK = '#1f5d57';
const HAND_PICK = '#c2410c';
const SELECTED_BAND = 'rgba(31, 93, 87, 0.10)';

/** Variable density colours: slate blue for troughs, paper white at zero, umber for peaks (our own scale). */
const DENSITY = buildDensityScale();

/**
 * Draws a record: variable density and/or wiggles with filled positive lobes, the time axis, the
 * channel labels, the selected trace and the picks. Each trace is resampled once onto screen rows
 * (keeping extremes), so a long record costs about the same as a short one.
 */
export function drawRecord(ctx: CanvasRenderingContext2D, width: number, height: number, d: RecordDrawing): void {
  const box = plotBox(width, height);
  const v = d.view;
  ctx.clearRect(0, 0, width, height);
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(box.left, box.top, box.width, box.height);

  const first = Math.max(0, Math.floor(v.a)), last = Math.min(d.traces.length - 1, Math.ceil(v.b));
  const rows = Math.max(1, Math.round(box.height));
  const rowData = new Map<number, TraceRows>();
  for (let i = first; i <= last; i++) rowData.set(i, traceRows(d.traces[i], d.dtMs[i], d.delayMs[i], d.shiftMs[i], { t0: v.t0, t1: v.t1, rows }));

  ctx.save();
  ctx.beginPath();
  ctx.rect(box.left, box.top, box.width, box.height);
  ctx.clip();
  if (d.selected !== null && d.selected >= first && d.selected <= last) {
    const s = traceSpacing(box, v);
    ctx.fillStyle = SELECTED_BAND;
    ctx.fillRect(xOfTrace(box, v, d.selected) - s / 2, box.top, s, box.height);
  }
  drawTimeGrid(ctx, box, v);
  if (d.density) drawDensity(ctx, box, d, rowData, rows);
  if (d.wiggle) drawWiggles(ctx, box, d, rowData, rows);
  drawPicks(ctx, box, d, first, last);
  ctx.restore();
  drawAxes(ctx, box, d, first, last);
}

function amplitude(value: number, d: RecordDrawing): number {
  const a = value * d.gain;
  return d.clip === null ? a : Math.max(-d.clip, Math.min(d.clip, a));
}

function drawWiggles(ctx: CanvasRenderingContext2D, box: PlotBox, d: RecordDrawing, rowData: Map<number, TraceRows>, rows: number) {
  const s = traceSpacing(box, d.view);
  const rowMs = (d.view.t1 - d.view.t0) / rows;
  const fill = new Path2D(), line = new Path2D();
  for (const [i, r] of rowData) {
    const x0 = xOfTrace(box, d.view, i);
    // Many samples per row: draw each row's extremes; few: the interpolated curve.
    const dense = rowMs > 1.5 * d.dtMs[i];
    let open = false, filling = false;
    for (let row = 0; row < rows; row++) {
      const y = box.top + row + 0.5;
      const mid = r.mid[row];
      if (Number.isNaN(mid)) {
        if (filling) fill.lineTo(x0, y - 1);
        open = filling = false;
        continue;
      }
      const hi = x0 + amplitude(dense ? r.max[row] : mid, d) * s;
      if (dense) {
        const lo = x0 + amplitude(r.min[row], d) * s;
        if (!open) line.moveTo(lo, y);
        else line.lineTo(lo, y);
        line.lineTo(hi, y);
      } else if (!open) line.moveTo(hi, y);
      else line.lineTo(hi, y);
      open = true;
      if (!filling) {
        fill.moveTo(x0, y);
        filling = true;
      }
      fill.lineTo(Math.max(x0, hi), y);
    }
    if (filling) fill.lineTo(x0, box.top + rows);
  }
  ctx.fillStyle = d.density ? 'rgba(41, 37, 36, 0.55)' : INK;
  ctx.fill(fill);
  ctx.strokeStyle = INK;
  ctx.lineWidth = 0.8;
  ctx.stroke(line);
}

function drawDensity(ctx: CanvasRenderingContext2D, box: PlotBox, d: RecordDrawing, rowData: Map<number, TraceRows>, rows: number) {
  const cols = Math.max(1, Math.round(box.width));
  const image = new ImageData(cols, rows);
  const px = new Uint32Array(image.data.buffer);
  const v = d.view;
  for (let col = 0; col < cols; col++) {
    const f = v.a + ((col + 0.5) / cols) * (v.b - v.a);
    const i = Math.floor(f), w = f - i;
    const left = rowData.get(i), right = rowData.get(i + 1);
    if (!left && !right) continue;
    for (let row = 0; row < rows; row++) {
      const l = left ? left.mid[row] : NaN, r = right ? right.mid[row] : NaN;
      // Between two traces blend them; past the last one show the nearer alone.
      const value = Number.isNaN(l) ? (w > 0.5 ? r : NaN) : Number.isNaN(r) ? (w < 0.5 ? l : NaN) : l + w * (r - l);
      if (Number.isNaN(value)) continue;
      const a = Math.max(-1, Math.min(1, value * d.gain));
      px[row * cols + col] = DENSITY[Math.round((a + 1) * 127.5)];
    }
  }
  const layer = document.createElement('canvas');
  layer.width = cols;
  layer.height = rows;
  layer.getContext('2d')!.putImageData(image, 0, 0);
  ctx.imageSmoothingEnabled = true;
  ctx.drawImage(layer, box.left, box.top, box.width, box.height);
}

function drawTimeGrid(ctx: CanvasRenderingContext2D, box: PlotBox, v: RecordView) {
  ctx.strokeStyle = GRID;
  ctx.lineWidth = 1;
  ctx.beginPath();
  for (const t of niceTicks(v.t0, v.t1, Math.max(2, box.height / 60))) {
    const y = Math.round(yOfTime(box, v, t)) + 0.5;
    ctx.moveTo(box.left, y);
    ctx.lineTo(box.left + box.width, y);
  }
  ctx.stroke();
}

function drawPicks(ctx: CanvasRenderingContext2D, box: PlotBox, d: RecordDrawing, first: number, last: number) {
  const s = traceSpacing(box, d.view);
  const half = Math.max(4, Math.min(16, s * 0.4));
  for (let i = first; i <= last; i++) {
    const mark = d.picks[i];
    if (!mark) continue;
    const x = xOfTrace(box, d.view, i), y = yOfTime(box, d.view, mark.timeMs - d.shiftMs[i]);
    ctx.strokeStyle = mark.how === 'auto' ? AUTO_PICK : HAND_PICK;
    ctx.lineWidth = i === d.selected ? 3.5 : 2.5;
    ctx.beginPath();
    ctx.moveTo(x - half, y);
    ctx.lineTo(x + half, y);
    ctx.stroke();
  }
}

function drawAxes(ctx: CanvasRenderingContext2D, box: PlotBox, d: RecordDrawing, first: number, last: number) {
  ctx.strokeStyle = '#a8a29e';
  ctx.lineWidth = 1;
  ctx.strokeRect(box.left + 0.5, box.top + 0.5, box.width - 1, box.height - 1);
  ctx.fillStyle = '#44403c';
  ctx.font = '12px "Source Sans 3", sans-serif';
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const t of niceTicks(d.view.t0, d.view.t1, Math.max(2, box.height / 60))) {
    ctx.fillText(String(t), box.left - 6, yOfTime(box, d.view, t));
  }
  ctx.textAlign = 'left';
  ctx.textBaseline = 'top';
  ctx.fillText('ms', 4, 6);
  // Channel labels: as many as fit without touching.
  const s = traceSpacing(box, d.view);
  const every = Math.max(1, Math.ceil(26 / s));
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  for (let i = first; i <= last; i++) {
    if (i % every !== 0 && i !== d.selected) continue;
    ctx.font = i === d.selected ? 'bold 12px "Source Sans 3", sans-serif' : '12px "Source Sans 3", sans-serif';
    ctx.fillText(d.labels[i] ?? String(i + 1), xOfTrace(box, d.view, i), box.top - 6);
  }
}

function buildDensityScale(): Uint32Array {
  const trough = [38, 64, 120], paper = [250, 250, 249], peak = [96, 52, 24];
  const lut = new Uint32Array(256);
  const little = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;
  for (let k = 0; k < 256; k++) {
    const a = k / 127.5 - 1;
    const [from, to, w] = a < 0 ? [paper, trough, -a] : [paper, peak, a];
    const c = from.map((f, j) => Math.round(f + (to[j] - f) * w));
    lut[k] = little ? (255 << 24) | (c[2] << 16) | (c[1] << 8) | c[0] : (c[0] << 24) | (c[1] << 16) | (c[2] << 8) | 255;
  }
  return lut;
}
