/** Section "Travel-time curves": observed picks and computed times for every shot, residuals below. */
import type { ReportContext } from './context';
import { shotColour } from './colour';
import { caption, captionHeight, paragraph, sectionHeading } from './flow';
import { plain } from './format';
import { lineRange } from './line-geometry';
import { dot, shotMark } from './markers';
import { Plot } from './plot';
import { COLOUR, CONTENT, SIZE } from './style';
import { label, textWidth } from './text';
import { niceStep } from './ticks';
import type { ReportInput } from './types';

type Row = ReportInput['residuals'][number];

export function drawCurves(ctx: ReportContext): void {
  const { doc, input, model } = ctx;
  sectionHeading(ctx, 'curves');
  paragraph(ctx, 'First-arrival times picked in the field (points) against the times computed on the model (lines), for every shot. The lower panel shows the residuals, observed minus computed: points above zero arrived later in the field than in the model.');
  ctx.y += 4;

  const text =
    'Travel-time curves: observed picks (filled points; hollow grey points are picks excluded from the misfit) and computed times (lines, joined through 0 ms at the shot), coloured by shot; shots marked by stars on the time axis. ' +
    'Lower panel: residual observed − computed (ms) with the band ±σ of the pick uncertainty (grey). Distance x along the line in metres.';
  const legendRows = Math.ceil((input.shots.length + 1) / 7);
  const legendH = 4 + 12 * legendRows;
  const mainH = 280;
  const resH = 110;
  const total = legendH + mainH + 14 + resH + 44;
  ctx.ensureSpace(total + captionHeight(ctx, text));
  const left = CONTENT.left + 44;
  const width = CONTENT.width - 52;
  const top = ctx.y;

  const byShot = groupByShot(input);
  drawLegend(ctx, byShot.map((s) => s.shotId), left, top + 4);

  const rows = input.residuals;
  let tMax = 0;
  for (const r of rows) tMax = Math.max(tMax, r.observedMs, r.computedMs);
  const tStep = niceStep(tMax / 6);
  const main = new Plot(doc, { left, top: top + legendH, width, height: mainH }, lineRange(model), { min: 0, max: Math.max(tStep, Math.ceil((tMax * 1.04) / tStep) * tStep) });
  let rMax = 0;
  for (const r of rows) rMax = Math.max(rMax, Math.abs(r.residualMs));
  const rLim = Math.max(1, Math.ceil((rMax * 1.1) / niceStep(rMax / 3 || 1)) * niceStep(rMax / 3 || 1));
  const res = new Plot(doc, { left, top: main.bottom + 14, width, height: resH }, lineRange(model), { min: -rLim, max: rLim });

  // Light grid on the time panel.
  main.clip();
  doc.save().lineWidth(0.35).strokeColor(COLOUR.rule);
  for (let t = tStep; t < main.y.max; t += tStep) doc.moveTo(left, main.py(t)).lineTo(main.right, main.py(t));
  doc.stroke().restore();
  byShot.forEach((s, i) => {
    const colour = shotColour(i);
    const pts: [number, number][] = s.rows.map((r) => [r.receiverX, r.computedMs]);
    if (s.sourceX !== null) pts.push([s.sourceX, 0]);
    pts.sort((a, b) => a[0] - b[0]);
    doc.save().lineWidth(0.9).strokeColor(colour);
    main.polyline(pts.flat());
    doc.stroke().restore();
    for (const r of s.rows) dot(doc, main.px(r.receiverX), main.py(r.observedMs), r.excluded ? 1.9 : 1.7, r.excluded ? COLOUR.excluded : colour, r.excluded);
  });
  main.restore();
  byShot.forEach((s, i) => {
    if (s.sourceX !== null && s.sourceX >= main.x.min && s.sourceX <= main.x.max) shotMark(doc, main.px(s.sourceX), main.bottom, 4, shotColour(i));
  });
  main.frame();
  main.xAxis(null, { labels: false });
  main.yAxis('Travel time (ms)', { target: 6 });

  // Residual panel: ±σ band, zero line, points.
  const sigmas = rows.map((r) => r.sigmaMs).sort((a, b) => a - b);
  const sigma = sigmas.length ? sigmas[sigmas.length >> 1] : null;
  res.clip();
  if (sigma) doc.save().fillColor(COLOUR.faint).rect(left, res.py(sigma), width, res.py(-sigma) - res.py(sigma)).fill().restore();
  doc.save().lineWidth(0.6).strokeColor(COLOUR.muted).moveTo(left, res.py(0)).lineTo(res.right, res.py(0)).stroke().restore();
  byShot.forEach((s, i) => {
    for (const r of s.rows) dot(doc, res.px(r.receiverX), res.py(r.residualMs), r.excluded ? 1.9 : 1.6, r.excluded ? COLOUR.excluded : shotColour(i), r.excluded);
  });
  res.restore();
  res.frame();
  res.xAxis('Distance along line x (m)');
  res.yAxis('Residual (ms)', { target: 4 });
  if (sigma) {
    const uniform = sigmas[0] === sigmas[sigmas.length - 1];
    label(doc, `±σ = ${plain(sigma, 2)} ms${uniform ? '' : ' (median)'}`, res.right - 4, res.box.top + 4, { size: SIZE.tick, align: 'right', valign: 'top', colour: COLOUR.muted });
  }
  ctx.y = res.bottom + 44;
  caption(ctx, 'Figure', text);
}

function groupByShot(input: ReportInput): { shotId: string; sourceX: number | null; rows: Row[] }[] {
  const order = new Map<string, { shotId: string; sourceX: number | null; rows: Row[] }>();
  for (const s of input.shots) order.set(s.shotId, { shotId: s.shotId, sourceX: s.sourceX, rows: [] });
  for (const r of input.residuals) {
    let g = order.get(r.shotId);
    if (!g) order.set(r.shotId, (g = { shotId: r.shotId, sourceX: null, rows: [] }));
    g.rows.push(r);
  }
  for (const g of order.values()) g.rows.sort((a, b) => a.receiverX - b.receiverX);
  return [...order.values()];
}

/** One row of swatches (wrapping if the shots do not fit); returns its height. */
function drawLegend(ctx: ReportContext, shotIds: string[], left: number, top: number): number {
  const { doc } = ctx;
  let x = left;
  let y = top;
  shotIds.forEach((id, i) => {
    const colour = shotColour(i);
    const itemWidth = 18 + textWidth(doc, `shot ${id}`, SIZE.small) + 12;
    if (x > left && x + itemWidth > CONTENT.right) {
      x = left;
      y += 12;
    }
    doc.save().lineWidth(0.9).strokeColor(colour).moveTo(x, y).lineTo(x + 14, y).stroke().restore();
    dot(doc, x + 7, y, 1.7, colour);
    const text = `shot ${id}`;
    label(doc, text, x + 18, y, { size: SIZE.small, valign: 'middle' });
    x += 18 + textWidth(doc, text, SIZE.small) + 12;
  });
  if (x + 80 > CONTENT.right) {
    x = left;
    y += 12;
  }
  dot(doc, x + 7, y, 1.9, COLOUR.excluded, true);
  label(doc, 'excluded pick', x + 13, y, { size: SIZE.small, valign: 'middle', colour: COLOUR.muted });
  return y - top + 12;
}
