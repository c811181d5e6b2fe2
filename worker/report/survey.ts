/** Section "The survey": the line in numbers, acquisition notes, a layout profile and the shot table. */
import type { ReportContext } from './context';
import { caption, captionHeight, paragraph, sectionHeading, subheading } from './flow';
import { count, fixed, plain } from './format';
import { groundLine, lineRange, picksPerShot, stationSpacing } from './line-geometry';
import { shotMark, stationMark } from './markers';
import { Plot } from './plot';
import { COLOUR, CONTENT, SIZE } from './style';
import { drawTable } from './table';
import { label, textWidth } from './text';

export function drawSurvey(ctx: ReportContext): void {
  const { input } = ctx;
  sectionHeading(ctx, 'survey');
  const xs = input.stations.map((s) => s.x);
  const spacing = stationSpacing(input.stations);
  const summary = input.stations.length
    ? `Line ${input.line.name}: ${input.stations.length} stations from x = ${plain(Math.min(...xs))} m to ${plain(Math.max(...xs))} m` +
      (spacing ? ` (spacing ${plain(spacing)} m)` : '') +
      `, ${input.shots.length} shots, ${count(input.residuals.length)} first-arrival picks.`
    : `Line ${input.line.name}: no stations recorded, ${input.shots.length} shots.`;
  paragraph(ctx, summary);
  const lineNotes = input.line.notes.trim();
  if (lineNotes && lineNotes !== input.acquisitionNotes.trim()) paragraph(ctx, lineNotes, { colour: COLOUR.muted });

  subheading(ctx, 'Acquisition notes');
  paragraph(ctx, input.acquisitionNotes.trim() || 'No acquisition notes were recorded for this report.');
  ctx.y += 6;

  const text = 'Station and shot layout along the line: ground surface of the model (line), stations (triangles) and shots (stars) at their elevations. Distance x along the line and elevation in metres; the vertical scale is exaggerated.';
  const height = 130;
  ctx.ensureSpace(height + 60 + captionHeight(ctx, text));
  drawLayout(ctx, { left: CONTENT.left + 44, top: ctx.y + 14, width: CONTENT.width - 52, height });
  ctx.y += height + 14 + 40;
  caption(ctx, 'Figure', text);

  const counts = picksPerShot(input);
  const rows = input.shots.map((s) => {
    const c = counts.get(s.shotId) ?? { picks: 0, excluded: 0 };
    return [s.shotId, fixed(s.sourceX, 2), fixed(s.sourceZ, 2), String(c.picks), String(c.excluded)];
  });
  ctx.ensureSpace(40 + Math.min(rows.length, 8) * 14);
  const table = caption(ctx, 'Table', 'Shots: position along the line, source elevation, number of picks and how many of them were excluded from the misfit.');
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Shot', width: 70 },
      { title: 'x (m)', width: 70, align: 'right' },
      { title: 'z (m)', width: 70, align: 'right' },
      { title: 'Picks', width: 60, align: 'right' },
      { title: 'Excluded', width: 60, align: 'right' },
    ],
    rows,
  });
}

function drawLayout(ctx: ReportContext, box: { left: number; top: number; width: number; height: number }): void {
  const { doc, input, model } = ctx;
  const ground = groundLine(model, input.model.file);
  const zs = [...input.stations.map((s) => s.z), ...input.shots.map((s) => s.sourceZ)];
  for (let i = 1; i < ground.length; i += 2) zs.push(ground[i]);
  const zMin = Math.min(...zs);
  const zMax = Math.max(...zs);
  const pad = Math.max(0.5, 0.25 * (zMax - zMin));
  const plot = new Plot(doc, box, lineRange(model), { min: zMin - pad, max: zMax + 1.6 * pad });

  plot.clip();
  doc.lineWidth(0.9).strokeColor(COLOUR.ink);
  plot.polyline(ground);
  doc.stroke();
  for (const s of input.stations) stationMark(doc, plot.px(s.x), plot.py(s.z), 4.5);
  for (const s of input.shots) shotMark(doc, plot.px(s.sourceX), plot.py(s.sourceZ) - 5, 4.5);
  plot.restore();

  // Shot names above their stars, station numbers below the axis where there is room.
  for (const s of input.shots) label(doc, s.shotId, plot.px(s.sourceX), plot.py(s.sourceZ) - 12, { size: SIZE.small, align: 'center', colour: COLOUR.shot });
  let lastRight = -Infinity;
  for (const s of [...input.stations].sort((a, b) => a.x - b.x)) {
    const x = plot.px(s.x);
    const text = String(s.station);
    const w = textWidth(doc, text, SIZE.small - 1);
    if (x - w / 2 < lastRight + 6 || x < box.left || x > box.left + box.width) continue;
    label(doc, text, x, box.top + 4, { size: SIZE.small - 1, align: 'center', valign: 'top', colour: COLOUR.muted });
    lastRight = x + w / 2;
  }
  plot.frame();
  plot.xAxis('Distance along line x (m)');
  plot.yAxis('Elevation (m)', { target: 5 });
}
