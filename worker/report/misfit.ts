/** Section "Misfit": run statistics, a table by shot and the shot × receiver residual heatmap. */
import { colourAt, hex, RESIDUAL_STOPS, type Rgb } from './colour';
import { horizontalColourBar } from './colour-bar';
import type { PageFlow, ReportContext } from './context';
import { caption, captionHeight, labelValues, paragraph, sectionHeading } from './flow';
import { count, fixed, ms, plain } from './format';
import { encodeRgbPng } from './png';
import { COLOUR, CONTENT, SIZE } from './style';
import { drawTable } from './table';
import { label, textWidth } from './text';
import type { ReportResidual, RunStatsJson } from './types';
import { niceStep } from './ticks';

export function drawMisfit(ctx: ReportContext): void {
  sectionHeading(ctx, 'misfit');
  drawMisfitBody(ctx, ctx.input.run.stats, ctx.input.residuals, ctx.input.shots);
}

/** The statistics the misfit section prints. */
export type MisfitStats = Pick<RunStatsJson, 'rms_ms' | 'chi2' | 'max_abs_residual_ms' | 'mean_residual_ms' | 'picks' | 'excluded' | 'shots' | 'by_shot'>;

/** Everything under the heading: statistics, the table by shot and the heatmap (also used by the inversion report). */
export function drawMisfitBody(ctx: PageFlow, s: MisfitStats, residuals: readonly ReportResidual[], shots: readonly { shotId: string }[]): void {
  paragraph(
    ctx,
    'Residual r = observed − computed for every pick. RMS misfit = √(Σr²/N); χ² per datum = Σ(r/σ)²/N with σ the pick uncertainty, about 1 when the model explains the picks to within their stated uncertainty, well above 1 when it does not. Excluded picks are shown but do not count.',
  );
  labelValues(ctx, [
    ['RMS misfit', `${ms(s.rms_ms)} ms`],
    ['χ² per datum', fixed(s.chi2, 2)],
    ['Largest |residual|', `${ms(s.max_abs_residual_ms)} ms`],
    ['Mean residual (bias)', `${ms(s.mean_residual_ms)} ms`],
    ['Picks used', count(s.picks)],
    ['Picks excluded', count(s.excluded)],
    ['Shots', count(s.shots)],
  ], { labelWidth: 150 });
  ctx.y += 8;

  ctx.ensureSpace(60 + Math.min(s.by_shot.length, 10) * 13);
  const table = caption(ctx, 'Table', 'Misfit by shot (picks used only).');
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Shot', width: 70 },
      { title: 'Picks', width: 55, align: 'right' },
      { title: 'RMS (ms)', width: 70, align: 'right' },
      { title: 'χ² per datum', width: 80, align: 'right' },
      { title: 'Max |r| (ms)', width: 80, align: 'right' },
      { title: 'Mean r (ms)', width: 80, align: 'right' },
    ],
    rows: s.by_shot.map((b) => [b.shotId, String(b.count), ms(b.rms_ms), fixed(b.chi2, 2), ms(b.max_abs_residual_ms), ms(b.mean_residual_ms)]),
  });
  drawHeatmap(ctx, residuals, shots);
}

function drawHeatmap(ctx: PageFlow, residuals: readonly ReportResidual[], shotList: readonly { shotId: string }[]): void {
  const { doc } = ctx;
  const shots = [...new Set([...shotList.map((s) => s.shotId), ...residuals.map((r) => r.shotId)])];
  const xs = [...new Set(residuals.map((r) => r.receiverX))].sort((a, b) => a - b);
  if (shots.length === 0 || xs.length === 0) {
    paragraph(ctx, 'No residuals to show.');
    return;
  }
  const cell = new Map<string, { value: number; excluded: boolean }>();
  let maxAbs = 0;
  for (const r of residuals) {
    cell.set(`${r.shotId}\u0000${r.receiverX}`, { value: r.residualMs, excluded: r.excluded });
    if (!r.excluded) maxAbs = Math.max(maxAbs, Math.abs(r.residualMs));
  }
  const step = niceStep(maxAbs / 2 || 0.5);
  const limit = Math.max(step, Math.ceil(maxAbs / step - 1e-9) * step);

  const text = `Residuals (observed − computed, ms) by shot (rows) and receiver position (columns): blue where the pick arrived earlier than computed, red where later, white at zero; the scale is symmetric, ±${plain(limit, 3)} ms. Grey: pick excluded; pale: no pick.`;
  const labelRoom = 44;
  const left = CONTENT.left + labelRoom;
  const width = CONTENT.width - labelRoom - 8;
  const rowH = Math.max(7, Math.min(16, 260 / shots.length));
  const height = rowH * shots.length;
  ctx.ensureSpace(height + 100 + captionHeight(ctx, text));
  const top = ctx.y + 6;

  // One block of k × k pixels per cell, so viewers that smooth images keep the cells sharp.
  const k = 6;
  const w = xs.length * k;
  const h = shots.length * k;
  const rgb = new Uint8Array(w * h * 3);
  const missing: Rgb = [241, 243, 244];
  const excluded: Rgb = [170, 178, 184];
  shots.forEach((id, row) => {
    xs.forEach((x, col) => {
      const c = cell.get(`${id}\u0000${x}`);
      const colour = !c ? missing : c.excluded ? excluded : colourAt(RESIDUAL_STOPS, 0.5 + c.value / (2 * limit));
      for (let dy = 0; dy < k; dy++) {
        for (let dx = 0; dx < k; dx++) {
          const p = 3 * ((row * k + dy) * w + col * k + dx);
          rgb[p] = colour[0];
          rgb[p + 1] = colour[1];
          rgb[p + 2] = colour[2];
        }
      }
    });
  });
  doc.image(encodeRgbPng(w, h, rgb), left, top, { width, height });
  doc.save().lineWidth(0.6).strokeColor(COLOUR.ink).rect(left, top, width, height).stroke().restore();

  // Row labels (shots) and column labels (receiver x) where they do not crowd.
  const colW = width / xs.length;
  const rowLabelStep = Math.ceil((SIZE.tick + 2) / rowH);
  shots.forEach((id, row) => {
    if (row % rowLabelStep === 0) label(doc, id, left - 5, top + (row + 0.5) * rowH, { size: SIZE.tick, align: 'right', valign: 'middle' });
  });
  label(doc, 'Shot', left - 5 - Math.max(...shots.map((id) => textWidth(doc, id, SIZE.tick))) - 8, top + height / 2, { size: SIZE.small, align: 'center', valign: 'baseline', rotate: 90, colour: COLOUR.muted });
  // Every k-th column, k the smallest of 1, 2, 4, 5, 10, … at which the widest label clears its
  // neighbours (with a regular spread such strides land on round positions).
  const widest = Math.max(...xs.map((x) => textWidth(doc, plain(x, 2), SIZE.tick)));
  const need = (widest + 8) / colW;
  const stride = [1, 2, 4, 5, 10, 20, 40, 50, 100, 200, 500].find((k) => k >= need) ?? Math.ceil(need);
  doc.save().lineWidth(0.5).strokeColor(COLOUR.ink);
  xs.forEach((x, col) => {
    if (col % stride !== 0) return;
    const cx = left + (col + 0.5) * colW;
    doc.moveTo(cx, top + height).lineTo(cx, top + height + 3).stroke();
    label(doc, plain(x, 2), cx, top + height + 5, { size: SIZE.tick, align: 'center', valign: 'top' });
  });
  doc.restore();
  label(doc, 'Receiver position x (m)', left + width / 2, top + height + 18, { size: SIZE.small, align: 'center', valign: 'top', colour: COLOUR.muted });

  // Scale bar and the two swatches.
  const barTop = top + height + 38;
  const barW = 200;
  const barLeft = left + (width - barW) / 2 - 60;
  horizontalColourBar(doc, { stops: RESIDUAL_STOPS, min: -limit, max: limit, title: 'Residual (ms)', ticks: [-limit, -limit / 2, 0, limit / 2, limit] }, barLeft, barTop, barW, 8);
  const swatch = (x: number, c: Rgb, t: string) => {
    doc.save().fillColor(hex(c)).lineWidth(0.5).strokeColor(COLOUR.ink).rect(x, barTop, 12, 8).fillAndStroke().restore();
    label(doc, t, x + 16, barTop + 4, { size: SIZE.small, valign: 'middle', colour: COLOUR.muted });
  };
  swatch(barLeft + barW + 30, excluded, 'excluded');
  swatch(barLeft + barW + 90, missing, 'no pick');
  ctx.y = barTop + 44;
  caption(ctx, 'Figure', text);
}
