/**
 * Section "Layer interpretation behind the model": present when the reported model was saved from
 * the layer methods (its `interpretation` record, shared/layers/record.ts): how it was made, the
 * layer table, the depth under each geophone, the method's warnings and its limits.
 */
import { readInterpretationRecord, type InterpretationRecord } from '../../shared/layers/record';
import type { ReportContext } from './context';
import { bullets, caption, captionHeight, paragraph, sectionHeading } from './flow';
import { fixed, plain } from './format';
import { drawTable } from './table';
import { groundAt } from '../../shared/boreholes';
import { lineRange } from './line-geometry';
import { dot, holeMark, shotMark, stationMark } from './markers';
import { Plot } from './plot';
import { COLOUR, CONTENT, SIZE } from './style';
import { label } from './text';
import { niceStep } from './ticks';

const METHOD_TEXT: Record<InterpretationRecord['method'], string> = {
  grm: 'the generalized reciprocal method (Palmer 1980, 1981): velocity-analysis and time-depth functions from reversed shots, at the XY whose velocity-analysis functions lie closest to straight lines',
  'plus-minus': 'the plus–minus method (Hagedoorn 1959): T⁺ and T⁻ from reversed shots at each geophone, the refractor velocity from the slope of T⁻',
  intercept: 'the intercept-time method: per shot, the refractor line under the shot from its intercept time, with dip from reversed shots',
};

/** Where each method stops being reliable; common practice, no source beyond the methods' own papers. */
const METHOD_LIMIT: Record<InterpretationRecord['method'], string> = {
  grm: 'The GRM assumes the refractor is locally planar over the distance XY and the velocity above it uniform along the line; an optimum XY much larger or smaller than expected points at a hidden layer or lateral velocity changes.',
  'plus-minus': 'Plus–minus assumes the refractor is planar between the points where rays leave it for each geophone; over dips beyond about 10° or sharp relief it smooths and shifts the refractor.',
  intercept: 'The intercept-time method assumes a planar refractor under each shot; it gives depths near the shots only, and none of the relief between them.',
};

export function drawLayers(ctx: ReportContext): void {
  const record = readInterpretationRecord(ctx.input.model.file);
  if (!record) return;
  sectionHeading(ctx, 'layers');
  const layers = record.velocities.length;
  paragraph(
    ctx,
    `The model "${ctx.input.model.name}" was made from the picks ${record.picks} by ${METHOD_TEXT[record.method]}${record.xy !== null ? `; XY = ${plain(record.xy, 2)} m` : ''}. ` +
      `${layers} layers; ${record.handAssigned ? `${record.handAssigned} picks were assigned to a refractor by hand, the rest` : 'every pick was'} assigned by the automatic suggestion from the slope breaks of the travel-time curves. ` +
      'Its interfaces are the refractor depths below, carried flat beyond the outermost geophones with a depth.',
  );
  ctx.y += 4;

  const rows = record.velocities.map((v, k) => {
    const base = record.depths.filter((d) => d[1] === k + 1).map((d) => d[2]);
    const depth = base.length ? `${fixed(Math.min(...base), 1)} – ${fixed(Math.max(...base), 1)}` : '—';
    return [k === 0 ? '1 (top)' : `${k + 1} (below refractor ${k})`, plain(v, 0), k === layers - 1 ? '—' : depth];
  });
  ctx.ensureSpace(60);
  caption(ctx, 'Table', 'Layers found: velocity and the depth of the layer\'s base below the ground over the geophones with a depth (m).');
  ctx.y -= 8;
  drawTable(ctx, {
    columns: [
      { title: 'Layer', width: 140 },
      { title: 'Velocity (m/s)', width: 90, align: 'right' },
      { title: 'Depth to base (m)', width: 110, align: 'right' },
    ],
    rows,
  });

  drawDepthFigure(ctx, record);

  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', 'Vertical depth of each refractor below the ground at each geophone (m), as interpreted.');
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    blocks: 3,
    size: 8,
    columns: [
      { title: 'x (m)', width: 50, align: 'right' },
      { title: 'Refr.', width: 34, align: 'right' },
      { title: 'Depth', width: 48, align: 'right' },
    ],
    rows: record.depths.map(([x, n, d]) => [fixed(x, 2), String(n), fixed(d, 2)]),
  });

  const items = [
    ...record.warnings.map((w) => ({ lead: 'From the data:', text: `${w[0].toUpperCase()}${w.slice(1)}.` })),
    { lead: 'Method limits.', text: METHOD_LIMIT[record.method] },
    { lead: 'Hidden layers.', text: 'A layer slower than the one above it, or a thin layer overtaken before its head wave arrives first, sends no first arrivals and is missed; the depths below it then come out too deep or too shallow, and nothing in the picks shows it.' },
    { lead: 'Coverage.', text: 'Depths are found only between reversed shots whose picks reach the refractor; outside them the interfaces of the model are extended, not interpreted.' },
  ];
  ctx.y += 4;
  bullets(ctx, items);
}

/** Colours of refractors 1, 2, … in the depth figure (dark enough on white; our own choice). */
const REFRACTOR_COLOURS = ['#1d4e89', '#8a3b12', '#2f6b3a'];

/**
 * The depth section of the interpretation: the model's ground, each refractor at its interpreted
 * elevation under the geophones (a point per geophone), the shots, and the boreholes and trial pits
 * with their logged contacts, at a modest vertical exaggeration stated in the caption.
 */
function drawDepthFigure(ctx: ReportContext, record: InterpretationRecord): void {
  const { doc, model, input } = ctx;
  const x = lineRange(model);
  const refractors = [...new Set(record.depths.map((d) => d[1]))].sort((a, b) => a - b);
  const ground = (at: number) => model.surfaceZ(at);
  const zs = [...record.depths.map(([at, , d]) => ground(at) - d), ...input.stations.map((s) => s.z)];
  for (const h of input.boreholes ?? []) zs.push((h.groundZ ?? groundAt(input.stations, h.x) ?? ground(h.x)) - Math.max(0, ...h.contacts.map((c) => c.depth)));
  const step = niceStep((Math.max(...zs) - Math.min(...zs)) / 4 || 1);
  const y = { min: Math.floor(Math.min(...zs) / step) * step - step / 2, max: Math.ceil(Math.max(...zs) / step) * step + step / 2 };
  const width = CONTENT.width - 52;
  // As flat as the page allows, at most 1:1 steeper than true scale by a whole factor.
  const trueHeight = (width * (y.max - y.min)) / (x.max - x.min);
  const exaggeration = Math.max(1, Math.ceil(120 / Math.max(trueHeight, 1e-6)));
  const height = Math.min(220, trueHeight * exaggeration);
  const text =
    `Depth section of the interpretation: ground surface of the model (grey), ${refractors.map((n) => `refractor ${n}`).join(', ')} at the interpreted elevation under each geophone (points joined), stations as triangles, shots as stars` +
    `${input.boreholes?.length ? ', boreholes and trial pits as dark columns with a tick at each logged contact (longer at the top of rock)' : ''}. ` +
    `Elevation and distance along the line in metres; ${exaggeration === 1 ? 'true scale' : `vertical exaggeration ${exaggeration}:1`}.`;
  ctx.ensureSpace(height + 56 + captionHeight(ctx, text));
  const plot = new Plot(doc, { left: CONTENT.left + 44, top: ctx.y + 10, width, height }, x, y);
  plot.clip();
  const groundLine: number[] = [];
  for (let k = 0; k <= 200; k++) {
    const at = x.min + ((x.max - x.min) * k) / 200;
    groundLine.push(at, ground(at));
  }
  doc.save().lineWidth(1.2).strokeColor(COLOUR.muted);
  plot.polyline(groundLine);
  doc.stroke().restore();
  refractors.forEach((n, k) => {
    const pts = record.depths.filter((d) => d[1] === n).sort((a, b) => a[0] - b[0]);
    const colour = REFRACTOR_COLOURS[k % REFRACTOR_COLOURS.length];
    doc.save().lineWidth(1).strokeColor(colour);
    plot.polyline(pts.flatMap(([at, , d]) => [at, ground(at) - d]));
    doc.stroke().restore();
    for (const [at, , d] of pts) dot(doc, plot.px(at), plot.py(ground(at) - d), 1.4, colour);
  });
  plot.restore();
  for (const s of input.stations) if (s.x >= x.min && s.x <= x.max) stationMark(doc, plot.px(s.x), plot.py(s.z), 3.5);
  for (const s of input.shots) if (s.sourceX >= x.min && s.sourceX <= x.max) shotMark(doc, plot.px(s.sourceX), plot.py(s.sourceZ ?? ground(s.sourceX)), 3.5);
  for (const h of input.boreholes ?? []) {
    if (h.x < x.min || h.x > x.max) continue;
    const top = h.groundZ ?? groundAt(input.stations, h.x) ?? ground(h.x);
    const deepest = Math.max(0, ...h.contacts.map((c) => c.depth));
    holeMark(doc, plot.px(h.x), plot.py(top), plot.py(top - deepest), h.contacts.map((c) => ({ y: plot.py(top - c.depth), rockTop: c.rockTop })));
    label(doc, h.name, plot.px(h.x), plot.py(top) - 7, { size: SIZE.tick - 1, align: 'center' });
  }
  plot.frame();
  plot.xAxis('Distance along line x (m)');
  plot.yAxis('Elevation (m)', { target: 4 });
  ctx.y += height + 10 + 40;
  caption(ctx, 'Figure', text);
}
