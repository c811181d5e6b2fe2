/** Section "Misfit of the final model": the run report's statistics, table by shot and heatmap. */
import { computeResiduals, runStats } from '../../../shared/residuals';
import { sToMs } from '../../../shared/units';
import { paragraph, sectionHeading } from '../flow';
import { drawMisfitBody, type MisfitStats } from '../misfit';
import type { ReportResidual } from '../types';
import type { InversionContext } from './context';

/** The statistics of the picks used (excluded ones do not count), as a run stores them. */
export function misfitStats(residuals: readonly ReportResidual[], shots: number): MisfitStats {
  const used = residuals.filter((r) => !r.excluded);
  const s = runStats(computeResiduals(used.map((r) => ({ shotId: r.shotId, receiverX: r.receiverX, receiverZ: 0, observed: r.observedMs / 1000, computed: r.computedMs / 1000, sigma: r.sigmaMs / 1000 }))));
  const ms = (v: number | null) => (v === null ? null : sToMs(v));
  return {
    rms_ms: ms(s.run.rms),
    chi2: s.run.chi2,
    max_abs_residual_ms: ms(s.run.maxAbs),
    mean_residual_ms: ms(s.run.mean),
    picks: used.length,
    excluded: residuals.length - used.length,
    shots,
    by_shot: s.shots.map((b) => ({ shotId: b.shotId, count: b.count, rms_ms: ms(b.rms), chi2: b.chi2, max_abs_residual_ms: ms(b.maxAbs), mean_residual_ms: ms(b.mean) })),
  };
}

export function drawInversionMisfit(ctx: InversionContext): void {
  const { input } = ctx;
  sectionHeading(ctx, 'misfit');
  paragraph(ctx, 'Times computed on the final model of the inversion against the picks. A pattern in the heatmap (one shot late throughout, one geophone always early) points to a pick or geometry problem rather than to the ground.');
  drawMisfitBody(ctx, misfitStats(input.residuals, input.shots.length), input.residuals, input.shots);
}
