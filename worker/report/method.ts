/** Section "Method statement": how the numbers were made, enough to reproduce them. */
import { nodeX, nodeZ } from '../../shared/grid';
import type { ReportContext } from './context';
import { labelValues, paragraph, sectionHeading } from './flow';
import { count, isoDate, plain } from './format';

export const SOFTWARE = 'Timefield';

export function schemeOrderText(order: 1 | 2): string {
  return order === 2
    ? 'second order (mixed: one-sided second-order differences where two accepted upwind nodes lie in one smooth medium, first order elsewhere)'
    : 'first order (upwind differences)';
}

/** Pick uncertainty as used for χ²: one value, or the range and median. */
export function sigmaText(sigmasMs: number[]): string {
  if (sigmasMs.length === 0) return 'no picks';
  const s = [...sigmasMs].sort((a, b) => a - b);
  if (s[0] === s[s.length - 1]) return `${plain(s[0], 3)} ms for every pick (from the pick file)`;
  return `${plain(s[0], 3)} to ${plain(s[s.length - 1], 3)} ms per pick, median ${plain(s[s.length >> 1], 3)} ms (from the pick file)`;
}

export function gridText(ctx: ReportContext): string {
  const g = ctx.model.grid;
  return `dx = ${plain(g.dx, 3)} m, dz = ${plain(g.dz, 3)} m; ${g.nx} × ${g.nz} nodes (${count(g.nx * g.nz)}), x from ${plain(g.x0, 2)} to ${plain(nodeX(g, g.nx - 1), 2)} m, elevation ${plain(nodeZ(g, g.nz - 1), 2)} to ${plain(g.z0, 2)} m`;
}

export function drawMethod(ctx: ReportContext): void {
  const { input } = ctx;
  const run = input.run;
  sectionHeading(ctx, 'method');
  paragraph(
    ctx,
    `Travel times were computed with ${SOFTWARE} by a fast marching eikonal solver: the first-arrival time T satisfies the eikonal equation |grad T| = 1/v on the grid of the velocity model, and grid nodes are accepted in order of increasing time, each one updating its neighbours from the upwind side. ` +
      'This is a forward model: the velocities are those of the model below, set by the geophysicist; they were not adjusted to fit the picks (no inversion).',
  );
  labelValues(ctx, [
    ['Software', SOFTWARE],
    ['Solver', 'fast marching eikonal solver on a regular grid'],
    ['Scheme order', schemeOrderText(run.order)],
    ['Grid spacing and size', gridText(ctx)],
    ['Ground nodes', `${count(run.stats.active_nodes)} (nodes above the ground surface are air and carry no time)`],
    ['Source treatment', 'sources anywhere in the ground, not only on nodes: the corners of the source cell start with straight-ray times, and the march solves for the time factored by the distance from the source, which removes the point-source singularity'],
    ['Interfaces', interfacesText(ctx)],
    ['Receiver times', 'interpolated from the node times at each geophone: cubic convolution inside the ground, bilinear next to air, first-order Taylor extrapolation from the ground nodes for geophones on the surface'],
    ['Rays', 'traced back from each geophone to the shot down the gradient of the travel-time field'],
    ['Pick uncertainty σ', `${sigmaText(input.residuals.map((r) => r.sigmaMs))}; used for χ² per datum`],
    ['Velocity model', `"${input.model.name}", version ${input.model.version}${input.model.comment.trim() ? ` (${input.model.comment.trim()})` : ''}`],
    ['Pick set', `${run.pickSetFile}, revision ${run.pickSetRevision}`],
    ['Run', `${run.id}, ${isoDate(run.createdAt)}; ${count(run.stats.shots)} shots solved in ${plain(run.stats.solve_seconds, 2)} s`],
  ], { labelWidth: 125 });
}

/** How the solver saw the model's interfaces: layered models carry sub-cell positions, raw grids only node values. */
function interfacesText(ctx: ReportContext): string {
  const headWave = 'a cell across a strong velocity contrast lets the wave travel along its edge at the faster velocity, the path of a head wave';
  if (ctx.model.cellSlowness) {
    return `velocities are sampled at the nodes (rows ${plain(ctx.model.grid.dz, 3)} m apart); each cell a layer interface crosses takes a slowness sampled inside the cell, so the interface acts where it is drawn, also between node rows; ${headWave}`;
  }
  return `velocities are sampled at the nodes, so an interface is resolved to the row spacing (${plain(ctx.model.grid.dz, 3)} m); ${headWave}`;
}
