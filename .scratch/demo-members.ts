import { readFileSync } from 'node:fs';
import { gradientStart, invert, inversionShots, inProcessModeller } from '../shared/inversion';
import { rasteriseModel } from '../shared/model';
import { groupPicksByShot, placeShots } from '../shared/picks';
import { inversionSettingsInput } from '../shared/schemas/inversions';
import { gridForLine } from '../shared/inversion/grid-for-line';
import { surfaceRaster } from '../server/services/inversionInputs';
import { memberProblem } from '../shared/uncertainty/member';
import { chi2AgainstOriginal } from '../shared/uncertainty/perturb';
import { planMembers } from '../shared/uncertainty/plan';
import { readPicks } from '../scripts/lib/cli-inputs';
import { parseStationCsv } from '../shared/stations';

const picks = await readPicks('fixtures/demo/tq-l1.picks.csv');
const st = parseStationCsv(readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8'));
if (!st.ok) throw new Error('stations');
const line = gridForLine({ stations: st.stations, shotXs: [...new Set(picks.map((p) => p.sourceX))] });
const raster = surfaceRaster(line.grid, line.surface);
const placement = placeShots(raster, groupPicksByShot(picks));
if (!placement.ok) throw new Error('place');
const shots = inversionShots(placement.shots);
const settings = inversionSettingsInput.parse({});
const fit = gradientStart(raster.grid, raster.active, raster.surfaceZ, shots, settings);
const problem = { grid: raster.grid, active: raster.active, start: fit.velocity, shots, settings, surface: raster.surface, smoothingActsOn: 'model' as const };
let t = performance.now();
const base = await invert(problem, inProcessModeller(problem), {});
const last = base.history.at(-1)!;
console.log('base', base.stopReason, base.history.map((h) => `${h.chi2.toFixed(2)}@${h.smoothing?.toFixed(1)}`).join(' '), ((performance.now() - t) / 1000).toFixed(1), 's');
const finalSmoothing = Number(process.env.W ?? 6.3);
const picksMode = (process.argv[2] ?? 'sigma') as 'sigma';
for (const plan of planMembers(Number(process.argv[3] ?? 6), 5, { start: process.env.NOSTART ? false : true, smoothing: true, picks: picksMode })) {
  t = performance.now();
  const mp = memberProblem({ problem, surfaceZ: raster.surfaceZ, fit: { v0: fit.v0, k: fit.k }, finalSmoothing, baseChi2: last.chi2, ...(process.env.WARM ? { warmFrom: base.velocity } : {}) }, plan);
  if (process.env.ACCEPT) (mp as { acceptChi2?: number }).acceptChi2 = Number(process.env.ACCEPT);
  const r = await invert(mp, inProcessModeller(mp), {});
  console.log(plan.index, `v0×${plan.v0Factor.toFixed(2)} k×${plan.kFactor.toFixed(2)} w×${plan.smoothingFactor.toFixed(2)}`, r.stopReason, r.history.map((h) => `${h.chi2.toFixed(2)}`).join(' '), 'obs', chi2AgainstOriginal(shots, mp.shots, r.computed).toFixed(2), ((performance.now() - t) / 1000).toFixed(1), 's');
}
