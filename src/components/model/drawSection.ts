/**
 * Drawing the section on a 2-D canvas: velocity heatmap, painted-cell border, wavefront contours
 * labelled in ms, rays, interfaces with their nodes, the ground surface, stations, shots, the
 * gesture overlay, and the axes with units. Pure drawing: everything it needs is in the scene.
 */
import { drawBoreholes, type SectionHole } from '../plot/drawBoreholes';
import type { RasterModel } from '../../../shared/model';
import { AIR_RGB, INVALID_RGB, lutIndex, VELOCITY_LUT, type VelocityRange } from './colourScale';
import { niceTicks, xToPx, zToPx, type SectionLayout } from './sectionGeometry';

type Pt = readonly [number, number];

export interface SceneInterface {
  layer: number;
  points: readonly Pt[];
}

export interface ScenePreview {
  source: { x: number; z: number };
  receivers: Float64Array;
  levels: readonly number[];
  contours: readonly Float32Array[];
  rays: readonly Float64Array[] | null;
}

export interface SectionScene {
  layout: SectionLayout;
  raster: RasterModel;
  heatmap: CanvasImageSource;
  surface: readonly Pt[] | null;
  interfaces: readonly SceneInterface[];
  showHandles: boolean;
  selectedLayer: number | null;
  selectedNode: number | null;
  painted: Float32Array;
  stations: readonly { x: number; z: number }[];
  shots: readonly { id: string; x: number; z: number }[];
  selectedShot: string | null;
  preview: ScenePreview | null;
  overlay: { kind: 'rect'; a: Pt; b: Pt } | { kind: 'brush'; x: number; z: number; r: number } | null;
  /** The line's boreholes and trial pits, drawn over the model. */
  boreholes?: readonly SectionHole[];
}

const FONT = '13px "Source Sans 3", ui-sans-serif, system-ui, sans-serif';
const INK = '#1c1917';
const ACCENT = '#1f5d57';

/** The raster as an nx × nz image, one pixel per node. */
export function heatmapImage(raster: RasterModel, range: VelocityRange): HTMLCanvasElement {
  const { nx, nz } = raster.grid;
  const canvas = document.createElement('canvas');
  canvas.width = nx;
  canvas.height = nz;
  const ctx = canvas.getContext('2d')!;
  const img = ctx.createImageData(nx, nz);
  const px = img.data;
  const { velocity, active } = raster;
  for (let i = 0; i < nx * nz; i++) {
    const v = velocity[i];
    let r: number, g: number, b: number;
    if (!active[i]) [r, g, b] = AIR_RGB;
    else if (!(v > 0) || !Number.isFinite(v)) [r, g, b] = INVALID_RGB;
    else {
      const k = 3 * lutIndex(v, range);
      r = VELOCITY_LUT[k];
      g = VELOCITY_LUT[k + 1];
      b = VELOCITY_LUT[k + 2];
    }
    px[4 * i] = r;
    px[4 * i + 1] = g;
    px[4 * i + 2] = b;
    px[4 * i + 3] = 255;
  }
  ctx.putImageData(img, 0, 0);
  return canvas;
}

export function drawSection(ctx: CanvasRenderingContext2D, s: SectionScene): void {
  const L = s.layout;
  const { grid } = s.raster;
  ctx.clearRect(0, 0, L.width, L.height);
  ctx.save();
  ctx.beginPath();
  ctx.rect(L.plot.left, L.plot.top, L.plot.width, L.plot.height);
  ctx.clip();
  // Node-centred cells: the image reaches half a cell beyond the outer nodes (clipped to the plot).
  ctx.imageSmoothingEnabled = false;
  const left = xToPx(L, grid.x0 - grid.dx / 2);
  const top = zToPx(L, grid.z0 + grid.dz / 2);
  ctx.drawImage(s.heatmap, left, top, grid.nx * grid.dx * L.sx, grid.nz * grid.dz * L.sz);

  segments(ctx, L, s.painted, 'rgba(255,255,255,0.9)', 2.2);
  segments(ctx, L, s.painted, INK, 1, [3, 2]);
  if (s.preview) drawPreview(ctx, L, s.preview);
  for (const itf of s.interfaces) polyline(ctx, L, itf.points, itf.layer === s.selectedLayer ? ACCENT : INK, itf.layer === s.selectedLayer ? 2.4 : 1.6);
  if (s.surface) polyline(ctx, L, s.surface, '#44403c', 2.2);
  if (s.boreholes?.length) drawBoreholes(ctx, s.boreholes, (x, z) => [xToPx(L, x), zToPx(L, z)]);
  if (s.showHandles) drawHandles(ctx, L, s);
  drawOverlay(ctx, L, s);
  ctx.restore();

  drawStations(ctx, L, s.stations);
  drawShots(ctx, L, s);
  drawAxes(ctx, L);
}

function segments(ctx: CanvasRenderingContext2D, L: SectionLayout, seg: Float32Array, colour: string, width: number, dash: number[] = []): void {
  if (seg.length === 0) return;
  ctx.beginPath();
  for (let k = 0; k < seg.length; k += 4) {
    ctx.moveTo(xToPx(L, seg[k]), zToPx(L, seg[k + 1]));
    ctx.lineTo(xToPx(L, seg[k + 2]), zToPx(L, seg[k + 3]));
  }
  ctx.setLineDash(dash);
  ctx.strokeStyle = colour;
  ctx.lineWidth = width;
  ctx.stroke();
  ctx.setLineDash([]);
}

function polyline(ctx: CanvasRenderingContext2D, L: SectionLayout, pts: readonly Pt[], colour: string, width: number): void {
  if (pts.length < 2) return;
  ctx.beginPath();
  pts.forEach(([x, z], i) => (i ? ctx.lineTo(xToPx(L, x), zToPx(L, z)) : ctx.moveTo(xToPx(L, x), zToPx(L, z))));
  ctx.lineJoin = 'round';
  ctx.strokeStyle = 'rgba(255,255,255,0.85)';
  ctx.lineWidth = width + 2;
  ctx.stroke();
  ctx.strokeStyle = colour;
  ctx.lineWidth = width;
  ctx.stroke();
}

function drawPreview(ctx: CanvasRenderingContext2D, L: SectionLayout, p: ScenePreview): void {
  if (p.rays) {
    for (const halo of [true, false]) {
      ctx.beginPath();
      for (const ray of p.rays) {
        for (let k = 0; k < ray.length; k += 2) {
          const x = xToPx(L, ray[k]);
          const y = zToPx(L, ray[k + 1]);
          if (k) ctx.lineTo(x, y);
          else ctx.moveTo(x, y);
        }
      }
      ctx.strokeStyle = halo ? 'rgba(255,255,255,0.75)' : '#0b4f6c';
      ctx.lineWidth = halo ? 2.6 : 1.1;
      ctx.stroke();
    }
  }
  p.contours.forEach((seg) => {
    segments(ctx, L, seg, 'rgba(255,255,255,0.55)', 2.6);
    segments(ctx, L, seg, INK, 1.2);
  });
  drawContourLabels(ctx, L, p);
}

/** One label per wavefront, near a depth 45 % down the section on the side with more room; labels never crowd. */
function drawContourLabels(ctx: CanvasRenderingContext2D, L: SectionLayout, p: ScenePreview): void {
  const zTarget = L.zMax - 0.45 * (L.zMax - L.zMin);
  const right = p.source.x < (L.xMin + L.xMax) / 2;
  const placed: [number, number][] = [];
  ctx.font = FONT;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'middle';
  p.contours.forEach((seg, li) => {
    let best = -1;
    let bestScore = Infinity;
    for (let k = 0; k < seg.length; k += 4) {
      const mx = (seg[k] + seg[k + 2]) / 2;
      if (right ? mx < p.source.x : mx > p.source.x) continue;
      const score = Math.abs((seg[k + 1] + seg[k + 3]) / 2 - zTarget);
      if (score < bestScore) {
        bestScore = score;
        best = k;
      }
    }
    if (best < 0) return;
    const x = xToPx(L, (seg[best] + seg[best + 2]) / 2);
    const y = zToPx(L, (seg[best + 1] + seg[best + 3]) / 2);
    if (x < L.plot.left + 24 || x > L.plot.left + L.plot.width - 24) return; // a label cut by the frame reads wrong
    if (placed.some(([px, py]) => Math.hypot(px - x, py - y) < 34)) return;
    placed.push([x, y]);
    const text = `${+(p.levels[li] * 1000).toFixed(2)} ms`;
    ctx.lineWidth = 3.5;
    ctx.strokeStyle = 'rgba(255,255,255,0.95)';
    ctx.strokeText(text, x, y);
    ctx.fillStyle = INK;
    ctx.fillText(text, x, y);
  });
}

function drawHandles(ctx: CanvasRenderingContext2D, L: SectionLayout, s: SectionScene): void {
  for (const itf of s.interfaces) {
    const selected = itf.layer === s.selectedLayer;
    itf.points.forEach(([x, z], i) => {
      const isNode = selected && i === s.selectedNode;
      ctx.beginPath();
      ctx.arc(xToPx(L, x), zToPx(L, z), isNode ? 6.5 : selected ? 5 : 3.8, 0, 2 * Math.PI);
      ctx.fillStyle = isNode ? '#fde047' : selected ? ACCENT : 'white';
      ctx.fill();
      ctx.lineWidth = 1.5;
      ctx.strokeStyle = selected ? 'white' : INK;
      ctx.stroke();
      if (isNode) {
        ctx.lineWidth = 2;
        ctx.strokeStyle = INK;
        ctx.stroke();
      }
    });
  }
}

function drawOverlay(ctx: CanvasRenderingContext2D, L: SectionLayout, s: SectionScene): void {
  const o = s.overlay;
  if (!o) return;
  ctx.setLineDash([5, 3]);
  ctx.lineWidth = 1.5;
  ctx.strokeStyle = INK;
  ctx.fillStyle = 'rgba(255,255,255,0.25)';
  ctx.beginPath();
  if (o.kind === 'rect') {
    const x1 = xToPx(L, o.a[0]);
    const y1 = zToPx(L, o.a[1]);
    ctx.rect(Math.min(x1, xToPx(L, o.b[0])), Math.min(y1, zToPx(L, o.b[1])), Math.abs(xToPx(L, o.b[0]) - x1), Math.abs(zToPx(L, o.b[1]) - y1));
  } else {
    ctx.ellipse(xToPx(L, o.x), zToPx(L, o.z), Math.max(2, o.r * L.sx), Math.max(2, o.r * L.sz), 0, 0, 2 * Math.PI);
  }
  ctx.fill();
  ctx.stroke();
  ctx.setLineDash([]);
}

function drawStations(ctx: CanvasRenderingContext2D, L: SectionLayout, stations: SectionScene['stations']): void {
  ctx.fillStyle = '#292524';
  for (const st of stations) {
    const x = xToPx(L, st.x);
    if (x < L.plot.left - 1 || x > L.plot.left + L.plot.width + 1) continue;
    const y = zToPx(L, st.z);
    ctx.beginPath();
    ctx.moveTo(x, y);
    ctx.lineTo(x - 3.5, y - 7);
    ctx.lineTo(x + 3.5, y - 7);
    ctx.closePath();
    ctx.fill();
  }
}

function drawShots(ctx: CanvasRenderingContext2D, L: SectionLayout, s: SectionScene): void {
  ctx.font = FONT;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  for (const shot of s.shots) {
    const x = xToPx(L, shot.x);
    const y = zToPx(L, shot.z);
    const on = shot.id === s.selectedShot;
    star(ctx, x, y - 1, on ? 8 : 6);
    ctx.fillStyle = on ? '#b91c1c' : '#f5f5f4';
    ctx.fill();
    ctx.lineWidth = 1.4;
    ctx.strokeStyle = INK;
    ctx.stroke();
    if (on) {
      ctx.lineWidth = 3;
      ctx.strokeStyle = 'white';
      ctx.strokeText(shot.id, x, y - 10);
      ctx.fillStyle = '#7f1d1d';
      ctx.fillText(shot.id, x, y - 10);
    }
  }
}

function star(ctx: CanvasRenderingContext2D, x: number, y: number, r: number): void {
  ctx.beginPath();
  for (let k = 0; k < 10; k++) {
    const a = -Math.PI / 2 + (k * Math.PI) / 5;
    const rr = k % 2 ? r * 0.45 : r;
    ctx.lineTo(x + rr * Math.cos(a), y + rr * Math.sin(a));
  }
  ctx.closePath();
}

function drawAxes(ctx: CanvasRenderingContext2D, L: SectionLayout): void {
  const { left, top, width, height } = L.plot;
  ctx.strokeStyle = '#a8a29e';
  ctx.lineWidth = 1;
  ctx.strokeRect(left + 0.5, top + 0.5, width - 1, height - 1);
  ctx.fillStyle = '#44403c';
  ctx.font = FONT;
  ctx.beginPath();
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const x of niceTicks(L.xMin, L.xMax, Math.max(3, Math.floor(width / 90)))) {
    const px = Math.round(xToPx(L, x)) + 0.5;
    ctx.moveTo(px, top + height);
    ctx.lineTo(px, top + height + 5);
    ctx.fillText(String(x), px, top + height + 7);
  }
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const z of niceTicks(L.zMin, L.zMax, Math.max(2, Math.floor(height / 45)))) {
    const py = Math.round(zToPx(L, z)) + 0.5;
    ctx.moveTo(left - 5, py);
    ctx.lineTo(left, py);
    ctx.fillText(String(z), left - 8, py);
  }
  ctx.stroke();
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  ctx.fillText('x along the line (m)', left + width / 2, L.height - 2);
  ctx.save();
  ctx.translate(14, top + height / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textBaseline = 'middle';
  ctx.fillText('elevation z (m)', 0, 0);
  ctx.restore();
}

