import { dataSource } from '../db/dataSource';
import { PickSetRevision, type Exclusion } from '../entities/PickSetRevision';
import { HttpError } from '../http/errors';
import type { ExclusionsBody, RetirePickSetBody } from '../../shared/schemas/pickSets';
import { audit } from './audit';

export interface StoredPick {
  index: number;
  line: number;
  shotId: string;
  sourceX: number;
  sourceZ: number | null;
  receiverX: number;
  receiverZ: number | null;
  /** s */
  time: number;
  /** s */
  sigma: number;
}

export interface PickSetHead {
  id: string;
  lineId: string;
  fileName: string;
  sizeBytes: number;
  createdAt: Date;
  createdBy: { id: string; name: string } | null;
  shotCount: number;
  pickCount: number;
}

export interface RevisionRow {
  number: number;
  createdAt: Date;
  createdBy: { id: string; name: string } | null;
  comment: string;
  exclusions: Exclusion[];
}

const person = (id: string | null, name: string | null) => (id && name ? { id, name } : null);

export async function getPickSetHead(id: string): Promise<PickSetHead> {
  const [row] = await dataSource.query(
    `SELECT s.id, s.line_id, s.file_name, s.size_bytes, s.created_at, s.created_by, u.name AS created_by_name, s.shot_count, s.pick_count
     FROM pick_sets s LEFT JOIN users u ON u.id = s.created_by WHERE s.id = $1`,
    [id],
  );
  if (!row) throw new HttpError(404, 'not_found', 'Not found.');
  return {
    id: row.id, lineId: row.line_id, fileName: row.file_name, sizeBytes: row.size_bytes, createdAt: row.created_at,
    createdBy: person(row.created_by, row.created_by_name), shotCount: row.shot_count, pickCount: row.pick_count,
  };
}

export async function listRevisions(pickSetId: string): Promise<RevisionRow[]> {
  const rows = await dataSource.query(
    `SELECT r.number, r.created_at, r.created_by, u.name AS created_by_name, r.comment, r.exclusions
     FROM pick_set_revisions r LEFT JOIN users u ON u.id = r.created_by WHERE r.pick_set_id = $1 ORDER BY r.number`,
    [pickSetId],
  );
  return rows.map((r: Record<string, never>) => ({
    number: r.number, createdAt: r.created_at, createdBy: person(r.created_by, r.created_by_name), comment: r.comment, exclusions: r.exclusions,
  }));
}

export async function loadPicks(pickSetId: string): Promise<StoredPick[]> {
  const rows = await dataSource.query(
    `SELECT idx, file_line, shot_id, source_x, source_z, receiver_x, receiver_z, time_s, sigma_s FROM picks WHERE pick_set_id = $1 ORDER BY idx`,
    [pickSetId],
  );
  return rows.map((r: Record<string, never>) => ({
    index: r.idx, line: r.file_line, shotId: r.shot_id, sourceX: r.source_x, sourceZ: r.source_z,
    receiverX: r.receiver_x, receiverZ: r.receiver_z, time: r.time_s, sigma: r.sigma_s,
  }));
}

export async function loadOriginal(pickSetId: string): Promise<Buffer> {
  const [row] = await dataSource.query('SELECT original FROM pick_sets WHERE id = $1', [pickSetId]);
  if (!row) throw new HttpError(404, 'not_found', 'Not found.');
  return row.original;
}

/** A new revision whose exclusions are exactly the given list; earlier revisions stay as they were. */
export async function addRevision(actorId: string, projectId: string, pickSetId: string, body: ExclusionsBody): Promise<{ number: number }> {
  return dataSource.transaction(async (em) => {
    // Serialise concurrent revisions of one pick set.
    await em.query('SELECT id FROM pick_sets WHERE id = $1 FOR UPDATE', [pickSetId]);
    const [{ count }] = await em.query('SELECT count(*)::int AS count FROM picks WHERE pick_set_id = $1', [pickSetId]);
    const outside = body.exclusions.findIndex((e) => e.index >= count);
    if (outside >= 0) {
      throw new HttpError(422, 'validation_failed', `exclusions[${outside}].index: this pick set has picks 0 to ${count - 1}`, [
        { path: `exclusions[${outside}].index`, message: `must be below ${count}` },
      ]);
    }
    const [{ next }] = await em.query('SELECT coalesce(max(number), -1) + 1 AS next FROM pick_set_revisions WHERE pick_set_id = $1', [pickSetId]);
    await em.insert(PickSetRevision, { pickSetId, number: next, exclusions: body.exclusions, comment: body.comment, createdBy: actorId });
    await audit(em, { actorId, action: 'pickset.revise', objectType: 'pick_set', objectId: pickSetId, projectId, detail: { revision: next, excluded: body.exclusions.length } });
    return { number: next };
  });
}

/**
 * Retire a pick set (it leaves the choices for new runs, inversions and checks; runs, inversions and
 * reports that used it keep it), or bring it back. Both are audited; retiring twice is a 409.
 */
export async function setPickSetRetired(actorId: string, projectId: string, pickSetId: string, retire: RetirePickSetBody | null): Promise<void> {
  await dataSource.transaction(async (em) => {
    const [row] = await em.query('SELECT retired_at FROM pick_sets WHERE id = $1 FOR UPDATE', [pickSetId]);
    if (retire && row.retired_at) throw new HttpError(409, 'already_retired', 'This pick set is already retired.');
    if (!retire && !row.retired_at) throw new HttpError(409, 'not_retired', 'This pick set is in use, not retired.');
    await em.query('UPDATE pick_sets SET retired_at = $2, retired_by = $3, retire_reason = $4 WHERE id = $1', [
      pickSetId, retire ? new Date() : null, retire ? actorId : null, retire?.reason ?? null,
    ]);
    await audit(em, { actorId, action: retire ? 'pickset.retire' : 'pickset.reinstate', objectType: 'pick_set', objectId: pickSetId, projectId, detail: retire ? { reason: retire.reason } : {} });
  });
}

/** Refuses new work on a retired pick set, with the path of the field that chose it. */
export async function refuseRetired(pickSetId: string): Promise<void> {
  const [row] = await dataSource.query('SELECT retired_at, retire_reason FROM pick_sets WHERE id = $1', [pickSetId]);
  if (row?.retired_at) {
    const message = `this pick set is retired (${row.retire_reason}); reinstate it on the Pick sets tab to use it again`;
    throw new HttpError(422, 'validation_failed', `pickSetId: ${message}`, [{ path: 'pickSetId', message }]);
  }
}
