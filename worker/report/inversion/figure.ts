/**
 * The inverted velocity section: the final model as an image (one pixel per node, clipped to the
 * ground) on the product's velocity scale, nodes with less ray coverage than the threshold in flat
 * grey with the coverage boundary dashed, labelled iso-velocity contours in the covered part, the
 * chosen iso-velocity in the accent colour, the depth-of-investigation line, the ground surface,
 * stations and shots, and a colour bar.
 */
import { nodeX } from '../../../shared/grid';
import { colourAt, VELOCITY_STOPS, type Rgb } from '../colour';
import { verticalColourBar } from '../colour-bar';
import { contourLines } from '../../../shared/geometry/contour-lines';
import { FONT } from '../fonts';
import { plain } from '../format';
import { shotMark, stationMark } from '../markers';
import { Plot } from '../plot';
import { encodeRgbPng } from '../png';
import { COLOUR, SIZE } from '../style';
import { label, textWidth } from '../text';
import { niceTicks } from '../ticks';
import type { SectionLayout } from '../velocity-figure';
import type { InversionContext } from './context';

/** Flat neutral grey of nodes below the coverage threshold: no colour of the velocity scale is neutral. */
export const MASK_GREY: Rgb = [212, 214, 216];
export const DOI_COLOUR = '#6b2d5c';

export interface TomogramInfo {
  /** Velocities over the covered nodes (m/s). */
  velocityRange: { min: number; max: number };
  /** The range the colours span: the project's, or the covered range in an older report. */
  colourRange: { min: number; max: number };
  contourStep: number;
  /** Whether the chosen iso-velocity lies inside the colour range and was drawn. */
  isoDrawn: boolean;
  /** Share of ground nodes below the coverage threshold. */
  maskedShare: number;
  doiDrawn: boolean;
}

export function drawTomogram(ctx: InversionContext, layout: SectionLayout): TomogramInfo {
  const { doc, grid, velocity, input } = ctx;
  const plot = new Plot(doc, layout.box, ctx.xRange, { min: layout.zBottom, max: layout.zTop });
  const range = coveredRange(ctx);
  // Colours on the project's scale; contours and the iso-velocity over the covered velocities.
  const colours = ctx.input.velocityColours ?? range;

  // Raster: one pixel per node centred on it, masked nodes grey, clipped by the ground surface.
  const rgb = new Uint8Array(velocity.length * 3);
  let ground = 0;
  let masked = 0;
  for (let i = 0; i < velocity.length; i++) {
    if (ctx.active[i]) ground++;
    const hidden = ctx.active[i] && !ctx.covered(i);
    if (hidden) masked++;
    const c = hidden ? MASK_GREY : colourAt(VELOCITY_STOPS, (velocity[i] - colours.min) / (colours.max - colours.min));
    rgb.set([c[0], c[1], c[2]], 3 * i);
  }
  plot.clip();
  doc.save();
  const outline: [number, number][] = [];
  for (let i = 0; i + 1 < ctx.ground.length; i += 2) outline.push([plot.px(ctx.ground[i]), plot.py(ctx.ground[i + 1])]);
  outline.push([plot.right, plot.py(layout.zBottom)], [plot.box.left, plot.py(layout.zBottom)]);
  doc.polygon(...outline).clip();
  const x0 = plot.px(grid.x0 - grid.dx / 2);
  const y0 = plot.py(grid.z0 + grid.dz / 2);
  doc.image(encodeRgbPng(grid.nx, grid.nz, rgb), x0, y0, {
    width: plot.px(grid.x0 + (grid.nx - 0.5) * grid.dx) - x0,
    height: plot.py(grid.z0 - (grid.nz - 0.5) * grid.dz) - y0,
  });
  doc.restore();

  // Boundary of the covered region (the coverage = threshold contour), dashed.
  const coverageField = Float32Array.from(ctx.coverage, (c, i) => (ctx.active[i] ? c : Number.NaN));
  doc.save().lineWidth(0.5).strokeColor(COLOUR.muted).dash(1.5, { space: 1.5 });
  for (const l of contourLines(coverageField, grid, ctx.threshold)) plot.polyline(l);
  doc.stroke().undash().restore();

  // Iso-velocity contours where the rays reach; the chosen velocity in the accent colour.
  const field = Float32Array.from(velocity, (v, i) => (ctx.covered(i) ? v : Number.NaN));
  const step = niceTicks(range.min, range.max, 7).step;
  const levels: number[] = [];
  for (let v = Math.ceil(range.min / step) * step; v < range.max; v += step) if (v > range.min) levels.push(v);
  const lines = levels.map((level) => ({ level, polylines: contourLines(field, grid, level) }));
  doc.save().lineWidth(0.45).strokeColor(COLOUR.ink);
  for (const l of lines) for (const p of l.polylines) plot.polyline(p);
  doc.stroke().restore();
  const iso = input.isoVelocity;
  const isoDrawn = iso > range.min && iso < range.max;
  const isoLines = isoDrawn ? contourLines(field, grid, iso) : [];
  doc.save().lineWidth(1.3).strokeColor(COLOUR.accent);
  for (const p of isoLines) plot.polyline(p);
  doc.stroke().restore();

  // Depth of investigation: the lowest ray in each column.
  const doiLine: number[] = [];
  for (let ix = 0; ix < grid.nx; ix++) doiLine.push(nodeX(grid, ix), ctx.doi[ix]);
  const doiDrawn = ctx.doi.some((z) => Number.isFinite(z));
  doc.save().lineWidth(1.1).strokeColor(DOI_COLOUR).dash(5, { space: 2.5 });
  plot.polyline(doiLine);
  doc.stroke().undash().restore();

  doc.save().lineWidth(0.9).strokeColor(COLOUR.ink);
  plot.polyline(ctx.ground);
  doc.stroke().restore();

  const taken: Box[] = [];
  contourLabels(ctx, plot, [...lines.filter((l) => !isoDrawn || Math.abs(l.level - iso) > 1e-9), ...(isoDrawn ? [{ level: iso, polylines: isoLines }] : [])], taken);
  if (doiDrawn) doiLabel(ctx, plot, doiLine, taken);
  plot.restore();

  for (const s of input.stations) if (s.x >= plot.x.min && s.x <= plot.x.max) stationMark(doc, plot.px(s.x), plot.py(s.z), 3.5);
  for (const s of input.shots) if (s.sourceX >= plot.x.min && s.sourceX <= plot.x.max) shotMark(doc, plot.px(s.sourceX), plot.py(s.sourceZ) - 4, 3.8);

  plot.frame();
  plot.xAxis('Distance along line x (m)');
  plot.yAxis('Elevation (m)', { target: 5 });
  verticalColourBar(doc, { stops: VELOCITY_STOPS, min: colours.min, max: colours.max, title: 'Velocity (m/s)' }, plot.right + 12, plot.box.top, 9, plot.box.height);
  return { velocityRange: range, colourRange: colours, contourStep: step, isoDrawn, maskedShare: ground ? masked / ground : 0, doiDrawn };
}

/** Velocity range over the covered nodes (all ground nodes when none is covered); widened when uniform. */
function coveredRange(ctx: InversionContext): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const pass of [true, false]) {
    for (let i = 0; i < ctx.velocity.length; i++) {
      if (!ctx.active[i] || (pass && !ctx.covered(i))) continue;
      min = Math.min(min, ctx.velocity[i]);
      max = Math.max(max, ctx.velocity[i]);
    }
    if (max >= min) break;
  }
  if (!(max > min)) return { min: min * 0.9, max: max * 1.1 };
  return { min, max };
}

interface Box { x: number; y: number; w: number; h: number }
const overlaps = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** One label per level, on its longest line, at the first of a few points along it that is free and inside the plot. */
function contourLabels(ctx: InversionContext, plot: Plot, levels: { level: number; polylines: number[][] }[], taken: Box[]): void {
  const { doc } = ctx;
  const size = SIZE.tick - 1;
  for (const { level, polylines } of levels) {
    const line = [...polylines].sort((a, b) => b.length - a.length)[0];
    if (!line || line.length < 6) continue;
    const text = plain(level, 0);
    const w = textWidth(doc, text, size) + 3;
    const h = size * 0.9 + 2;
    for (const f of [0.5, 0.3, 0.7, 0.15, 0.85]) {
      const k = 2 * Math.floor((f * line.length) / 2);
      const x = plot.px(line[k]);
      const y = plot.py(line[k + 1]);
      const box = { x: x - w / 2, y: y - h / 2, w, h };
      if (box.x < plot.box.left + 2 || box.x + w > plot.right - 2 || box.y < plot.box.top + 2 || box.y + h > plot.bottom - 2) continue;
      if (taken.some((b) => overlaps(b, box))) continue;
      taken.push(box);
      doc.save().fillColor('#ffffff').fillOpacity(0.85).roundedRect(box.x, box.y, w, h, 1.5).fill().restore();
      label(doc, text, x, y, { size, align: 'center', valign: 'middle' });
      break;
    }
  }
}

/** "DOI" beside the line, at the right end of its longest stretch, clear of the contour labels. */
function doiLabel(ctx: InversionContext, plot: Plot, line: number[], taken: Box[]): void {
  const { doc } = ctx;
  const size = SIZE.small;
  const text = 'DOI';
  const w = textWidth(doc, text, size, FONT.semibold) + 3;
  const h = size + 2;
  const points: [number, number][] = [];
  for (let i = 0; i < line.length; i += 2) if (Number.isFinite(line[i + 1])) points.push([plot.px(line[i]), plot.py(line[i + 1])]);
  for (const f of [0.9, 0.75, 0.1, 0.5, 0.25]) {
    const [x, y] = points[Math.floor(f * (points.length - 1))];
    const box = { x: x - w / 2, y: y - h - 2, w, h };
    if (box.y < plot.box.top + 2 || box.y + h > plot.bottom - 2 || box.x < plot.box.left + 2 || box.x + w > plot.right - 2) continue;
    if (taken.some((b) => overlaps(b, box))) continue;
    taken.push(box);
    doc.save().fillColor('#ffffff').fillOpacity(0.85).roundedRect(box.x, box.y, w, h, 1.5).fill().restore();
    label(doc, text, x, box.y + h / 2, { size, align: 'center', valign: 'middle', colour: DOI_COLOUR, font: FONT.semibold });
    return;
  }
}
