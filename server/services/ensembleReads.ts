import type { EnsembleMemberView, EnsembleSectionView, EnsembleStatus, EnsembleView } from '../../shared/schemas/ensembles';
import { memberRockVelocity, type MemberPlan } from '../../shared/uncertainty/plan';
import { dataSource } from '../db/dataSource';
import { unpackFloat32, unpackInt32 } from '../db/packed-arrays';
import { HttpError } from '../http/errors';
import { listStations } from './stations';

const ENSEMBLE_COLUMNS = `id, inversion_id, line_id, label, status, members, seed, variation, rock_velocity_min, rock_velocity_max,
  coverage_threshold, stats, error, created_at, started_at, finished_at`;

interface EnsembleRow {
  id: string; inversion_id: string; line_id: string; label: string; status: EnsembleStatus; members: number; seed: string;
  variation: EnsembleView['vary']; rock_velocity_min: number; rock_velocity_max: number; coverage_threshold: number;
  stats: EnsembleView['stats']; error: string | null; created_at: Date; started_at: Date | null; finished_at: Date | null;
}

/** v to `digits` decimals, for the views' JSON. */
const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;

interface MemberCountRow { ensemble_id: string; worker: string | null; status: EnsembleStatus; count: number; seconds: number }

function present(e: EnsembleRow, counts: readonly MemberCountRow[]): EnsembleView {
  const progress = { queued: 0, running: 0, done: 0, failed: 0, cancelled: 0 };
  const workers = new Map<string, EnsembleView['workers'][number]>();
  for (const c of counts) {
    progress[c.status] += c.count;
    if (!c.worker || c.status === 'queued' || c.status === 'cancelled') continue;
    const w = workers.get(c.worker) ?? { worker: c.worker, done: 0, running: 0, failed: 0, seconds: 0 };
    w[c.status] += c.count;
    w.seconds += c.seconds;
    workers.set(c.worker, w);
  }
  return {
    id: e.id,
    inversionId: e.inversion_id,
    lineId: e.line_id,
    label: e.label,
    status: e.status,
    members: e.members,
    seed: Number(e.seed),
    vary: e.variation,
    rockVelocity: { min: e.rock_velocity_min, max: e.rock_velocity_max },
    coverageThreshold: e.coverage_threshold,
    progress,
    workers: [...workers.values()].map((w) => ({ ...w, seconds: round(w.seconds, 1) })).sort((a, b) => a.worker.localeCompare(b.worker)),
    stats: e.stats,
    ...(e.error ? { error: e.error } : {}),
    createdAt: e.created_at.toISOString(),
    startedAt: e.started_at?.toISOString() ?? null,
    finishedAt: e.finished_at?.toISOString() ?? null,
  };
}

async function memberCounts(ids: readonly string[]): Promise<MemberCountRow[]> {
  return dataSource.query(
    `SELECT ensemble_id, worker, status, count(*)::int AS count, coalesce(sum(seconds), 0)::float8 AS seconds
     FROM ensemble_members WHERE ensemble_id = ANY($1::uuid[]) GROUP BY ensemble_id, worker, status`,
    [ids],
  );
}

export async function loadEnsembleView(id: string): Promise<EnsembleView> {
  const [row] = await dataSource.query(`SELECT ${ENSEMBLE_COLUMNS} FROM ensembles WHERE id = $1`, [id]);
  if (!row) throw new HttpError(404, 'not_found', 'Not found.');
  return present(row, await memberCounts([id]));
}

/** The ensembles of an inversion, newest first. */
export async function listInversionEnsembles(inversionId: string): Promise<EnsembleView[]> {
  const rows: EnsembleRow[] = await dataSource.query(`SELECT ${ENSEMBLE_COLUMNS} FROM ensembles WHERE inversion_id = $1 ORDER BY created_at DESC`, [inversionId]);
  const counts = await memberCounts(rows.map((r) => r.id));
  return rows.map((r) => present(r, counts.filter((c) => c.ensemble_id === r.id)));
}

/** Every member's state, draws and fit, in order. */
export async function listEnsembleMembers(id: string): Promise<EnsembleMemberView[]> {
  const [e] = await dataSource.query('SELECT rock_velocity_min, rock_velocity_max FROM ensembles WHERE id = $1', [id]);
  if (!e) throw new HttpError(404, 'not_found', 'Not found.');
  const rows: { index: number; status: EnsembleStatus; worker: string | null; attempts: number; chi2: number | null; iterations: number | null; seconds: number | null; plan: MemberPlan; error: string | null }[] =
    await dataSource.query('SELECT index, status, worker, attempts, chi2, iterations, seconds, plan, error FROM ensemble_members WHERE ensemble_id = $1 ORDER BY index', [id]);
  return rows.map((r) => ({
    index: r.index,
    status: r.status,
    worker: r.worker,
    attempts: r.attempts,
    chi2: r.chi2 === null ? null : round(r.chi2, 3),
    iterations: r.iterations,
    seconds: r.seconds === null ? null : round(r.seconds, 2),
    plan: {
      v0Factor: round(r.plan.v0Factor, 4),
      kFactor: round(r.plan.kFactor, 4),
      smoothingFactor: round(r.plan.smoothingFactor, 4),
      picks: r.plan.picks,
      rockVelocity: Math.round(memberRockVelocity(r.plan.seed, e.rock_velocity_min, e.rock_velocity_max)),
    },
    ...(r.error ? { error: r.error } : {}),
  }));
}

/** The combined result; node arrays null where too few members cover the node. */
export async function loadEnsembleSection(id: string): Promise<EnsembleSectionView> {
  const [e] = await dataSource.query(
    `SELECT e.status, e.line_id, e.rock_velocity_min, e.rock_velocity_max, i.grid, i.surface FROM ensembles e JOIN inversions i ON i.id = e.inversion_id WHERE e.id = $1`,
    [id],
  );
  if (!e) throw new HttpError(404, 'not_found', 'Not found.');
  const notDone = (status: string) => new HttpError(409, 'not_done', `The ensemble is ${status}; its combined section exists once it is done.`);
  if (e.status !== 'done') throw notDone(e.status);
  const [r] = await dataSource.query('SELECT * FROM ensemble_results WHERE ensemble_id = $1', [id]);
  if (!r) throw notDone('done but its result is missing');
  const covering = unpackInt32(r.covering);
  const node = (a: Float32Array, f: (v: number) => number) => Array.from(a, (v) => (Number.isFinite(v) ? f(v) : null));
  const { x0, dx, nx, z0, dz, nz } = e.grid;
  return {
    grid: { x0, dx, nx, z0, dz, nz },
    surface: e.surface,
    used: r.used,
    excluded: r.excluded,
    rockVelocity: { min: e.rock_velocity_min, max: e.rock_velocity_max },
    covering: Array.from(covering),
    mean: node(unpackFloat32(r.mean), Math.round),
    std: node(unpackFloat32(r.std), Math.round),
    probability: node(unpackFloat32(r.probability), (v) => round(v, 2)),
    bands: (r.bands as EnsembleSectionView['bands']).map((b) => ({
      ...b,
      median: b.median === null ? null : round(b.median, 2),
      p5: b.p5 === null ? null : round(b.p5, 2),
      p95: b.p95 === null ? null : round(b.p95, 2),
      groundZ: round(b.groundZ, 3),
    })),
    stations: (await listStations(e.line_id)).map((s) => ({ station: String(s.station), x: s.x, z: s.z })),
  };
}
