/**
 * The velocity section figure: the rasterised model as an image (one pixel per node, clipped to
 * the ground), a velocity colour bar, and as vector lines the chosen shot's wavefronts with time
 * labels, its rays, the ground surface and the layer interfaces; stations and the shot marked.
 */
import { nodeX, nodeZ, type Grid } from '../../shared/grid';
import { sToMs } from '../../shared/units';
import { colourAt, VELOCITY_STOPS } from './colour';
import { verticalColourBar } from './colour-bar';
import type { ReportContext } from './context';
import { contourLines } from '../../shared/geometry/contour-lines';
import { plain } from './format';
import { layerOutlines } from './interfaces';
import { groundLine, lineRange } from './line-geometry';
import { groundAt } from '../../shared/boreholes';
import { holeMark, shotMark, stationMark } from './markers';
import { Plot, type Box } from './plot';
import { encodeRgbPng } from './png';
import { COLOUR, SIZE } from './style';
import { label, textWidth } from './text';
import { niceStep } from './ticks';
import { placeWavefrontLabels } from './wavefront-labels';
import { FONT } from './fonts';

/** Vertical exaggerations offered, smallest first (1:1 whenever the section is deep enough). */
const EXAGGERATIONS = [1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10, 15, 20];

export interface SectionLayout {
  box: Box;
  exaggeration: number;
  zTop: number;
  zBottom: number;
}

/** Plot box and vertical exaggeration for a section `width` pt wide, aiming at `target` pt tall. */
export function sectionLayout(ctx: ReportContext, left: number, top: number, width: number, target: number, maxHeight: number): SectionLayout {
  return sectionLayoutFor(ctx.model.grid, groundLine(ctx.model, ctx.input.model.file), left, top, width, target, maxHeight);
}

/** The same for any grid and ground line (x, z pairs): the inversion report's sections share it. */
export function sectionLayoutFor(grid: Grid, ground: readonly number[], left: number, top: number, width: number, target: number, maxHeight: number): SectionLayout {
  const xr = { min: grid.x0, max: nodeX(grid, grid.nx - 1) };
  const zBottom = nodeZ(grid, grid.nz - 1);
  let maxGround = -Infinity;
  for (let i = 1; i < ground.length; i += 2) maxGround = Math.max(maxGround, ground[i]);
  const zTop = Math.min(grid.z0, maxGround + 0.12 * (maxGround - zBottom));
  const natural = (width * (zTop - zBottom)) / (xr.max - xr.min); // pt tall at 1:1
  let exaggeration = EXAGGERATIONS.find((e) => natural * e >= target) ?? EXAGGERATIONS[EXAGGERATIONS.length - 1];
  while (exaggeration > 1 && natural * exaggeration > maxHeight) exaggeration = EXAGGERATIONS[EXAGGERATIONS.indexOf(exaggeration) - 1];
  let height = natural * exaggeration;
  let w = width;
  if (height > maxHeight) {
    // Deeper than the page allows at 1:1: keep the true scale and narrow the section.
    w = (width * maxHeight) / height;
    height = maxHeight;
  }
  return { box: { left, top, width: w, height }, exaggeration, zTop, zBottom };
}

export interface SectionFigureInfo {
  /** Whether layer interfaces were drawn. */
  interfaces: boolean;
  contourStepMs: number;
  exaggeration: number;
  /** The velocities of the ground drawn (m/s). */
  velocityRange: { min: number; max: number };
  /** The range the colours span: the project's, or the ground's own in an older report. */
  colourRange: { min: number; max: number };
  /** How many boreholes and trial pits were drawn. */
  holes: number;
}

export function drawVelocityFigure(ctx: ReportContext, layout: SectionLayout): SectionFigureInfo {
  const { doc, model, input } = ctx;
  const { grid } = model;
  const plot = new Plot(doc, layout.box, lineRange(model), { min: layout.zBottom, max: layout.zTop });
  const groundRange = groundVelocityRange(ctx);
  const range = ctx.input.velocityColours ?? groundRange;
  const ground = groundLine(model, input.model.file);

  // Raster: one pixel per node centred on it, clipped by the ground surface.
  const png = encodeRgbPng(grid.nx, grid.nz, velocityPixels(model.velocity, range));
  plot.clip();
  doc.save();
  const outline: [number, number][] = [];
  for (let i = 0; i + 1 < ground.length; i += 2) outline.push([plot.px(ground[i]), plot.py(ground[i + 1])]);
  outline.push([plot.right, plot.py(layout.zBottom)], [plot.box.left, plot.py(layout.zBottom)]);
  doc.polygon(...outline).clip();
  const x0 = plot.px(grid.x0 - grid.dx / 2);
  const y0 = plot.py(grid.z0 + grid.dz / 2);
  doc.image(png, x0, y0, { width: plot.px(grid.x0 + (grid.nx - 0.5) * grid.dx) - x0, height: plot.py(grid.z0 - (grid.nz - 0.5) * grid.dz) - y0 });
  doc.restore();

  // Layer interfaces (dashed) and layer names at the left end of each layer.
  const layers = layerOutlines(input.model.file, model);
  doc.save().lineWidth(0.7).strokeColor(COLOUR.interface).dash(3.5, { space: 2.5 });
  for (const l of layers) for (const piece of l.base) plot.polyline(piece);
  doc.stroke().undash().restore();

  // Rays of the shot.
  doc.save().lineWidth(0.4).strokeColor(COLOUR.ray).strokeOpacity(0.75);
  for (const r of input.section.rays) plot.polyline(r.points);
  doc.stroke().restore();

  // Wavefronts of the shot, one path per level.
  const { times } = input.section;
  let maxS = 0;
  for (let i = 0; i < times.length; i++) if (times[i] > maxS) maxS = times[i];
  const stepMs = niceStep(sToMs(maxS) / 10);
  const levels: { level: number; polylines: number[][] }[] = [];
  doc.save().lineWidth(0.45).strokeColor(COLOUR.ink);
  for (let k = 1; k * stepMs <= sToMs(maxS) + 1e-9 && k <= 60; k++) {
    const levelMs = Math.round(k * stepMs * 1e6) / 1e6;
    const lines = contourLines(times, input.section.grid, levelMs / 1000);
    for (const l of lines) plot.polyline(l);
    levels.push({ level: levelMs, polylines: lines.map((l) => l.map((v, i) => (i % 2 === 0 ? plot.px(v) : plot.py(v)))) });
  }
  doc.stroke().restore();

  // The ground surface over everything in the ground.
  doc.save().lineWidth(0.9).strokeColor(COLOUR.ink);
  plot.polyline(ground);
  doc.stroke().restore();

  // Time labels on white patches.
  const shot = { x: plot.px(input.section.source.x), y: plot.py(input.section.source.z) };
  const labelSize = SIZE.tick - 1;
  const farRight = input.section.source.x - plot.x.min < plot.x.max - input.section.source.x;
  const placed = placeWavefrontLabels(
    levels,
    shot,
    { x: plot.box.left + 2, y: plot.box.top + 2, w: plot.box.width - 4, h: plot.box.height - 4 },
    (level) => ({ w: textWidth(doc, plain(level, 3), labelSize), h: labelSize * 0.8 }),
    farRight,
  );
  for (const p of placed) {
    const text = plain(p.level, 3);
    const w = textWidth(doc, text, labelSize);
    doc.save().fillColor('#ffffff').fillOpacity(0.85).roundedRect(p.x - w / 2 - 1.5, p.y - labelSize * 0.45 - 1, w + 3, labelSize * 0.9 + 2, 1.5).fill().restore();
    label(doc, text, p.x, p.y, { size: labelSize, align: 'center', valign: 'middle' });
  }
  layerNames(ctx, plot, layers, [{ x: shot.x - 30, y: shot.y - 20, w: 60, h: 40 }, ...placed.map((p) => ({ x: p.x - 10, y: p.y - 6, w: 20, h: 12 }))]);
  plot.restore();

  for (const s of input.stations) if (s.x >= plot.x.min && s.x <= plot.x.max) stationMark(doc, plot.px(s.x), plot.py(s.z), 4);
  const holes = (input.boreholes ?? []).filter((h) => h.x >= plot.x.min && h.x <= plot.x.max);
  for (const h of holes) {
    const ground = h.groundZ ?? groundAt(input.stations, h.x) ?? ctx.model.surfaceZ(h.x);
    const deepest = Math.max(0, ...h.contacts.map((c) => c.depth));
    holeMark(doc, plot.px(h.x), plot.py(ground), plot.py(ground - deepest), h.contacts.map((c) => ({ y: plot.py(ground - c.depth), rockTop: c.rockTop })));
    label(doc, h.name, plot.px(h.x), plot.py(ground) - 7, { size: SIZE.tick - 1, align: 'center' });
  }
  shotMark(doc, shot.x, shot.y, 5);
  // The shot's name above its star, kept within the plot's width so it never runs into the axis labels.
  const shotName = `shot ${input.section.shotId}`;
  const half = textWidth(doc, shotName, SIZE.small, FONT.semibold) / 2;
  const nameX = Math.min(Math.max(shot.x, plot.box.left + half), plot.right - half);
  label(doc, shotName, nameX, shot.y - 8, { size: SIZE.small, align: 'center', colour: COLOUR.shot, font: FONT.semibold });

  plot.frame();
  plot.xAxis('Distance along line x (m)');
  plot.yAxis('Elevation (m)', { target: 5 });
  verticalColourBar(doc, { stops: VELOCITY_STOPS, min: range.min, max: range.max, title: 'Velocity (m/s)' }, plot.right + 12, plot.box.top, 9, plot.box.height);
  return { interfaces: layers.some((l) => l.base.length > 0), contourStepMs: stepMs, exaggeration: layout.exaggeration, velocityRange: groundRange, colourRange: range, holes: holes.length };
}

/** Velocity range over ground nodes; widened a little when the ground is uniform. */
function groundVelocityRange(ctx: ReportContext): { min: number; max: number } {
  const { velocity, active } = ctx.model;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < velocity.length; i++) {
    if (!active[i]) continue;
    if (velocity[i] < min) min = velocity[i];
    if (velocity[i] > max) max = velocity[i];
  }
  if (!(max > min)) return { min: min * 0.9, max: max * 1.1 };
  return { min, max };
}

function velocityPixels(velocity: Float32Array, range: { min: number; max: number }): Uint8Array {
  const out = new Uint8Array(velocity.length * 3);
  const span = range.max - range.min;
  for (let i = 0; i < velocity.length; i++) {
    const c = colourAt(VELOCITY_STOPS, (velocity[i] - range.min) / span);
    out[3 * i] = c[0];
    out[3 * i + 1] = c[1];
    out[3 * i + 2] = c[2];
  }
  return out;
}

/**
 * Layer names in small italics inside each layer, at the first of a few positions along the line
 * (ends first) where the layer is thick enough and the name clears the shot and the time labels.
 */
function layerNames(ctx: ReportContext, plot: Plot, layers: ReturnType<typeof layerOutlines>, avoid: { x: number; y: number; w: number; h: number }[]): void {
  const size = SIZE.small - 0.5;
  for (const l of layers) {
    const w = textWidth(ctx.doc, l.name, size, FONT.italic);
    for (const f of [0.015, 0.985, 0.25, 0.75, 0.5]) {
      const x = plot.x.min + f * (plot.x.max - plot.x.min);
      const top = plot.py(Math.min(l.topAt(x), plot.y.max));
      const bottom = plot.py(Math.max(l.baseAt(x), plot.y.min));
      if (bottom - top < size * 1.6) continue;
      const align = f < 0.1 ? 'left' : f > 0.9 ? 'right' : 'center';
      const ax = plot.px(x) + (align === 'left' ? 3 : align === 'right' ? -3 : 0);
      const left = align === 'left' ? ax : align === 'right' ? ax - w : ax - w / 2;
      const y = (top + bottom) / 2;
      if (avoid.some((b) => left < b.x + b.w && b.x < left + w && y - size < b.y + b.h && b.y < y + size)) continue;
      label(ctx.doc, l.name, ax, y, { size, font: FONT.italic, align, valign: 'middle', colour: '#33424b' });
      break;
    }
  }
}
