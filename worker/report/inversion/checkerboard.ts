/**
 * Section "Resolution: checkerboard test": the ±A pattern put on the final model and the pattern
 * the same inversion recovered from synthetic times, side by side on one diverging scale, with
 * the correlation between them over the covered nodes.
 */
import { colourAt, RESIDUAL_STOPS, type Rgb } from '../colour';
import { horizontalColourBar } from '../colour-bar';
import { caption, captionHeight, paragraph, sectionHeading } from '../flow';
import { fixed, plain } from '../format';
import { contourLines } from '../../../shared/geometry/contour-lines';
import { Plot } from '../plot';
import { encodeRgbPng } from '../png';
import { COLOUR, CONTENT, SIZE } from '../style';
import { label } from '../text';
import { sectionLayoutFor, type SectionLayout } from '../velocity-figure';
import { nodeFloats, type InversionContext } from './context';
import { MASK_GREY } from './figure';

/** How well a correlation says the pattern came back (common practice, no source). */
export function recoveryWords(r: number): string {
  if (r >= 0.7) return 'well recovered';
  if (r >= 0.4) return 'partly recovered';
  return 'poorly recovered';
}

/** The correlation as printed, or null when there is none. */
export function correlationValue(r: number | null): number | null {
  return r !== null && Number.isFinite(r) ? r : null;
}

export function drawCheckerboard(ctx: InversionContext): void {
  const cb = ctx.input.inversion.checkerboard;
  if (!cb) return;
  sectionHeading(ctx, 'checkerboard');
  const pct = plain(100 * cb.amplitude, 1);
  const rv = correlationValue(cb.correlation);
  const r = fixed(rv, 2);
  paragraph(
    ctx,
    `How large a feature can these picks resolve? The final model was given a pattern of squares ${plain(cb.size, 2)} m across, alternately ${pct} % faster and slower; travel times were computed on it for the same shots and geophones, with noise of each pick's uncertainty, and inverted with the same settings. ` +
      `The recovered pattern (right) is the result divided by the final model, minus one. Where it matches the true pattern (left), features of this size are resolved; where it is smeared or faint, they are not.`,
  );
  paragraph(
    ctx,
    rv === null
      ? 'The correlation of the recovered with the true pattern could not be computed: the recovered pattern is flat (the test inversion did not move from the final model), so the test says nothing about resolution.'
      : `Correlation of the recovered with the true pattern over the covered nodes: r = ${r}, the pattern is ${recoveryWords(rv)}.`,
  );
  ctx.y += 4;

  const gap = 26;
  const width = (CONTENT.width - 40 - gap) / 2;
  const place = (top: number) => sectionLayoutFor(ctx.grid, ctx.ground, CONTENT.left + 34, top, width, 110, 200);
  const text =
    `Checkerboard test with ${plain(cb.size, 2)} m squares of ±${pct} %: true pattern (left) and pattern recovered by the inversion (right), relative velocity change in per cent on one scale (blue slower, red faster). ` +
    `Grey on the right: nodes crossed by less than ${plain(ctx.threshold, 2)} m of ray; dotted: their boundary. ${rv === null ? 'No correlation (flat recovered pattern)' : `Correlation r = ${r} over covered nodes`}${rv !== null && cb.coverageThreshold !== undefined ? ` (at least ${plain(cb.coverageThreshold, 2)} m of ray)` : ''}.`;
  ctx.ensureSpace(place(ctx.y).box.height + 110 + captionHeight(ctx, text));
  const left = place(ctx.y + 14);
  const right = { ...left, box: { ...left.box, left: left.box.left + width + gap } };
  const limit = 100 * cb.amplitude;
  panel(ctx, left, nodeFloats(cb.truePattern), false, 'true pattern');
  panel(ctx, right, nodeFloats(cb.recovered), true, 'recovered');
  const barTop = left.box.top + left.box.height + 36;
  horizontalColourBar(ctx.doc, { stops: RESIDUAL_STOPS, min: -limit, max: limit, title: 'Velocity change (%)', ticks: [-limit, -limit / 2, 0, limit / 2, limit] }, CONTENT.left + CONTENT.width / 2 - 100, barTop, 200, 8);
  ctx.y = barTop + 44;
  caption(ctx, 'Figure', text);
}

function panel(ctx: InversionContext, layout: SectionLayout, pattern: Float32Array, mask: boolean, title: string): void {
  const { doc, grid } = ctx;
  const plot = new Plot(doc, layout.box, ctx.xRange, { min: layout.zBottom, max: layout.zTop });
  const amplitude = ctx.input.inversion.checkerboard!.amplitude;
  const rgb = new Uint8Array(pattern.length * 3);
  for (let i = 0; i < pattern.length; i++) {
    const c: Rgb = mask && ctx.active[i] && !ctx.covered(i) ? MASK_GREY : colourAt(RESIDUAL_STOPS, 0.5 + pattern[i] / (2 * amplitude));
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
  doc.image(encodeRgbPng(grid.nx, grid.nz, rgb), x0, y0, { width: plot.px(grid.x0 + (grid.nx - 0.5) * grid.dx) - x0, height: plot.py(grid.z0 - (grid.nz - 0.5) * grid.dz) - y0 });
  doc.restore();
  const coverageField = Float32Array.from(ctx.coverage, (c, i) => (ctx.active[i] ? c : Number.NaN));
  doc.save().lineWidth(0.5).strokeColor(COLOUR.muted).dash(1.5, { space: 1.5 });
  for (const l of contourLines(coverageField, grid, ctx.threshold)) plot.polyline(l);
  doc.stroke().undash().restore();
  doc.save().lineWidth(0.8).strokeColor(COLOUR.ink);
  plot.polyline(ctx.ground);
  doc.stroke().restore();
  plot.restore();
  plot.frame();
  plot.xAxis('x (m)', { target: 4 });
  plot.yAxis('Elevation (m)', { target: 4 });
  label(doc, title, plot.box.left + plot.box.width / 2, plot.box.top - 4, { size: SIZE.small, align: 'center', valign: 'baseline', colour: COLOUR.muted });
}
