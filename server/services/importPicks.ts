import { dataSource } from '../db/dataSource';
import { PickSet, PickSetRevision } from '../entities';
import { HttpError } from '../http/errors';
import { formatPickError, parsePickText, type Pick } from '../../shared/picks';
import { pickQcOffThread } from '../threads/read-pool';
import { audit } from './audit';
import { RECIPROCAL_TOLERANCE_MS } from './pickSetReads';
import type { EntityManager } from 'typeorm';

export interface ImportedPickSet {
  id: string;
  shots: number;
  picks: number;
}

/** Invalid UTF-8 becomes U+FFFD, which the parser reports as a binary file. */
const decoder = new TextDecoder('utf-8', { fatal: false, ignoreBOM: false });

/**
 * Parses a pick file and stores it, its picks and revision 0 in one transaction.
 * A file with any error is refused whole (422 with line and column) and nothing is written.
 */
/** `link` runs inside the storing transaction with the new set's id (e.g. to link the records it was picked on). */
export async function importPicks(
  actorId: string, projectId: string, lineId: string, fileName: string, bytes: Buffer,
  link?: (em: EntityManager, pickSetId: string) => Promise<void>,
): Promise<ImportedPickSet> {
  const result = parsePickText(decoder.decode(bytes));
  if (!result.ok) {
    const first = result.errors[0];
    throw new HttpError(422, 'invalid_file', `The pick file was not stored: ${formatPickError(first)}${result.errors.length > 1 ? ` (and ${result.errors.length - 1} more problems)` : ''}.`, result.errors.map((e) => ({ line: e.line ?? undefined, column: e.column ?? undefined, message: e.message })));
  }
  const { picks, shots } = result;
  // Revision 0's quality checks, computed once here on a worker thread and stored (reads serve them as is).
  const qc = await pickQcOffThread({
    shotIds: picks.map((p) => p.shotId),
    sourceX: Float64Array.from(picks, (p) => p.sourceX),
    receiverX: Float64Array.from(picks, (p) => p.receiverX),
    time: Float64Array.from(picks, (p) => p.time),
    sigma: Float64Array.from(picks, (p) => p.sigma),
    excluded: new Uint8Array(picks.length),
    reciprocalToleranceS: RECIPROCAL_TOLERANCE_MS / 1000,
  });
  return dataSource.transaction(async (em) => {
    const set = await em.save(
      em.create(PickSet, { lineId, fileName, sizeBytes: bytes.length, original: bytes, shotCount: shots.length, pickCount: picks.length, createdBy: actorId }),
    );
    await insertPicks(em.query.bind(em), set.id, picks);
    await em.insert(PickSetRevision, { pickSetId: set.id, number: 0, exclusions: [], comment: 'as uploaded', createdBy: actorId });
    await em.query('INSERT INTO pick_set_qc (pick_set_id, revision, qc) VALUES ($1, 0, $2)', [set.id, JSON.stringify(qc)]);
    if (link) await link(em, set.id);
    await audit(em, { actorId, action: 'pickset.upload', objectType: 'pick_set', objectId: set.id, projectId, detail: { fileName, shots: shots.length, picks: picks.length } });
    return { id: set.id, shots: shots.length, picks: picks.length };
  });
}

type Query = (sql: string, params: unknown[]) => Promise<unknown>;

/** One INSERT … SELECT FROM unnest(arrays) per 20 000 picks: a 100 000-pick file is five statements. */
async function insertPicks(query: Query, pickSetId: string, picks: readonly Pick[]): Promise<void> {
  const CHUNK = 20_000;
  for (let start = 0; start < picks.length; start += CHUNK) {
    const part = picks.slice(start, start + CHUNK);
    await query(
      `INSERT INTO picks (pick_set_id, idx, file_line, shot_id, source_x, source_z, receiver_x, receiver_z, time_s, sigma_s)
       SELECT $1, * FROM unnest($2::int[], $3::int[], $4::text[], $5::float8[], $6::float8[], $7::float8[], $8::float8[], $9::float8[], $10::float8[])`,
      [
        pickSetId,
        part.map((_, i) => start + i),
        part.map((p) => p.line),
        part.map((p) => p.shotId),
        part.map((p) => p.sourceX),
        part.map((p) => p.sourceZ),
        part.map((p) => p.receiverX),
        part.map((p) => p.receiverZ),
        part.map((p) => p.time),
        part.map((p) => p.sigma),
      ],
    );
  }
}
