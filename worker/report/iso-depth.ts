/** Section "Depth to the v* surface": a depth profile along the line and a table at the stations. */
import { nodeX, nodeZ } from '../../shared/grid';
import { deepestInterfaceDepth, deepestLayerName } from '../../shared/boreholes';
import { isoVelocityDepth, type IsoDepth } from '../../shared/model/iso-depth';
import { drawBoreholes, type TieSurface } from './boreholes';
import type { ReportContext } from './context';
import { caption, captionHeight, paragraph, sectionHeading } from './flow';
import { fixed, plain } from './format';
import { lineRange } from './line-geometry';
import { dot, stationMark } from './markers';
import { Plot, type Box } from './plot';
import { COLOUR, CONTENT, SIZE } from './style';
import { drawTable } from './table';
import { drawMapDepthTable } from './map-depths';
import { label } from './text';
import { niceStep } from './ticks';

export const NOT_REACHED = 'not reached within the model';

/**
 * Section "Boreholes and ties" of a forward-run report: the contacts against the top of the model's
 * deepest layer (when it has layers) and against the iso-velocity surface of the section before.
 */
export function drawReportBoreholes(ctx: ReportContext): void {
  const { input, model } = ctx;
  const { grid } = model;
  const xMax = nodeX(grid, grid.nx - 1);
  const surfaces: TieSurface[] = [];
  const interfaceDepth = deepestInterfaceDepth(input.model.file, model.surfaceZ);
  if (interfaceDepth) surfaces.push({ name: deepestLayerName(input.model.file), depthAt: interfaceDepth });
  surfaces.push({ name: `the ${plain(input.isoVelocity, 0)} m/s surface`, depthAt: (x) => (x < grid.x0 || x > xMax ? null : isoVelocityDepth(model, input.isoVelocity, x).depth) });
  drawBoreholes(ctx, 'boreholes', input.boreholes ?? [], surfaces, input.stations);
}
export const OUTSIDE = 'outside the model';

/** The iso-velocity depth at each station, or why there is none. */
export function stationIsoDepths(ctx: ReportContext): { station: number; x: number; result: IsoDepth | null }[] {
  const { grid } = ctx.model;
  const xMax = nodeX(grid, grid.nx - 1);
  return [...ctx.input.stations]
    .sort((a, b) => a.x - b.x)
    .map((s) => ({ station: s.station, x: s.x, result: s.x >= grid.x0 && s.x <= xMax ? isoVelocityDepth(ctx.model, ctx.input.isoVelocity, s.x) : null }));
}

export function drawIsoDepth(ctx: ReportContext): void {
  const { input, model } = ctx;
  sectionHeading(ctx, 'isoDepth');
  const v = plain(input.isoVelocity, 0);
  const atStations = stationIsoDepths(ctx);
  const reached = atStations.filter((s) => s.result?.depth != null);
  const depths = reached.map((s) => s.result!.depth!);
  paragraph(
    ctx,
    `Depth below the ground surface at which the model's velocity first reaches ${v} m/s, a velocity chosen by the geophysicist to mark a boundary of engineering interest (for example the top of rock). ` +
      `It is read from the model as sampled on its grid, between node rows ${plain(model.grid.dz, 3)} m apart, and is a property of the model, not a measurement.`,
  );
  paragraph(
    ctx,
    reached.length
      ? `At the stations the surface lies ${fixed(Math.min(...depths), 1)} m to ${fixed(Math.max(...depths), 1)} m below ground` +
          (reached.length < atStations.length ? `; at ${atStations.length - reached.length} of ${atStations.length} stations it is not reached within the model.` : '.')
      : `The velocity ${v} m/s is not reached within the model at any station.`,
  );
  ctx.y += 4;

  const text = `Depth below the ground surface to the first point where the velocity reaches ${v} m/s (solid line, every node column; dots at the stations). Dashed: bottom of the model; where the solid line is missing the velocity is not reached within the model. Depth in metres, increasing downwards.`;
  const height = 160;
  ctx.ensureSpace(height + 56 + captionHeight(ctx, text));
  drawProfile(ctx, { left: CONTENT.left + 44, top: ctx.y + 10, width: CONTENT.width - 52, height }, atStations);
  ctx.y += height + 10 + 40;
  caption(ctx, 'Figure', text);

  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', `Depth to the ${v} m/s surface at the stations: ground elevation of the model, depth below ground and elevation of the surface (m).`);
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Station', width: 60 },
      { title: 'x (m)', width: 60, align: 'right' },
      { title: 'Ground elevation (m)', width: 100, align: 'right' },
      { title: 'Depth below ground (m)', width: 135, align: 'right' },
      { title: 'Elevation of surface (m)', width: 110, align: 'right' },
    ],
    rows: atStations.map((s) => {
      const r = s.result;
      if (!r) return [String(s.station), fixed(s.x, 2), '—', OUTSIDE, '—'];
      if (r.depth === null) return [String(s.station), fixed(s.x, 2), fixed(r.groundZ, 2), NOT_REACHED, '—'];
      return [String(s.station), fixed(s.x, 2), fixed(r.groundZ, 2), fixed(r.depth, 1), fixed(r.elevation, 1)];
    }),
  });
  const byStation = new Map(input.stations.map((s) => [s.station, s]));
  drawMapDepthTable(
    ctx,
    atStations.map((s) => ({ ...byStation.get(s.station), station: s.station, groundZ: s.result?.groundZ ?? null, depth: s.result?.depth ?? null, elevation: s.result?.elevation ?? null })),
    `the ${v} m/s surface`,
    input.crs,
  );
}

function drawProfile(ctx: ReportContext, box: Box, atStations: ReturnType<typeof stationIsoDepths>): void {
  const { doc, model, input } = ctx;
  const { grid } = model;
  const zBottom = nodeZ(grid, grid.nz - 1);
  const line: number[] = [];
  const bottom: number[] = [];
  let deepest = 0;
  for (let ix = 0; ix < grid.nx; ix++) {
    const x = nodeX(grid, ix);
    const r = isoVelocityDepth(model, input.isoVelocity, x);
    line.push(x, r.depth ?? Number.NaN);
    bottom.push(x, r.groundZ - zBottom);
    deepest = Math.max(deepest, r.groundZ - zBottom);
  }
  const step = niceStep(deepest / 5);
  const plot = new Plot(doc, box, lineRange(model), { min: 0, max: Math.ceil((deepest * 1.02) / step) * step }, true);

  plot.clip();
  doc.save().lineWidth(0.4).strokeColor(COLOUR.rule);
  for (let d = step; d < plot.y.max; d += step) doc.moveTo(box.left, plot.py(d)).lineTo(plot.right, plot.py(d));
  doc.stroke().restore();
  doc.save().lineWidth(0.8).strokeColor(COLOUR.muted).dash(3.5, { space: 2.5 });
  plot.polyline(bottom);
  doc.stroke().undash().restore();
  doc.save().lineWidth(1.4).strokeColor(COLOUR.accent);
  plot.polyline(line);
  doc.stroke().restore();
  for (const s of atStations) if (s.result?.depth != null) dot(doc, plot.px(s.x), plot.py(s.result.depth), 1.8, COLOUR.ink);
  plot.restore();

  for (const s of atStations) if (s.x >= plot.x.min && s.x <= plot.x.max) stationMark(doc, plot.px(s.x), box.top, 3.5);
  plot.frame();
  plot.xAxis('Distance along line x (m)');
  plot.yAxis('Depth below ground (m)', { target: 5 });
  label(doc, 'bottom of the model', plot.right - 4, plot.py(bottom[bottom.length - 1]) - 3, { size: SIZE.tick, align: 'right', colour: COLOUR.muted });
}
