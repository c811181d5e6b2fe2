/** Section "Method statement and settings": how the section was found, with every setting, the start and the sources. */
import { nodeX, nodeZ } from '../../../shared/grid';
import { AUTO_SMOOTHING_FLOOR, AUTO_SMOOTHING_START } from '../../../shared/inversion';
import { bullets, labelValues, paragraph, sectionHeading, subheading } from '../flow';
import { count, fixed, isoDate, plain } from '../format';
import { schemeOrderText, sigmaText, SOFTWARE } from '../method';
import type { InversionContext } from './context';
import { stopReasonText, weight } from './convergence';
import type { InversionReportInput } from './types';

export const SOURCES = [
  'Aster, R. C., Borchers, B. and Thurber, C. H. (2018). Parameter Estimation and Inverse Problems, 3rd ed. Elsevier.',
  'Humphreys, E. and Clayton, R. W. (1988). Adaptation of back projection tomography to seismic travel time problems. Journal of Geophysical Research 93(B2), 1073–1085.',
  'Paige, C. C. and Saunders, M. A. (1982). LSQR: an algorithm for sparse linear equations and sparse least squares. ACM Transactions on Mathematical Software 8(1), 43–71.',
  'Rawlinson, N. and Sambridge, M. (2003). Seismic traveltime tomography of the crust and lithosphere. Advances in Geophysics 46, 81–198.',
  'Zelt, C. A. and Barton, P. J. (1998). Three-dimensional seismic refraction tomography: a comparison of two methods applied to data from the Faeroe Basin. Journal of Geophysical Research 103(B4), 7187–7210.',
];

export function startText(input: InversionReportInput): string {
  const st = input.inversion.start;
  if (st.kind === 'gradient') {
    return `automatic: one velocity law v = v0 + k·depth below the ground surface, fitted to all travel-time curves at once (t = (2/k)·asinh(k·x / 2v0)); v0 = ${plain(st.v0, 0)} m/s, k = ${plain(st.k, 2)} m/s per m, on a grid of ${plain(st.spacing, 3)} m spacing`;
  }
  return `saved model ${st.modelName.trim() ? `"${st.modelName.trim()}", ` : ''}version ${st.modelVersion} (its grid, ground surface and velocities)`;
}

export function smoothingText(input: InversionReportInput): string {
  const w = input.inversion.settings.smoothing;
  if (w !== null) return `fixed by the user at ${weight(w)} (relative to the data's sensitivity)`;
  return `automatic: ${AUTO_SMOOTHING_START} for the first step, halved after a step that leaves χ² per datum above 1.1 and did what its linearisation predicted, doubled after one that falls below 0.9 or failed, never below ${AUTO_SMOOTHING_FLOOR}`;
}

export function drawInversionMethod(ctx: InversionContext): void {
  const { input, grid } = ctx;
  const inv = input.inversion;
  const s = inv.settings;
  sectionHeading(ctx, 'method');
  paragraph(
    ctx,
    `The velocity section was found from the first-arrival picks by travel-time tomography with ${SOFTWARE}. The unknowns are the slowness (1/velocity) at every ground node of the grid; nodes above the ground surface are air and stay air. ` +
      'Each iteration computes the first-arrival time of every pick on the current model with the fast marching eikonal solver, traces each ray from its geophone back to the shot, and builds the ray-length sensitivity matrix: the change of each time with the slowness of each node is the length of that ray shared among the nodes it passes (Rawlinson & Sambridge 2003).',
  );
  paragraph(
    ctx,
    'The step to the next model minimises the misfit of the picks, each weighted by its uncertainty σ, plus a smoothness penalty on second differences of the slowness with separate horizontal and vertical weights, plus damping toward the starting model (Zelt & Barton 1998; Aster et al. 2018, the Gauss–Newton form of regularised least squares). ' +
      'Each linearised step is solved with LSQR (Paige & Saunders 1982) on the sparse matrix, and velocities are kept within the bounds. ' +
      'The smoothing weight follows an automatic schedule unless the user fixed it: it starts high and is lowered step by step while χ² per datum stays above 1.1, so the misfit falls through ever rougher models and the first model that fits the picks to their uncertainty is the smoothest one reached (the discrepancy principle; Aster et al. 2018).',
  );
  const last = inv.history[inv.history.length - 1];
  let ground = 0;
  for (const a of ctx.active) ground += a;
  const cb = inv.checkerboard;
  labelValues(ctx, [
    ['Software', SOFTWARE],
    ['Unknowns', `slowness at ${count(ground)} ground nodes`],
    ['Grid', `dx = ${plain(grid.dx, 3)} m, dz = ${plain(grid.dz, 3)} m; ${grid.nx} × ${grid.nz} nodes, x from ${plain(grid.x0, 2)} to ${plain(nodeX(grid, grid.nx - 1), 2)} m, elevation ${plain(nodeZ(grid, grid.nz - 1), 2)} to ${plain(grid.z0, 2)} m`],
    ['Starting model', startText(input)],
    ['Iterations', `${last.iteration} of at most ${s.maxIterations}; ${stopReasonText(input)}`],
    ['Smoothing weight', smoothingText(input)],
    ['Vertical weight', `${plain(s.verticalWeight, 3)} (vertical smoothing as a share of the horizontal; below 1 lets velocity change faster with depth than along the line)`],
    ['Damping', `${plain(s.damping, 4)} (toward the starting model, relative like the smoothing weight)`],
    ['Velocity bounds', `${plain(s.vMin, 0)} to ${plain(s.vMax, 0)} m/s`],
    ['Scheme order', schemeOrderText(s.order)],
    ['Pick uncertainty σ', sigmaText(input.residuals.map((r) => r.sigmaMs))],
    ['Coverage mask', `nodes crossed by less than ${plain(ctx.threshold, 2)} m of ray in total are greyed as not resolved`],
    ['Depth of investigation', 'per grid column, the lowest point reached by any ray of the final model'],
    ['Checkerboard test', cb ? `run: ±${plain(100 * cb.amplitude, 1)} % squares of ${plain(cb.size, 2)} m (${s.checkerSize === null ? 'size chosen automatically' : 'size set by the user'}), ${cb.correlation !== null && Number.isFinite(cb.correlation) ? `correlation ${fixed(cb.correlation, 2)}` : 'no correlation (flat recovered pattern)'}` : s.checkerboard ? 'requested, no result stored' : 'not run'],
    ['Pick set', `${inv.pickSetFile}, revision ${inv.pickSetRevision}`],
    ['Inversion', `${inv.id}${inv.label.trim() ? ` ("${inv.label.trim()}")` : ''}, ${isoDate(inv.createdAt)}`],
  ], { labelWidth: 125 });
  ctx.y += 4;
  subheading(ctx, 'Sources');
  bullets(ctx, SOURCES.map((text) => ({ text })));
}
