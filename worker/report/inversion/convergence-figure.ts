/**
 * Convergence chart, vector only: χ² per datum on a logarithmic axis with the target range 0.9–1.1
 * shaded (left) and the RMS misfit in ms (right), both against the iteration number.
 */
import { dot } from '../markers';
import { Plot, type Box } from '../plot';
import { COLOUR, SIZE } from '../style';
import { label } from '../text';
import { niceStep } from '../ticks';
import type { InversionContext } from './context';

/** Round values 1, 2, 5 per decade inside [min, max] (the usual log-axis labels). */
export function logTicks(min: number, max: number): number[] {
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(min)) - 1; e <= Math.ceil(Math.log10(max)); e++) {
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** e;
      if (v >= min * (1 - 1e-9) && v <= max * (1 + 1e-9)) out.push(Number(v.toPrecision(6)));
    }
  }
  return out;
}

export function drawConvergenceChart(ctx: InversionContext, left: number, top: number, width: number, height: number): void {
  const { doc } = ctx;
  const h = ctx.input.inversion.history;
  const gap = 56;
  const w = (width - gap) / 2;
  const iterations = { min: 0, max: Math.max(1, h[h.length - 1].iteration) };
  // Iterations are whole numbers: never a tick between two (a one-step inversion got 0, 0.2, … 1).
  const xStep = Math.max(1, niceStep(iterations.max / 8));

  // χ², logarithmic: plotted as log10 on a linear scale.
  const chi = h.map((r) => Math.max(r.chi2, 1e-3));
  const lo = Math.min(0.8, ...chi) / 1.15;
  const hi = Math.max(1.2, ...chi) * 1.15;
  const left1: Box = { left, top, width: w, height };
  const p1 = new Plot(doc, left1, iterations, { min: Math.log10(lo), max: Math.log10(hi) });
  p1.clip();
  const band = [p1.py(Math.log10(1.1)), p1.py(Math.log10(0.9))];
  doc.save().fillColor('#dde6ec').rect(left1.left, band[0], w, band[1] - band[0]).fill().restore();
  series(doc, p1, h.map((r, i) => [r.iteration, Math.log10(chi[i])]));
  p1.restore();
  p1.frame();
  for (const v of logTicks(lo, hi)) {
    const y = p1.py(Math.log10(v));
    doc.save().lineWidth(0.5).strokeColor(COLOUR.ink).moveTo(left1.left, y).lineTo(left1.left - 3, y).stroke().restore();
    label(doc, String(v), left1.left - 5, y, { size: SIZE.tick, align: 'right', valign: 'middle' });
  }
  label(doc, 'χ² per datum', left1.left - 30, top + height / 2, { size: SIZE.small, align: 'center', valign: 'baseline', rotate: 90, colour: COLOUR.muted });
  label(doc, 'target 0.9–1.1', left1.left + 4, band[1] + 3, { size: SIZE.tick - 0.5, align: 'left', valign: 'top', colour: COLOUR.muted });
  iterationAxis(p1, xStep);

  // RMS, linear from zero.
  const rmsMax = Math.max(...h.map((r) => r.rmsMs)) * 1.1 || 1;
  const p2 = new Plot(doc, { left: left + w + gap, top, width: w, height }, iterations, { min: 0, max: rmsMax });
  p2.clip();
  series(doc, p2, h.map((r) => [r.iteration, r.rmsMs]));
  p2.restore();
  p2.frame();
  p2.yAxis('RMS misfit (ms)', { target: 4 });
  iterationAxis(p2, xStep);
}

function series(doc: PDFKit.PDFDocument, plot: Plot, points: [number, number][]): void {
  doc.save().lineWidth(1).strokeColor(COLOUR.accent);
  plot.polyline(points.flat());
  doc.stroke().restore();
  for (const [x, y] of points) dot(doc, plot.px(x), plot.py(y), 1.8, COLOUR.accent);
}

function iterationAxis(plot: Plot, step: number): void {
  const { doc } = plot;
  for (let v = 0; v <= plot.x.max + 1e-9; v += step) {
    const x = plot.px(v);
    doc.save().lineWidth(0.5).strokeColor(COLOUR.ink).moveTo(x, plot.bottom).lineTo(x, plot.bottom + 3).stroke().restore();
    label(doc, String(v), x, plot.bottom + 5, { size: SIZE.tick, align: 'center', valign: 'top' });
  }
  label(doc, 'Iteration', plot.box.left + plot.box.width / 2, plot.bottom + 18, { size: SIZE.small, align: 'center', valign: 'top', colour: COLOUR.muted });
}
