/**
 * Section "Layer interpretation behind the model": present when the reported model was saved from
 * the layer methods (its `interpretation` record, shared/layers/record.ts): how it was made, the
 * layer table, the depth under each geophone, the method's warnings and its limits.
 */
import { readInterpretationRecord, type InterpretationRecord } from '../../shared/layers/record';
import type { ReportContext } from './context';
import { bullets, caption, paragraph, sectionHeading } from './flow';
import { fixed, plain } from './format';
import { drawTable } from './table';

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
