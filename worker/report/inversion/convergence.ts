/** Section "Convergence": χ², RMS misfit and the smoothing weight of every iteration, and why it stopped. */
import { caption, captionHeight, paragraph, sectionHeading } from '../flow';
import { fixed, NONE } from '../format';
import { CONTENT } from '../style';
import { drawTable } from '../table';
import { drawConvergenceChart } from './convergence-figure';
import type { InversionContext } from './context';
import type { InversionReportInput } from './types';

export function stopReasonText(input: InversionReportInput): string {
  const inv = input.inversion;
  switch (inv.stopReason) {
    case 'target-misfit': return 'it stopped because χ² per datum reached the target range 0.9 to 1.1: the model explains the picks to within their stated uncertainty';
    case 'stalled': return 'it stopped because χ² per datum changed by less than 2 % from one step to the next: further steps would not fit the picks better';
    case 'iteration-cap': return `it stopped at the iteration cap of ${inv.settings.maxIterations}`;
    case 'cancelled': return 'it was cancelled; the model is the last one completed before that';
  }
}

/** A weight as printed: three significant figures (the automatic schedule halves and doubles it). */
export const weight = (w: number | null): string => (w === null ? NONE : String(Number(w.toPrecision(3))));

export function drawConvergence(ctx: InversionContext): void {
  const { input } = ctx;
  const h = input.inversion.history;
  const first = h[0];
  const last = h[h.length - 1];
  sectionHeading(ctx, 'convergence');
  paragraph(
    ctx,
    `Each iteration solves every shot on the current model, traces the rays and takes one regularised Gauss–Newton step (section ${sectionNo(ctx, 'method')}). ` +
      `χ² per datum = Σ(r/σ)²/N with r = observed − computed and σ each pick's uncertainty; about 1 when the model explains the picks to within their uncertainty. ` +
      `The misfit fell from χ² ${fixed(first.chi2, 2)} (RMS ${fixed(first.rmsMs, 2)} ms) on the starting model to χ² ${fixed(last.chi2, 2)} (RMS ${fixed(last.rmsMs, 2)} ms) after ${last.iteration} iteration${last.iteration === 1 ? '' : 's'}; ${stopReasonText(input)}.`,
  );
  if (last.chi2 > 1.5) {
    paragraph(ctx, `The final χ² per datum is well above 1: the model does not explain the picks to within their stated uncertainty. The uncertainties may be too small, some picks wrong, or the ground not two-dimensional along the line; treat the section with extra care.`);
  } else if (last.chi2 < 0.5) {
    paragraph(ctx, `The final χ² per datum is well below 1: the model fits the picks more closely than their stated uncertainty warrants, and may show features that are noise.`);
  }
  const text = 'Convergence: χ² per datum on a logarithmic scale, the target range 0.9 to 1.1 shaded (left), and RMS misfit in ms (right), after each iteration; iteration 0 is the starting model.';
  const height = 120;
  ctx.ensureSpace(height + 50 + captionHeight(ctx, text));
  drawConvergenceChart(ctx, CONTENT.left + 40, ctx.y + 8, CONTENT.width - 50, height);
  ctx.y += 8 + height + 36;
  caption(ctx, 'Figure', text);

  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', 'Convergence: χ² per datum and RMS misfit of the model after each iteration (iteration 0: the starting model), and the smoothing weight of the step that produced it.');
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Iteration', width: 70, align: 'right' },
      { title: 'χ² per datum', width: 90, align: 'right' },
      { title: 'RMS (ms)', width: 80, align: 'right' },
      { title: 'Smoothing weight', width: 100, align: 'right' },
    ],
    rows: h.map((r) => [String(r.iteration), fixed(r.chi2, 2), fixed(r.rmsMs, 2), weight(r.smoothing)]),
  });
}

export function sectionNo(ctx: InversionContext, key: Parameters<InversionContext['headingText']>[0]): string {
  return ctx.headingText(key).split(/\s+/)[0];
}
