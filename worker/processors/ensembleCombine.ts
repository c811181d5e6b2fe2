/**
 * Combines an ensemble once no member is queued or running: the member that finishes last (or the
 * reconciler, for a member whose job was lost) takes the ensemble's row lock, so exactly one combine
 * writes the result. Too few members that fit the picks fail the ensemble with the count.
 */
import type { Grid } from '../../shared/grid';
import { EnsembleAccumulator, memberChi2Limit } from '../../shared/uncertainty/combine';
import { memberRockVelocity, type MemberPlan } from '../../shared/uncertainty/plan';
import { evalPolyline } from '../../shared/model/polyline';
import { dataSource } from '../../server/db/dataSource';
import { pack, unpackFloat32, unpackFloat64 } from '../../server/db/packed-arrays';
import { listStations } from '../../server/services/stations';

interface MemberRow {
  plan: MemberPlan;
  chi2: number | null;
  velocity: Buffer;
  coverage: Buffer;
  doi: Buffer;
}

export async function combineWhenComplete(ensembleId: string): Promise<void> {
  await dataSource.transaction(async (em) => {
    const [ensemble] = await em.query(
      `SELECT e.id, e.status, e.members, e.rock_velocity_min, e.rock_velocity_max, e.coverage_threshold, e.started_at, i.grid, i.surface, i.line_id,
              (i.stats->>'chi2')::float8 AS base_chi2
       FROM ensembles e JOIN inversions i ON i.id = e.inversion_id WHERE e.id = $1 FOR UPDATE OF e`,
      [ensembleId],
    );
    if (!ensemble || ensemble.status !== 'running') return;
    const [{ open }] = await em.query(`SELECT count(*)::int AS open FROM ensemble_members WHERE ensemble_id = $1 AND status IN ('queued', 'running')`, [ensembleId]);
    if (open > 0) return;
    const grid: Grid = ensemble.grid;
    const surface: [number, number][] = ensemble.surface ?? [[grid.x0, grid.z0], [grid.x0 + (grid.nx - 1) * grid.dx, grid.z0]];
    const stations = await listStations(ensemble.line_id);
    const maxChi2 = memberChi2Limit(ensemble.base_chi2);
    const acc = new EnsembleAccumulator(grid, surface, { maxChi2, threshold: ensemble.coverage_threshold, rockVelocity: ensemble.rock_velocity_min, stationXs: stations.map((s) => s.x) });
    // One member's arrays at a time: the worker never holds the whole ensemble.
    const done: { index: number; seconds: number }[] = await em.query(`SELECT index, seconds FROM ensemble_members WHERE ensemble_id = $1 AND status = 'done' ORDER BY index`, [ensembleId]);
    for (const { index } of done) {
      const [r]: MemberRow[] = await em.query('SELECT plan, chi2, velocity, coverage, doi FROM ensemble_members WHERE ensemble_id = $1 AND index = $2', [ensembleId, index]);
      acc.add({
        velocity: unpackFloat32(r.velocity),
        coverage: unpackFloat32(r.coverage),
        doi: unpackFloat64(r.doi),
        chi2: r.chi2 ?? Number.NaN,
        rockVelocity: memberRockVelocity(r.plan.seed, ensemble.rock_velocity_min, ensemble.rock_velocity_max),
      });
    }
    const summary = acc.finish();
    const failed = ensemble.members - done.length;
    const seconds = done.map((r) => r.seconds).sort((a, b) => a - b);
    const stats = {
      used: summary.used,
      excluded: summary.excluded,
      failed,
      maxChi2,
      baseChi2: ensemble.base_chi2,
      seconds: (Date.now() - new Date(ensemble.started_at).getTime()) / 1000,
      medianMemberSeconds: seconds.length ? seconds[Math.floor((seconds.length - 1) / 2)] : null,
    };
    if (summary.used < 2) {
      const why = `Only ${summary.used} of ${ensemble.members} members fitted the picks (χ² ≤ ${+maxChi2.toFixed(3)}; ${summary.excluded} fitted worse, ${failed} failed), too few for a spread. Check the picks' sigmas and the base inversion's fit.`;
      await em.query(`UPDATE ensembles SET status = 'failed', error = $2, stats = $3, finished_at = now() WHERE id = $1`, [ensembleId, why, JSON.stringify(stats)]);
      return;
    }
    const bands = summary.bands.map((b, i) => ({ ...b, station: String(stations[i].station), groundZ: evalPolyline(surface, b.x) }));
    await em.query(
      `INSERT INTO ensemble_results (ensemble_id, used, excluded, covering, mean, std, probability, bands) VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
      [ensembleId, summary.used, summary.excluded, pack(Int32Array.from(summary.covering)), pack(summary.mean), pack(summary.std), pack(summary.probabilityFaster), JSON.stringify(bands)],
    );
    await em.query(`UPDATE ensembles SET status = 'done', stats = $2, finished_at = now() WHERE id = $1`, [ensembleId, JSON.stringify(stats)]);
  });
}
