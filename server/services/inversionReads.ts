import type { InversionSectionView, InversionView } from '../../shared/schemas/inversions';
import { dataSource } from '../db/dataSource';
import { unpackFloat32, unpackFloat64, unpackInt32 } from '../db/packed-arrays';
import { Inversion } from '../entities';
import { HttpError } from '../http/errors';
import { presentInversion, type IterationRow } from '../presenters/inversion';
import { presentResidualRow } from './runResults';
import { listStations } from './stations';

const ITERATION_COLUMNS = 'inversion_id, iteration, chi2, rms_ms, smoothing';

async function startVersions(ids: readonly string[]): Promise<Map<string, number>> {
  if (!ids.length) return new Map();
  const rows = await dataSource.query('SELECT id, version FROM velocity_models WHERE id = ANY($1::uuid[])', [ids]);
  return new Map(rows.map((r: { id: string; version: number }) => [r.id, r.version]));
}

export async function loadInversionView(id: string): Promise<InversionView> {
  const inversion = await dataSource.getRepository(Inversion).findOneByOrFail({ id });
  const iterations: IterationRow[] = await dataSource.query(`SELECT ${ITERATION_COLUMNS} FROM inversion_iterations WHERE inversion_id = $1 ORDER BY iteration`, [id]);
  const versions = await startVersions(inversion.startModelId ? [inversion.startModelId] : []);
  return presentInversion(inversion, iterations, versions.get(inversion.startModelId ?? '') ?? null);
}

/** The inversions of a line, newest first, each with its history so far. */
export async function listLineInversions(lineId: string): Promise<InversionView[]> {
  const inversions = await dataSource.getRepository(Inversion).find({ where: { lineId }, order: { createdAt: 'DESC' } });
  if (!inversions.length) return [];
  const ids = inversions.map((i) => i.id);
  const rows: (IterationRow & { inversion_id: string })[] = await dataSource.query(
    `SELECT ${ITERATION_COLUMNS} FROM inversion_iterations WHERE inversion_id = ANY($1::uuid[]) ORDER BY iteration`,
    [ids],
  );
  const byInversion = new Map<string, IterationRow[]>();
  for (const r of rows) byInversion.set(r.inversion_id, [...(byInversion.get(r.inversion_id) ?? []), r]);
  const versions = await startVersions(inversions.flatMap((i) => (i.startModelId ? [i.startModelId] : [])));
  return inversions.map((i) => presentInversion(i, byInversion.get(i.id) ?? [], versions.get(i.startModelId ?? '') ?? null));
}

const notDone = (status: string) => new HttpError(409, 'not_done', `The inversion is ${status}; its section exists once it is done.`);
const rounded = (digits: number) => {
  const f = 10 ** digits;
  return (v: number) => Math.round(v * f) / f;
};

/** The final model and its checks; node arrays null in the air (the stored velocity is NaN there). */
export async function loadInversionSection(id: string): Promise<InversionSectionView> {
  const inversion = await dataSource.getRepository(Inversion).findOneByOrFail({ id });
  if (inversion.status !== 'done') throw notDone(inversion.status);
  const [row] = await dataSource.query('SELECT * FROM inversion_results WHERE inversion_id = $1', [id]);
  if (!row) throw notDone('done but its result is missing');
  const velocity = unpackFloat32(row.velocity);
  const coverage = unpackFloat32(row.coverage);
  const hits = unpackInt32(row.hits);
  const doi = unpackFloat64(row.doi);
  const ground = (i: number) => Number.isFinite(velocity[i]);
  const perNode = (a: ArrayLike<number>, f: (v: number) => number) => Array.from(a, (v, i) => (ground(i) && Number.isFinite(v) ? f(v) : null));
  const { x0, dx, nx, z0, dz, nz } = inversion.grid;
  return {
    grid: { x0, dx, nx, z0, dz, nz },
    surface: inversion.surface,
    velocity: perNode(velocity, Math.round),
    coverage: perNode(coverage, rounded(2)),
    hits: perNode(hits, (v) => v),
    doi: Array.from(doi, (v) => (Number.isFinite(v) ? rounded(3)(v) : null)),
    checkerboard: row.checkerboard && row.checker_true && row.checker_recovered
      ? {
        ...row.checkerboard,
        truePattern: perNode(unpackFloat32(row.checker_true), rounded(4)),
        recovered: perNode(unpackFloat32(row.checker_recovered), rounded(4)),
      }
      : null,
    shots: row.shots,
    // The view names stations as text (the station table numbers them).
    stations: (await listStations(inversion.lineId)).map((s) => ({ station: String(s.station), x: s.x, z: s.z })),
  };
}

/** One row per pick against the final model, the shape of a run's residual rows. */
export async function loadInversionResiduals(id: string) {
  const rows = await dataSource.query(
    `SELECT pick_index, shot_id, receiver_x, receiver_z, observed_s, computed_s, residual_s, normalised, sigma_s, excluded
     FROM inversion_residuals WHERE inversion_id = $1 ORDER BY shot_id, receiver_x, pick_index`,
    [id],
  );
  return rows.map(presentResidualRow);
}
