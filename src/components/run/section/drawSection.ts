import { drawBoreholes, type SectionHole } from '../../plot/drawBoreholes';
import type { RayPath, Station } from '../../../api/types';
import { sectionFrame, niceTicks, type SectionFrame } from './sectionScale';
import { VELOCITY_CSS_STOPS } from '../../../../shared/colour/velocity-scale';
import type { Wavefronts } from './wavefronts';
import type { Grid } from '../../../../shared/grid';

/** Everything the section drawing needs; all positions in model metres. */
export interface SectionScene {
  grid: Grid;
  /** The velocity image: one pixel per node (see velocityPixels). */
  image: CanvasImageSource;
  vRange: { min: number; max: number };
  fronts: Wavefronts | null;
  rays: RayPath[];
  highlightPick: number | null;
  surface: readonly (readonly [number, number])[] | null;
  layerBases: { name: string; base: readonly (readonly [number, number])[] }[];
  stations: Station[];
  shots: { shotId: string; x: number; z: number }[];
  selectedShot: string | null;
  /** The line's boreholes and trial pits. */
  boreholes?: readonly SectionHole[];
}

export const SECTION_COLOURS = {
  wavefront: '#1c1917',
  ray: 'rgba(159, 18, 57, 0.7)',
  rayChosen: '#9f1239',
  surface: '#44403c',
  base: '#57534e',
  station: '#292524',
  shot: '#fdba74',
  shotChosen: '#ea580c',
  shotEdge: '#7c2d12',
  axis: '#a8a29e',
  text: '#292524',
};

const FONT = '"Source Sans 3", ui-sans-serif, system-ui, sans-serif';

/** Draw the section into a 2-D context already scaled to CSS pixels. Returns the frame used. */
export function drawSection(ctx: CanvasRenderingContext2D, scene: SectionScene, width: number, exaggeration: number): SectionFrame {
  const f = sectionFrame(scene.grid, width, exaggeration);
  const { plot } = f;
  ctx.clearRect(0, 0, f.width, f.height);
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, f.width, f.height);

  ctx.save();
  ctx.beginPath();
  ctx.rect(plot.left, plot.top, plot.width, plot.height);
  ctx.clip();
  ctx.fillStyle = '#fafaf9';
  ctx.fillRect(plot.left, plot.top, plot.width, plot.height);
  ctx.imageSmoothingEnabled = false; // one crisp block per node, as the solver saw it
  ctx.drawImage(scene.image, plot.left, plot.top, plot.width, plot.height);

  for (const layer of scene.layerBases) polyline(ctx, f, layer.base, SECTION_COLOURS.base, 1.2, [6, 4]);
  if (scene.surface) polyline(ctx, f, scene.surface, SECTION_COLOURS.surface, 1.5);

  if (scene.fronts) {
    ctx.beginPath();
    const s = scene.fronts.segments;
    for (let i = 0; i + 3 < s.length; i += 4) {
      const [ax, ay] = f.toPx(s[i]!, s[i + 1]!);
      const [bx, by] = f.toPx(s[i + 2]!, s[i + 3]!);
      ctx.moveTo(ax, ay);
      ctx.lineTo(bx, by);
    }
    ctx.strokeStyle = SECTION_COLOURS.wavefront;
    ctx.lineWidth = 1;
    ctx.stroke();
  }

  ctx.beginPath();
  for (const ray of scene.rays) tracePath(ctx, f, ray.points);
  ctx.strokeStyle = SECTION_COLOURS.ray;
  ctx.lineWidth = 1;
  ctx.stroke();
  const chosen = scene.rays.find((r) => r.pickIndex === scene.highlightPick);
  if (chosen) {
    ctx.beginPath();
    tracePath(ctx, f, chosen.points);
    ctx.strokeStyle = SECTION_COLOURS.rayChosen;
    ctx.lineWidth = 3.5;
    ctx.stroke();
  }

  if (scene.fronts) {
    ctx.font = `12px ${FONT}`;
    ctx.textAlign = 'center';
    ctx.textBaseline = 'middle';
    for (const label of scene.fronts.labels) {
      const w = ctx.measureText(label.text).width + 6;
      // Keep the whole tile inside the plot, even for a label on the grid's edge.
      const [px, py] = f.toPx(label.x, label.z);
      const x = Math.min(Math.max(px, plot.left + w / 2 + 1), plot.left + plot.width - w / 2 - 1);
      const y = Math.min(Math.max(py, plot.top + 9), plot.top + plot.height - 9);
      ctx.fillStyle = 'rgba(255, 255, 255, 0.85)';
      ctx.fillRect(x - w / 2, y - 8, w, 16);
      ctx.fillStyle = SECTION_COLOURS.wavefront;
      ctx.fillText(label.text, x, y + 0.5);
    }
  }
  if (scene.boreholes?.length) drawBoreholes(ctx, scene.boreholes, f.toPx);
  ctx.restore();

  // Stations and shots may sit on the top edge: draw them unclipped.
  ctx.fillStyle = SECTION_COLOURS.station;
  for (const s of scene.stations) {
    const [x, y] = f.toPx(s.x, s.z);
    ctx.beginPath();
    ctx.moveTo(x - 4, y - 7);
    ctx.lineTo(x + 4, y - 7);
    ctx.lineTo(x, y);
    ctx.closePath();
    ctx.fill();
  }
  ctx.font = `12px ${FONT}`;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  for (const shot of scene.shots) {
    if (!Number.isFinite(shot.z)) continue;
    const on = shot.shotId === scene.selectedShot;
    const [x, y] = f.toPx(shot.x, shot.z);
    star(ctx, x, y, on ? 9 : 6);
    ctx.fillStyle = on ? SECTION_COLOURS.shotChosen : SECTION_COLOURS.shot;
    ctx.fill();
    ctx.strokeStyle = SECTION_COLOURS.shotEdge;
    ctx.lineWidth = on ? 1.5 : 0.8;
    ctx.stroke();
    ctx.fillStyle = SECTION_COLOURS.shotEdge;
    ctx.font = `${on ? 'bold ' : ''}12px ${FONT}`;
    ctx.fillText(shot.shotId, x, y - (on ? 10 : 7));
  }

  axes(ctx, f);
  colourBar(ctx, f, scene.vRange);
  return f;
}

function tracePath(ctx: CanvasRenderingContext2D, f: SectionFrame, flat: readonly number[]) {
  for (let i = 0; i + 1 < flat.length; i += 2) {
    const [x, y] = f.toPx(flat[i]!, flat[i + 1]!);
    if (i === 0) ctx.moveTo(x, y);
    else ctx.lineTo(x, y);
  }
}

function polyline(ctx: CanvasRenderingContext2D, f: SectionFrame, points: readonly (readonly [number, number])[], colour: string, width: number, dash: number[] = []) {
  ctx.beginPath();
  points.forEach(([x, z], i) => {
    const [px, py] = f.toPx(x, z);
    if (i === 0) ctx.moveTo(px, py);
    else ctx.lineTo(px, py);
  });
  ctx.setLineDash(dash);
  ctx.strokeStyle = colour;
  ctx.lineWidth = width;
  ctx.stroke();
  ctx.setLineDash([]);
}

function star(ctx: CanvasRenderingContext2D, x: number, y: number, r: number) {
  ctx.beginPath();
  for (let k = 0; k < 10; k++) {
    const radius = k % 2 === 0 ? r : r * 0.45;
    const a = -Math.PI / 2 + (k * Math.PI) / 5;
    const px = x + radius * Math.cos(a);
    const py = y + radius * Math.sin(a);
    if (k === 0) ctx.moveTo(px, py);
    else ctx.lineTo(px, py);
  }
  ctx.closePath();
}

function axes(ctx: CanvasRenderingContext2D, f: SectionFrame) {
  const { plot } = f;
  ctx.strokeStyle = SECTION_COLOURS.axis;
  ctx.lineWidth = 1;
  ctx.strokeRect(plot.left + 0.5, plot.top + 0.5, plot.width - 1, plot.height - 1);
  ctx.fillStyle = SECTION_COLOURS.text;
  ctx.font = `13px ${FONT}`;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  ctx.beginPath();
  for (const x of niceTicks(f.xMin, f.xMax, Math.max(3, Math.round(plot.width / 90)))) {
    const [px] = f.toPx(x, f.zMin);
    ctx.moveTo(px, plot.top + plot.height);
    ctx.lineTo(px, plot.top + plot.height + 5);
    ctx.fillText(String(x), px, plot.top + plot.height + 7);
  }
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const z of niceTicks(f.zMin, f.zMax, Math.max(2, Math.round(plot.height / 45)))) {
    const [, py] = f.toPx(f.xMin, z);
    ctx.moveTo(plot.left - 5, py);
    ctx.lineTo(plot.left, py);
    ctx.fillText(String(z), plot.left - 7, py);
  }
  ctx.stroke();
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  ctx.font = `14px ${FONT}`;
  ctx.fillText('x along the line (m)', plot.left + plot.width / 2, f.height - 4);
  ctx.save();
  ctx.translate(14, plot.top + plot.height / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textBaseline = 'middle';
  ctx.fillText('elevation (m)', 0, 0);
  ctx.restore();
}

function colourBar(ctx: CanvasRenderingContext2D, f: SectionFrame, range: { min: number; max: number }) {
  const { plot } = f;
  const x = plot.left + plot.width + 14;
  const top = plot.top;
  const h = plot.height;
  const gradient = ctx.createLinearGradient(0, top + h, 0, top);
  for (const [t, colour] of VELOCITY_CSS_STOPS) gradient.addColorStop(t, colour);
  ctx.fillStyle = gradient;
  ctx.fillRect(x, top, 12, h);
  ctx.strokeStyle = SECTION_COLOURS.axis;
  ctx.strokeRect(x + 0.5, top + 0.5, 11, h - 1);
  ctx.fillStyle = SECTION_COLOURS.text;
  ctx.font = `12px ${FONT}`;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  const span = range.max - range.min || 1;
  for (const v of niceTicks(range.min, range.max, Math.max(2, Math.round(h / 40)))) {
    ctx.fillText(String(v), x + 16, top + h - ((v - range.min) / span) * h);
  }
  ctx.textBaseline = 'bottom';
  ctx.fillText('v (m/s)', x - 2, top - 6);
}
